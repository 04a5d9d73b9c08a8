import fc from 'fast-check';
import { Dec } from '../calc/decimal-math';
import { formatDegrees, formatDms, parseAngle, toDms } from './angle-text';

const degrees = (text: unknown) => {
  const r = parseAngle(text);
  if (!r.ok) throw new Error(r.error);
  return r.degrees.toSignificantDigits(30).toString();
};

describe('parseAngle', () => {
  it('should read decimal degrees', () => {
    expect(degrees('7.5')).toBe('7.5');
    expect(degrees(7.5)).toBe('7.5');
    expect(degrees('7.5°')).toBe('7.5');
    expect(degrees('.5')).toBe('0.5');
  });

  it('should read degrees-minutes-seconds in the usual spellings', () => {
    for (const text of ["7°30'", '7°30', '7 30', '7d30m', '7:30', '7 deg 30 min', '7° 30′']) expect(degrees(text)).toBe('7.5');
    for (const text of ['14°30\'15"', "14°30'15''", '14 30 15', '14:30:15', '14d30m15s', '14° 30′ 15″']) {
      expect(degrees(text)).toBe(new Dec(14).plus(new Dec(30).div(60)).plus(new Dec(15).div(3600)).toSignificantDigits(30).toString());
    }
  });

  it('should read minutes or seconds alone', () => {
    expect(degrees("30'")).toBe('0.5');
    expect(degrees('36"')).toBe('0.01');
  });

  it('should read a sign', () => {
    expect(degrees("-7°30'")).toBe('-7.5');
    expect(degrees('+7.5')).toBe('7.5');
    expect(degrees('−2')).toBe('-2');
  });

  it('should refuse text that is not an angle, naming the problem', () => {
    for (const bad of ['', 'abc', '7 30 15 4', '7.5 30', "30' 7°", '1e5', '--3', "7°30'x", null, {}, [], true, Number.NaN, Infinity]) {
      const r = parseAngle(bad);
      expect(r.ok).toBe(false);
    }
    const r = parseAngle("7°60'");
    expect(r.ok || r.error).toMatch(/minutes must be below 60/);
  });

  it('should never throw, whatever it is given (property)', () => {
    fc.assert(fc.property(fc.anything(), (x) => void parseAngle(x)));
    fc.assert(fc.property(fc.string(), (x) => void parseAngle(x)));
  });
});

describe('formatDms', () => {
  it('should format to the nearest second with two-digit minutes and seconds', () => {
    expect(formatDms(new Dec('7.5'))).toBe('7°30\'00"');
    // REFERENCE.md §1: 3.5763° = 3°34'35" (derived).
    expect(formatDms(new Dec('3.57633437'))).toBe('3°34\'35"');
  });

  it('should carry 59.5" into the next minute and degree', () => {
    expect(formatDms(new Dec('59.99999'))).toBe('60°00\'00"');
  });

  it('should print fractional seconds on request and drop the sign of zero', () => {
    expect(formatDms(new Dec('28.6336'), 1)).toBe('28°38\'01.0"');
    expect(formatDms(new Dec('-0.0000001'))).toBe('0°00\'00"');
    expect(formatDms(new Dec('-7.5'))).toBe('-7°30\'00"');
  });

  it('should round-trip through parseAngle to the nearest second (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 359 * 3600 }), (seconds) => {
        const deg = new Dec(seconds).div(3600);
        const back = parseAngle(formatDms(deg));
        expect(back.ok && back.degrees.mul(3600).toDecimalPlaces(6).toNumber()).toBe(seconds);
      }),
    );
  });
});

describe('toDms and formatDegrees', () => {
  it('should split into parts', () => {
    const p = toDms(new Dec('14.50416666666666666667'));
    expect([p.degrees, p.minutes, p.seconds.toNumber(), p.sign]).toEqual([14, 30, 15, 1]);
  });

  it('should format decimal degrees at 0.0001°', () => {
    expect(formatDegrees(new Dec('23.68333333'))).toBe('23.6833');
  });
});
