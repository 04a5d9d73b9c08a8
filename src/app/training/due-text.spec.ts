import { fromLocalInput, localTimeText, localZoneText, toLocalInput } from './due-text';
import { withUnit } from './unit-text';

describe('localTimeText', () => {
  it('should show a due time on the reader\'s clock, with the day a lead in Chicago picked', () => {
    // 05:00 UTC on Fri 4 Dec 2026 is 23:00 on Thu 3 Dec in Chicago (CST = UTC−6; derived).
    expect(localTimeText('2026-12-04T05:00:00.000Z', { timeZone: 'America/Chicago', locale: 'en-US' })).toBe('Thu, Dec 3, 2026, 11:00 PM CST');
    expect(localTimeText('2026-12-04T05:00:00.000Z', { timeZone: 'UTC', locale: 'en-US' })).toBe('Fri, Dec 4, 2026, 5:00 AM UTC');
    // Short, for a table that names the zone once.
    expect(localTimeText('2026-12-04T05:00:00.000Z', { timeZone: 'America/Chicago', locale: 'en-US', short: true })).toBe('Thu, Dec 3, 11:00 PM');
    expect(localZoneText('2026-12-04T05:00:00.000Z', { timeZone: 'America/Chicago', locale: 'en-US' })).toBe('CST');
  });

  it('should leave text that is no time as it is', () => {
    expect(localTimeText('soon')).toBe('soon');
  });
});

describe('datetime-local values', () => {
  it('should go from the browser clock to the ISO time the API takes and back', () => {
    const iso = fromLocalInput('2026-12-03T23:00');
    expect(iso).toMatch(/^2026-12-0[34]T\d\d:00:00\.000Z$/);
    expect(toLocalInput(iso)).toBe('2026-12-03T23:00');
    // An empty or broken value goes to the server as typed, which says "Pick a due date and time."
    expect(fromLocalInput('')).toBe('');
    expect(fromLocalInput('202604-12-03T23:00')).toBe('202604-12-03T23:00');
  });
});

describe('withUnit', () => {
  it('should add a unit once: degrees closed up, others after a space', () => {
    expect(withUnit('35°', '°')).toBe('35°');
    expect(withUnit('34.9920° (34°59\'31")', '°')).toBe('34.9920° (34°59\'31")');
    expect(withUnit('34.99', '°')).toBe('34.99°');
    expect(withUnit('0.2993', 'in')).toBe('0.2993 in');
    expect(withUnit('±0.0005', 'in')).toBe('±0.0005 in');
    expect(withUnit('1', 'blocks')).toBe('1 block');
    expect(withUnit('3.4142136', '')).toBe('3.4142136');
  });
});
