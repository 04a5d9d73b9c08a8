/**
 * A set-up saved with one of the team's own block boxes names it in its inputs as "box:<id>" (the
 * gauge-block or angle-block set's row id). Rows get new ids on import, so those names are
 * rewritten to the box's new id; a name of a box that is not in the archive (deleted before the
 * export) becomes "" — no set — rather than the id of whichever box has that number here.
 */
import { boxIdOf } from '../../../shared/forms/gauge-blocks-form';

/** Each string that names a box, anywhere in a JSON value, with the box's new id. */
export function remapBoxRefs(value: unknown, boxIds: ReadonlyMap<number, number>): unknown {
  if (typeof value === 'string') {
    const old = boxIdOf(value);
    if (old === null) return value;
    const mapped = boxIds.get(old);
    return mapped === undefined ? '' : `box:${mapped}`;
  }
  if (Array.isArray(value)) return value.map((v) => remapBoxRefs(v, boxIds));
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, remapBoxRefs(v, boxIds)]));
  }
  return value;
}

/** JSON text of a set-up's inputs, with its box names remapped; text that is not JSON is left as it is. */
export function remapInputsText(text: unknown, boxIds: ReadonlyMap<number, number>): unknown {
  return remapJsonText(text, (parsed) => remapBoxRefs(parsed, boxIds));
}

/**
 * JSON text of a revision's snapshot (its `inputs`) or of its changes (the from/to of each
 * `inputs.…` field), with the box names remapped.
 */
export function remapRevisionText(column: 'snapshot' | 'changes', text: unknown, boxIds: ReadonlyMap<number, number>): unknown {
  return remapJsonText(text, (parsed) => {
    if (column === 'snapshot') {
      if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed)) return parsed;
      const snapshot = parsed as Record<string, unknown>;
      return 'inputs' in snapshot ? { ...snapshot, inputs: remapBoxRefs(snapshot['inputs'], boxIds) } : snapshot;
    }
    if (!Array.isArray(parsed)) return parsed;
    return parsed.map((change: unknown) => {
      if (change === null || typeof change !== 'object') return change;
      const c = change as Record<string, unknown>;
      return typeof c['field'] === 'string' && c['field'].startsWith('inputs.') ? { ...c, from: remapBoxRefs(c['from'], boxIds), to: remapBoxRefs(c['to'], boxIds) } : c;
    });
  });
}

function remapJsonText(text: unknown, remap: (parsed: unknown) => unknown): unknown {
  if (typeof text !== 'string') return text;
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    return text;
  }
  return JSON.stringify(remap(parsed));
}
