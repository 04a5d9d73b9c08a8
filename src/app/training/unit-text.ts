/**
 * How training prints a value with its unit, the same on every page: degree and second signs close
 * up ("34.9920°", "4.26″"), other units after a space ("0.2993 in"), and a value that already
 * carries its unit ("35°", "19.4600° (19°27'36\")") gets no second one.
 */
export function unitSuffix(value: string, unit: string): string {
  const v = value.trim();
  if (!unit || v === '?' || v === '') return '';
  if (/[a-z°"″′']\s*$/i.test(v) || (unit === '°' && v.includes('°'))) return '';
  if (unit === '°' || unit === '″' || unit === '"') return unit;
  return ` ${unit}`;
}

/** A value and its unit: "0.2993 in", "19.46°", "5 blocks", "1 block". */
export function withUnit(value: string, unit: string): string {
  const v = value.trim();
  if (unit === 'blocks' && v === '1') return '1 block';
  return v + unitSuffix(v, unit);
}
