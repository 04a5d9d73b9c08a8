/**
 * Time zones for due dates: the lead's browser names its IANA zone ("America/Chicago") with a due
 * date, the server checks it against the Intl database it runs with, and the e-mail writes the
 * due time on that clock with the zone named, so nobody reads a UTC time as a different day.
 */

/**
 * The zone name as given, in Intl's spelling when only the letter case differs ("america/chicago" →
 * "America/Chicago"); null when Intl knows no such zone. A link name stays as given ("EST" is not
 * turned into the zone Intl files it under).
 */
export function canonicalTimeZone(name: string): string | null {
  const given = name.trim();
  if (!given || given.length > 64) return null;
  try {
    const resolved = new Intl.DateTimeFormat('en-US', { timeZone: given }).resolvedOptions().timeZone;
    return resolved.toLowerCase() === given.toLowerCase() ? resolved : given;
  } catch {
    return null;
  }
}

/** Whether Intl knows a time zone of this name. */
export function isTimeZone(name: string): boolean {
  return canonicalTimeZone(name) !== null;
}

/** A moment on the clock of `timeZone`, with the zone named: "Thu 3 Dec 2026, 23:00 (America/Chicago)". */
export function timeInZoneText(date: Date, timeZone: string): string {
  const zone = canonicalTimeZone(timeZone) ?? 'UTC';
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone: zone,
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(date);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('weekday')} ${part('day')} ${part('month')} ${part('year')}, ${part('hour')}:${part('minute')} (${zone})`;
}
