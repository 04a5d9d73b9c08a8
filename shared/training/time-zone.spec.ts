import { canonicalTimeZone, isTimeZone, timeInZoneText } from './time-zone';

describe('time zones for due dates', () => {
  it('should write a due time on the lead\'s clock with the zone named', () => {
    // 05:00 UTC on Fri 4 Dec 2026 is 23:00 on Thu 3 Dec in Chicago (CST = UTC−6) and 06:00 in Berlin (CET = UTC+1); derived.
    const due = new Date('2026-12-04T05:00:00Z');
    expect(timeInZoneText(due, 'America/Chicago')).toBe('Thu 3 Dec 2026, 23:00 (America/Chicago)');
    expect(timeInZoneText(due, 'Europe/Berlin')).toBe('Fri 4 Dec 2026, 06:00 (Europe/Berlin)');
    expect(timeInZoneText(due, 'UTC')).toBe('Fri 4 Dec 2026, 05:00 (UTC)');
    // Summer time: 17:30 UTC on 1 Jul 2026 is 12:30 CDT (UTC−5); derived.
    expect(timeInZoneText(new Date('2026-07-01T17:30:00Z'), 'America/Chicago')).toBe('Wed 1 Jul 2026, 12:30 (America/Chicago)');
  });

  it('should know the zones Intl knows, in its spelling, and nothing else', () => {
    expect(canonicalTimeZone('America/Chicago')).toBe('America/Chicago');
    expect(canonicalTimeZone('america/chicago')).toBe('America/Chicago');
    expect(canonicalTimeZone(' UTC ')).toBe('UTC');
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isTimeZone('')).toBe(false);
    expect(isTimeZone('A'.repeat(65))).toBe(false);
    // An unknown zone is written as UTC rather than failing the e-mail.
    expect(timeInZoneText(new Date('2026-12-04T05:00:00Z'), 'Mars/Olympus_Mons')).toBe('Fri 4 Dec 2026, 05:00 (UTC)');
  });
});
