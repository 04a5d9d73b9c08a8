/**
 * Reading a calculator form's text: lists typed into one field, and a form saved with a set-up;
 * and a field's name in words.
 */

/** Sizes typed as a list ("0.1001, 0.125 0.5") → text entries; empty text → none. */
export function sizeList(text: string): string[] | undefined {
  const sizes = text.split(/[\s,;]+/).filter((s) => s !== '');
  return sizes.length ? sizes : undefined;
}

/**
 * A saved form read field by field: each field's text, or '' where the saved inputs have none (a
 * set-up saved before a field was added, or imported with fewer fields) or hold something that is
 * not text.
 */
export function savedForm<T extends object>(inputs: Record<string, unknown>): T {
  return new Proxy({}, { get: (_target, key) => (typeof key === 'string' && typeof inputs[key] === 'string' ? inputs[key] : '') }) as T;
}

/** "depthToStop" → "Depth to stop". */
export function labelOf(key: string): string {
  const words = key
    .replace(/Dms$/, ' (DMS)').replace(/Deg$/, ' (°)').replace(/ArcSec$/, ' (″)')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/([a-z])(\d)/g, '$1 $2')
    .toLowerCase().replace('(dms)', '(DMS)');
  return words.charAt(0).toUpperCase() + words.slice(1);
}
