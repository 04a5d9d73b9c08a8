import { Dec, EXACT_DIGITS, fixedText } from '../calc/decimal-math';

/** The two length units a set-up can use. */
export type LengthUnit = 'in' | 'mm';

/** All length units, for schemas and pickers. */
export const LENGTH_UNITS: readonly LengthUnit[] = ['in', 'mm'];

/** Millimetres per inch (exact by definition since 1959). */
export const MM_PER_INCH = new Dec('25.4');

/** Decimal places of the finest ordinary reading: 0.0001 in, 0.001 mm. */
export const UNIT_DECIMALS: Readonly<Record<LengthUnit, number>> = { in: 4, mm: 3 };

/** The smallest step a length is reported at, per unit (common practice, REFERENCE.md rounding conventions). */
export function unitResolution(unit: LengthUnit): Dec {
  return new Dec(10).pow(-UNIT_DECIMALS[unit]);
}

/** Decimal places needed to print a resolution step, e.g. 0.0005 → 4. */
export function decimalsOf(step: Dec): number {
  return step.decimalPlaces();
}

/** Rounds a length to the nearest multiple of `step` (half away from zero). */
export function roundToStep(value: Dec, step: Dec): Dec {
  // At an exact value's 30 digits first, as `fixedText` does: an exact half step rounds up.
  return value.toSignificantDigits(EXACT_DIGITS).div(step).toDecimalPlaces(0, Dec.ROUND_HALF_UP).mul(step);
}

/** Formats a length at a unit's resolution, or at a given step's decimals. */
export function formatLength(value: Dec, unit: LengthUnit, step?: Dec): string {
  const decimals = step ? Math.max(UNIT_DECIMALS[unit], decimalsOf(step)) : UNIT_DECIMALS[unit];
  return fixedText(step ? roundToStep(value, step) : value, decimals);
}

/** Converts a length between units. */
export function convertLength(value: Dec, from: LengthUnit, to: LengthUnit): Dec {
  if (from === to) return value;
  return from === 'in' ? value.mul(MM_PER_INCH) : value.div(MM_PER_INCH);
}
