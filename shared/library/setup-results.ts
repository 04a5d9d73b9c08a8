import { calculateAngleBlocks } from '../calc/angle-blocks';
import { calculateGaugeStack } from '../calc/gauge-stack';
import { calculateLatheTaper } from '../calc/lathe-taper';
import { calculateOverPins } from '../calc/over-pins';
import { calculateSineBar } from '../calc/sine-bar';
import type { CalcResult, Step } from '../calc/step';
import { calculateTaper } from '../calc/taper';

/** A result value as the set-up sheet lists it. */
export interface ResultLine {
  label: string;
  value: string;
}

/** The answer of a set-up's calculation, flattened for printing. */
export type SetupResults =
  | {
      ok: true;
      /** The raw answer of the engine (for drawings). */
      value: Record<string, unknown>;
      lines: ResultLine[];
      /** Gauge-block stack in wringing order, when the area builds one. */
      stack: string[] | null;
      steps: Step[];
      warnings: string[];
      cautions: string[];
    }
  | { ok: false; error: string };

type Engine = (input: unknown) => CalcResult<object>;

/** The shared engine function for each set-up kind that has one. */
const ENGINES: Readonly<Partial<Record<string, Engine>>> = {
  taper: calculateTaper,
  'sine-bar': calculateSineBar,
  'gauge-blocks': calculateGaugeStack,
  'angle-blocks': calculateAngleBlocks,
  'lathe-taper': calculateLatheTaper,
  'pins-rolls': calculateOverPins,
};

const SKIP = new Set(['steps', 'warnings', 'cautions', 'exact', 'passes', 'blocks', 'lastDigit', 'tolerance', 'temperature', 'unit']);

/** "depthToStop" → "Depth to stop". */
export function labelOf(key: string): string {
  const words = key.replace(/Dms$/, ' (DMS)').replace(/Deg$/, ' (°)').replace(/ArcSec$/, ' (″)').replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase().replace('(dms)', '(DMS)');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** Runs the set-up's inputs through the shared engine and flattens the answer for the sheet. */
export function setupResults(kind: string, inputs: Record<string, unknown>): SetupResults {
  const engine = ENGINES[kind];
  if (!engine) return { ok: false, error: `No calculation is wired for "${kind}" set-ups yet; open the set-up in its calculator.` };
  const result = engine(inputs);
  if (!result.ok) return { ok: false, error: result.error };
  const value = result.value as Record<string, unknown>;
  const unit = typeof value['unit'] === 'string' ? ` ${value['unit']}` : '';
  const lines: ResultLine[] = [];
  for (const [key, v] of Object.entries(value)) {
    if (SKIP.has(key)) continue;
    if (typeof v === 'string' && v !== '') lines.push({ label: labelOf(key), value: /deg$|Dms$|ArcSec$/i.test(key) ? v : `${v}${/^[\d.-]+$/.test(v) ? unit : ''}` });
    else if (typeof v === 'number') lines.push({ label: labelOf(key), value: String(v) });
  }
  const blocks = value['blocks'];
  const stack = Array.isArray(blocks) && blocks.every((b) => typeof b === 'string') ? (blocks as string[]) : null;
  const list = (k: string) => (Array.isArray(value[k]) ? (value[k] as unknown[]).filter((x): x is string => typeof x === 'string') : []);
  return { ok: true, value, lines, stack, steps: Array.isArray(value['steps']) ? (value['steps'] as Step[]) : [], warnings: list('warnings'), cautions: list('cautions') };
}
