import { Dec } from '../calc/decimal-math';
import { compactAngle, formatCombination, parseCombination } from './combination-text';

describe('parseCombination', () => {
  it('should read added and reversed blocks (REFERENCE.md §6 derived: 17°35′ = 27 − 9 − 1 and 27′ + 9′ − 1′)', () => {
    expect(parseCombination("27° − 9° − 1° + 27' + 9' − 1'")).toEqual({
      ok: true,
      blocks: [
        { angle: '27°', reversed: false },
        { angle: '9°', reversed: true },
        { angle: '1°', reversed: true },
        { angle: "27'", reversed: false },
        { angle: "9'", reversed: false },
        { angle: "1'", reversed: true },
      ],
    });
  });

  it('should accept ASCII minus, a leading sign and no spaces', () => {
    expect(parseCombination('-3°+41°')).toEqual({ ok: true, blocks: [{ angle: '3°', reversed: true }, { angle: '41°', reversed: false }] });
  });

  it('should keep DMS text with spaces as one block', () => {
    expect(parseCombination('1 30 + 3')).toEqual({ ok: true, blocks: [{ angle: '1 30', reversed: false }, { angle: '3', reversed: false }] });
  });

  it('should refuse an empty text', () => {
    expect(parseCombination('  ')).toEqual({ ok: false, error: expect.stringContaining('is empty') });
  });

  it('should refuse a dangling sign', () => {
    expect(parseCombination('27° −')).toEqual({ ok: false, error: expect.stringContaining('sign with no block') });
    expect(parseCombination('27° + − 9°')).toMatchObject({ ok: false });
  });
});

describe('compactAngle', () => {
  it('should drop zero places', () => {
    expect(compactAngle('27')).toBe('27°');
    expect(compactAngle('0.15')).toBe('9′');
    expect(compactAngle(new Dec('0.0083333333333333333333333'))).toBe('30″');
    expect(compactAngle('17.583333333333333333333333')).toBe('17°35′');
    expect(compactAngle('0')).toBe('0°');
  });
});

describe('formatCombination', () => {
  it('should write reversed blocks with a minus', () => {
    expect(
      formatCombination([
        { angleDeg: '27', reversed: false },
        { angleDeg: '9', reversed: true },
        { angleDeg: '0.45', reversed: false },
      ]),
    ).toBe('27° − 9° + 27′');
  });
});
