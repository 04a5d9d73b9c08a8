import { Dec } from '../calc/decimal-math';
import { convertLength, formatLength, roundToStep, unitResolution } from './length-unit';

describe('length-unit', () => {
  it('should report inches at 0.0001 and millimetres at 0.001 (REFERENCE.md rounding conventions, common practice)', () => {
    expect(unitResolution('in').toString()).toBe('0.0001');
    expect(unitResolution('mm').toString()).toBe('0.001');
    expect(formatLength(new Dec('2.00840702'), 'in')).toBe('2.0084');
    expect(formatLength(new Dec('9.20884206'), 'mm')).toBe('9.209');
  });

  it('should round half up to any step, e.g. 0.0005 mm for sets with a 1.0005 block', () => {
    expect(roundToStep(new Dec('17.36482'), new Dec('0.0005')).toString()).toBe('17.365');
    expect(roundToStep(new Dec('17.36474'), new Dec('0.0005')).toString()).toBe('17.3645');
    expect(formatLength(new Dec('17.36474'), 'mm', new Dec('0.0005'))).toBe('17.3645');
    expect(roundToStep(new Dec('0.00005'), new Dec('0.0001')).toString()).toBe('0.0001');
    // A half step a hair low from 40-digit trig noise still rounds up (derived).
    expect(roundToStep(new Dec('0.000049999999999999999999999999999999999'), new Dec('0.0001')).toString()).toBe('0.0001');
  });

  it('should convert with 25.4 mm per inch exactly', () => {
    expect(convertLength(new Dec(1), 'in', 'mm').toString()).toBe('25.4');
    expect(convertLength(new Dec('50.8'), 'mm', 'in').toString()).toBe('2');
    expect(convertLength(new Dec(3), 'mm', 'mm').toString()).toBe('3');
  });
});
