/**
 * A stored time (ISO, UTC) as the reader's own clock shows it: "Thu, Dec 3, 2026, 11:00 PM CST" for
 * a browser in Chicago. The lead picks the due time on their clock; each reader sees that moment on
 * theirs, with the zone named so nobody mistakes it for another day (`short`: no year and no zone,
 * for a table that names the zone once). `timeZone` and `locale` are the browser's unless given (tests give them).
 */
export function localTimeText(iso: string, options: { timeZone?: string; locale?: string; short?: boolean } = {}): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return new Intl.DateTimeFormat(options.locale, {
    weekday: 'short',
    year: options.short ? undefined : 'numeric',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZoneName: options.short ? undefined : 'short',
    timeZone: options.timeZone,
  }).format(date);
}

/** The reader's time zone as a short name ("CST"), for a table whose times leave it out. */
export function localZoneText(iso: string, options: { timeZone?: string; locale?: string } = {}): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  const parts = new Intl.DateTimeFormat(options.locale, { timeZoneName: 'short', timeZone: options.timeZone }).formatToParts(date);
  return parts.find((p) => p.type === 'timeZoneName')?.value ?? '';
}

/** The browser's IANA time zone ("America/Chicago"), sent with a due date so the e-mail names it; UTC when unknown. */
export function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

/** A stored time as a datetime-local value on the browser's clock ("2026-12-03T23:00"), to edit it. */
export function toLocalInput(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A datetime-local value (the browser's clock) as the ISO time the API takes; the text as typed when it is no date, for the server to refuse. */
export function fromLocalInput(value: string): string {
  const d = new Date(value);
  return value.trim() && !Number.isNaN(d.getTime()) ? d.toISOString() : value;
}
