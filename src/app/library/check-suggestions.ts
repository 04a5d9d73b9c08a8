import type { CheckUnit, SetupCheck } from '../../../shared/api/setup';
import type { ResultLine } from '../../../shared/library/setup-results';

/** Default tolerance of a suggested check, per unit (common practice for milled features; edit to the drawing). */
export const DEFAULT_TOLERANCE: Readonly<Record<CheckUnit, string>> = { in: '0.0010', mm: '0.025', deg: '0.05' };

const VALUE = /^(-?\d+(?:\.\d+)?)(?:\s*(in|mm|°))?$/;

/** A short key from a label: "Face length" → "face-length". */
export function checkKey(label: string): string {
  const key = label.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40);
  return /^[a-z]/.test(key) ? key : `check-${key}`.slice(0, 40);
}

/**
 * A check made from a result line ("End thickness", "0.5854 in"), or null when the line is not a
 * single number with a length or angle unit.
 */
export function checkFromResult(line: ResultLine, fallbackUnit: CheckUnit): SetupCheck | null {
  const match = VALUE.exec(line.value.trim());
  if (!match || !match[1]) return null;
  const unit: CheckUnit = match[2] === '°' || /\(°\)$/.test(line.label) ? 'deg' : match[2] === 'mm' ? 'mm' : match[2] === 'in' ? 'in' : fallbackUnit;
  const label = line.label.replace(/\s*\(°\)$/, '');
  return { key: checkKey(label), label, unit, nominal: match[1], plus: DEFAULT_TOLERANCE[unit], minus: DEFAULT_TOLERANCE[unit] };
}
