import { calculateAngleBlocks } from '../calc/angle-blocks';
import { calculateGaugeStack } from '../calc/gauge-stack';
import { calculateLatheTaper } from '../calc/lathe-taper';
import { calculateOverPins } from '../calc/over-pins';
import { calculateCompoundSinePlate, calculateSineBar, compoundStackBlocks, unmakeableStack } from '../calc/sine-bar';
import { type CalcResult, type Step, blockCountStep } from '../calc/step';
import { type TaperResult, calculateTaper } from '../calc/taper';
import { labelOf, savedForm, sizeList } from '../forms/form-text';
import { type SineBarFormValues, compoundFormBox } from '../forms/sine-bar-form';
import { boxIdOf } from '../forms/gauge-blocks-form';
import { findAngleBlockSet } from '../data/angle-block-sets';
import { findGaugeSet } from '../data/gauge-sets';
import { findMachineTaper } from '../data/machine-tapers';
import { HOLDING_OPTIONS, type HoldingPlan, type HoldingValues, planHolding } from '../forms/taper-holding';
import { OPEN_ON_PAGE, combinationText, savedRequest } from './saved-request';
import { type TeamBox, type TeamBoxes, boxStackBlocks, namedBox, teamGaugeBox } from './team-boxes';

/** A result value as the set-up sheet lists it. */
export interface ResultLine {
  label: string;
  value: string;
}

/** A set-up's holding plan, or why it cannot be made. */
export type SetupHolding = { ok: true; plan: HoldingPlan } | { ok: false; error: string };

/** The answer of a set-up's calculation, flattened for printing. */
export type SetupResults =
  | {
      ok: true;
      /** The raw answer of the engine (for drawings). */
      value: Record<string, unknown>;
      /**
       * What the engine was given: the saved inputs, or for a form saved from a calculator page the
       * request that page makes from it (the figures used, under the engine's names).
       */
      input: Record<string, unknown>;
      lines: ResultLine[];
      /** Gauge-block stack in wringing order, when the area builds one. */
      stack: string[] | null;
      steps: Step[];
      warnings: string[];
      cautions: string[];
      /**
       * How the work is held, step by step (a taper saved from its page with its holding: angle
       * blocks, sine plate or tilting vise), or why that plan cannot be made; null where the set-up
       * has none.
       */
      holding: SetupHolding | null;
      /** The team's box the set-up was answered with (its blocks as they are now), or null. */
      box: { id: number; name: string } | null;
      /** A taper's passes: the depth of each cut and the DRO reading after it, or null. */
      passes: Array<{ pass: number; cut: string; reading: string }> | null;
    }
  /**
   * `pageOnly`: the set-up is sound but answered on its calculator page only (a sine table, a team
   * box not at hand…); `boxGone`: the team's box it names is no longer in the team's inventory.
   */
  | { ok: false; error: string; pageOnly?: true; boxGone?: true };

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

const SKIP = new Set(['steps', 'warnings', 'cautions', 'exact', 'passes', 'blocks', 'labels', 'blocksA', 'blocksB', 'lastDigit', 'tolerance', 'temperature', 'unit']);

export { labelOf };

/**
 * A result figure with its unit: lengths in the set-up's unit; tapers as the workbench pages give
 * them — per foot in in/ft, per inch as a ratio of lengths (a metric lathe taper is listed by its
 * ratio and per mm of length instead, see `setupResults`); angles and other text as they are.
 */
function withUnit(key: string, v: string, unit: string): string {
  if (/deg$|Dms$|ArcSec$/i.test(key) || !/^[\d.-]+$/.test(v)) return v;
  if (key === 'taperPerFoot') return `${v} in/ft`;
  if (key === 'taperPerInch') return unit ? `${v}${unit}/${unit.trim()}` : v;
  return `${v}${unit}`;
}

/**
 * Runs the set-up's inputs through the shared engine and flattens the answer for the sheet. A
 * set-up naming one of the team's boxes is answered with that box when `boxes` holds it (what is
 * in it now); without it, such a set-up is answered on its calculator page only.
 */
export function setupResults(kind: string, inputs: Record<string, unknown>, boxes?: TeamBoxes): SetupResults {
  // A compound sine plate saved from its page has an engine of its own.
  const compound = kind === 'sine-bar' && inputs['mode'] === 'compound';
  const engine = compound ? (calculateCompoundSinePlate as Engine) : ENGINES[kind];
  if (!engine) return { ok: false, error: `No calculation is wired for "${kind}" set-ups yet; open the set-up in its calculator.` };
  const named = namedBox(kind, inputs);
  const found = named ? boxes?.get(named.id) : undefined;
  const box = named && found && found.type === named.type ? found : null;
  // The team's boxes are at hand and the one it names is not among them: deleted (or another
  // team's). Its blocks cannot be picked, so the set-up does not compute until it is saved again.
  if (named && boxes && !box) return { ok: false, error: goneBox(named), boxGone: true };
  const request = savedRequest(kind, inputs, box);
  if (!request.ok) return request.fields['body'] === OPEN_ON_PAGE ? { ok: false, error: request.error, pageOnly: true } : { ok: false, error: request.error };
  const result = engine(request.value);
  if (!result.ok) return { ok: false, error: result.error };
  let value = result.value as Record<string, unknown>;
  if (compound) value = compoundWithBlocks(value, inputs, box);
  else if (box && kind === 'sine-bar') value = sineBarWithBox(value, box, inputs['mode'] !== 'stack');
  // Listed as the page shows it: the box by its name, not the blocks in it.
  const { blocks: _blocks, ...boxless } = request.value;
  const input = box ? { ...boxless, set: `box:${box.id}` } : request.value;
  const unit = typeof value['unit'] === 'string' ? ` ${value['unit']}` : '';
  const lines: ResultLine[] = [];
  const chamfer = kind === 'taper' && value['shape'] === 'chamfer';
  const metricLathe = kind === 'lathe-taper' && unit.trim() === 'mm';
  for (const [key, v] of Object.entries(value)) {
    if (SKIP.has(key)) continue;
    // A metric lathe taper as its page gives it: a ratio and a taper per mm of length, never per foot.
    if (metricLathe && key === 'taperPerFoot') continue;
    if (metricLathe && (key === 'taperPerInch' || key === 'ratio') && typeof v === 'string' && v !== '') {
      lines.push(key === 'ratio' ? { label: 'Taper ratio', value: v } : { label: 'Taper per mm of length', value: `${v} mm/mm` });
      continue;
    }
    if (typeof v === 'string' && v !== '') lines.push({ label: labelIn(key, chamfer), value: SET_KEYS.has(key) || key === 'shape' ? namedValue(kind, key, v, box) : withUnit(key, v, unit) });
    else if (typeof v === 'number') lines.push({ label: labelIn(key, chamfer), value: String(v) });
  }
  // Answers that keep their figures in `values` (lengths in the unit, angles in degrees and, in
  // `dms`, as degrees, minutes and seconds): the measuring set-ups of pins and rolls.
  const nested = value['values'];
  const dms = (value['dms'] ?? {}) as Record<string, unknown>;
  if (nested && typeof nested === 'object' && !Array.isArray(nested)) {
    for (const [key, v] of Object.entries(nested as Record<string, unknown>)) {
      if (typeof v !== 'string' || v === '') continue;
      if (/Deg$/.test(key)) {
        lines.push({ label: labelOf(key), value: v });
        if (typeof dms[key] === 'string') lines.push({ label: labelOf(key.replace(/Deg$/, 'Dms')), value: dms[key] });
      } else lines.push({ label: labelOf(key), value: withUnit(key, v, unit) });
    }
  }
  lines.push(...figureLines(value, unit.trim()));
  // The stack as the gauge-block page names it: a wear block says so ("0.050 wear"), from `labels`.
  const blocks = value['blocks'];
  const labels = value['labels'];
  const strings = (list: unknown): list is string[] => Array.isArray(list) && list.every((b) => typeof b === 'string');
  const stack = strings(blocks) ? (strings(labels) && labels.length === blocks.length ? labels : blocks) : null;
  const list = (k: string) => (Array.isArray(value[k]) ? (value[k] as unknown[]).filter((x): x is string => typeof x === 'string') : []);
  return {
    ok: true, value, input, lines, stack, steps: Array.isArray(value['steps']) ? (value['steps'] as Step[]) : [], warnings: list('warnings'), cautions: list('cautions'),
    holding: holdingOf(kind, inputs, value),
    box: box ? { id: box.id, name: box.name } : null,
    passes: passesOf(value),
  };
}

/** Why a set-up naming a box that is no longer in the team's inventory does not compute. */
function goneBox(named: { id: number; type: TeamBox['type'] }): string {
  const area = named.type === 'angle-blocks' ? 'Angle blocks' : 'Gauge blocks';
  return `${area}: the team's box it was saved with (no. ${named.id}) is no longer in the team's inventory, so its blocks cannot be picked`;
}

/**
 * A compound plate's two stacks with their blocks — from the standard set or the team's box the
 * form names, each block under one stack only, as the page picks them (compoundStackBlocks) — and
 * a warning for a stack the blocks cannot make, alone or beside the other.
 */
function compoundWithBlocks(value: Record<string, unknown>, inputs: Record<string, unknown>, box: TeamBox | null): Record<string, unknown> {
  const form = savedForm<SineBarFormValues>(inputs);
  const unit = value['unit'] === 'mm' ? 'mm' : 'in';
  const warnings = Array.isArray(value['warnings']) ? [...(value['warnings'] as string[])] : [];
  const out: Record<string, unknown> = { ...value, warnings };
  if (!form.set || (boxIdOf(form.set) !== null && !box)) return out;
  // A standard set the blocks cannot come from (an unknown set, a missing list that does not read) gives none.
  const standard = box ? null : compoundFormBox(form);
  if (standard && !standard.ok) {
    const [field, message] = Object.entries(standard.fields)[0] ?? ['', standard.error];
    warnings.push(`No blocks are listed: ${field.startsWith('missing') ? 'the blocks missing from the box' : 'the gauge-block set'} ${message}.`);
    return out;
  }
  const gaugeBox = box ? teamGaugeBox(box) : (standard?.value ?? null);
  const [axisA, axisB] = (['A', 'B'] as const).map((name) => value[`axis${name}`] as { stackHeight: string });
  const picked = compoundStackBlocks(gaugeBox, axisA.stackHeight, axisB.stackHeight, unit);
  if (picked.blocksA) out['blocksA'] = picked.blocksA.join(' + ') || 'none';
  if (picked.blocksB) out['blocksB'] = picked.blocksB.join(' + ') || 'none';
  warnings.push(...picked.warnings);
  return out;
}

/** The passes of a taper's answer, or null. */
function passesOf(value: Record<string, unknown>): Array<{ pass: number; cut: string; reading: string }> | null {
  const passes = value['passes'];
  if (!Array.isArray(passes) || passes.length === 0) return null;
  return (passes as Array<Record<string, unknown>>).map((p) => ({ pass: Number(p['pass']), cut: String(p['cut']), reading: String(p['reading']) }));
}

/**
 * Figures the answer keeps in objects, listed as the calculator page lists them: the number of
 * passes, a gauge stack's tolerance from its grade and its length at the blocks' temperature.
 */
function figureLines(value: Record<string, unknown>, unit: string): ResultLine[] {
  const lines: ResultLine[] = [];
  for (const name of ['A', 'B'] as const) {
    const axis = value[`axis${name}`] as Partial<Record<string, string>> | undefined;
    if (!axis || typeof axis !== 'object') continue;
    lines.push({ label: `Stack ${name}`, value: `${axis['stackHeight']} ${unit}` });
    lines.push({ label: `Angle ${name}`, value: `${axis['angleDms']} (${axis['angleDeg']}°)` });
    lines.push({ label: `Roll distance ${name}`, value: `${axis['length']} ${unit}` });
    if (typeof value[`blocks${name}`] === 'string') lines.push({ label: `Blocks ${name}`, value: String(value[`blocks${name}`]) });
  }
  const passes = value['passes'];
  if (Array.isArray(passes) && passes.length > 0) lines.push({ label: 'Passes', value: `${passes.length}, each with its DRO reading below` });
  const t = value['tolerance'] as Partial<Record<string, string>> | undefined;
  if (t && typeof t === 'object' && t['worstCase']) {
    lines.push({ label: `Tolerance, worst case (grade ${t['grade']})`, value: `±${t['worstCase']} ${unit} (±${t['worstCaseUm']} µm)` });
    lines.push({ label: 'Tolerance, root-sum-square', value: `±${t['rss']} ${unit} (±${t['rssUm']} µm)` });
  }
  const temp = value['temperature'] as Partial<Record<string, string>> | undefined;
  if (temp && typeof temp === 'object' && temp['lengthAtTemperature']) {
    lines.push({ label: `Length at ${temp['temperatureC']} °C`, value: `${temp['lengthAtTemperature']} ${unit} (change ${temp['change']} ${unit} from 20 °C)` });
  }
  return lines;
}

/** A sine bar's stack with its blocks picked from the team's box, as the sine-bar page asks the inventory for them. */
function sineBarWithBox(value: Record<string, unknown>, box: TeamBox, forAngle: boolean): Record<string, unknown> {
  const stack = String(value['stackHeight']);
  const unit = String(value['unit']);
  const warnings = Array.isArray(value['warnings']) ? (value['warnings'] as string[]) : [];
  if (box.unit !== unit) return { ...value, warnings: [...warnings, `The team's box "${box.name}" holds ${box.unit} blocks; this set-up is in ${unit}, so no blocks are picked from it.`] };
  if (Number(stack) === 0) return { ...value, blocks: [], blockCount: 0 };
  const blocks = boxStackBlocks(box, stack);
  if (!blocks) return { ...value, warnings: [...warnings, unmakeableStack(stack, unit, forAngle)] };
  const steps = Array.isArray(value['steps']) ? (value['steps'] as Step[]) : [];
  return {
    ...value,
    blocks,
    blockCount: blocks.length,
    steps: [...steps, blockCountStep(blocks)],
  };
}

/** The holding plan of a taper saved from its page, as the page makes it (shared/forms/taper-holding). */
function holdingOf(kind: string, inputs: Record<string, unknown>, value: Record<string, unknown>): SetupHolding | null {
  if (kind !== 'taper' || typeof inputs['holding'] !== 'string' || inputs['holding'] === '') return null;
  const plan = planHolding(savedForm<HoldingValues>(inputs), value as unknown as TaperResult);
  if (plan.ok) return { ok: true, plan: plan.value };
  const why = Object.entries(plan.fields).map(([field, message]) => `${labelOf(field)} ${message}`).join('; ');
  return { ok: false, error: `${plan.error}${why && !plan.error.includes(why) ? ` (${why})` : ''}` };
}

/**
 * Fields a page saves that are not for the engine but describe the set-up: how the work is held
 * (the taper page's holding, its angle-block set or sine plate and stack set) and the part length.
 */
function setUpFields(kind: string, saved: Record<string, unknown>): readonly string[] {
  // A compound plate's blocks come from the set the form names.
  if (kind === 'sine-bar' && saved['mode'] === 'compound') return ['set', 'missing'];
  if (kind !== 'taper') return [];
  const holding = saved['holding'];
  return ['partLength', 'holding', ...(holding === 'sine-plate' ? ['plateLength', 'plateSet'] : holding === 'tilted-vise' ? [] : ['angleSet'])];
}

/**
 * The inputs to list for a set-up (detail page and sheet): what the calculation used — for a form
 * saved from a page, the figures of the chosen mode under the engine's names, and the set-up's own
 * fields — or, without an answer, everything saved.
 */
export function listedInputs(kind: string, saved: Record<string, unknown>, results: SetupResults): Array<[string, unknown]> {
  if (!results.ok) return Object.entries(saved);
  const extra = setUpFields(kind, saved).filter((k) => !(k in results.input) && saved[k] !== undefined && saved[k] !== '').map((k) => [k, saved[k]] as [string, unknown]);
  return [...Object.entries(results.input).filter(([, v]) => v !== undefined && v !== ''), ...extra];
}

/**
 * The inputs as the set-up page and sheet list them: a label in words ("taperLength" → "Taper
 * length") and the value as text, with set, taper and holding ids by their names.
 */
export function inputRows(kind: string, saved: Record<string, unknown>, results: SetupResults): Array<{ label: string; value: string }> {
  const box = results.ok ? results.box : null;
  const gone = !results.ok && results.boxGone === true;
  // Empty fields (no blocks missing, no wear blocks, no temperature) are not listed.
  const listed = listedInputs(kind, saved, results).filter(([, v]) => inputText(v).trim() !== '');
  const unit = [saved['unit'], results.ok ? results.value['unit'] : undefined].find((u): u is string => u === 'in' || u === 'mm');
  const chamfer = kind === 'taper' && listed.some(([k, v]) => k === 'shape' && v === 'chamfer');
  return listed.map(([key, value]) => {
    const text = namedValue(kind, key, value, box, gone);
    return { label: labelIn(key, chamfer), value: unit && LENGTH_INPUTS.has(key) && /^[\d.]+$/.test(text) ? `${text} ${unit}` : text };
  });
}

/** Inputs that are lengths in the set-up's unit (listed with it). */
const LENGTH_INPUTS = new Set([
  'thickness', 'taperLength', 'endThickness', 'removedAtEnd', 'faceLength', 'partLength', 'depthPerPass', 'fluteLength', 'cutterDiameter',
  'barLength', 'plateLength', 'stackHeight', 'target', 'width', 'depth', 'rollDiameter', 'rollDiameter1', 'rollDiameter2', 'pinDiameter',
  'measurement', 'measurement1', 'measurement2', 'heightDifference', 'largeDisc', 'smallDisc', 'centreDistance', 'largeBall', 'smallBall',
  'largeBallDepth', 'smallBallDepth', 'grooveWidth', 'largeDiameter', 'smallDiameter', 'length', 'workLength', 'reading',
  'lengthA', 'lengthB', 'stackA', 'stackB', 'resolution',
]);

/** Keys whose values are a set's id. */
const SET_KEYS = new Set(['set', 'angleSet', 'plateSet', 'standard', 'holding']);

/** A field's label in words; a chamfer's two legs by their own names (the engine keeps a taper's). */
function labelIn(key: string, chamfer: boolean): string {
  if (chamfer && key === 'taperLength') return 'Leg on the top face';
  if (chamfer && key === 'removedAtEnd') return 'Leg on the end face';
  return AXIS_LABELS[key] ?? labelOf(key);
}

/** A compound plate's inputs, by the page's words. */
const AXIS_LABELS: Readonly<Record<string, string>> = {
  lengthA: 'Roll distance A', lengthB: 'Roll distance B', angleA: 'Angle A', angleB: 'Angle B', stackA: 'Stack A', stackB: 'Stack B', resolution: 'Stacks rounded to',
};

/** A set, standard taper or holding id by its name; anything else as `inputText` gives it. */
function namedValue(kind: string, key: string, value: unknown, known: { id: number; name: string } | null, gone = false): string {
  if (typeof value === 'string' && value !== '') {
    if (key === 'shape') return value === 'chamfer' ? 'Chamfer or bevel on an edge' : value === 'taper' ? 'Taper' : value;
    const box = boxIdOf(value);
    if (box !== null) return known?.id === box ? `Our box: ${known.name}` : gone ? `a box since deleted (no. ${box})` : `the team's own box (no. ${box})`;
    if (key === 'holding') return HOLDING_OPTIONS.find((o) => o.value === value)?.label ?? value;
    if (key === 'standard') return findMachineTaper(value)?.name ?? value;
    if (key === 'angleSet' || (key === 'set' && kind === 'angle-blocks')) return findAngleBlockSet(value)?.name ?? value;
    if (key === 'plateSet' || key === 'set') return findGaugeSet(value)?.name ?? value;
  }
  return inputText(value);
}

/** An input's value as text: a list of plain values comma-separated, other objects as JSON. */
export function inputText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (Array.isArray(value) && value.every((v) => typeof v === 'string' || typeof v === 'number')) return value.join(', ');
  if (Array.isArray(value) && value.every((v) => typeof v === 'object' && v !== null && typeof (v as { angle?: unknown }).angle === 'string')) {
    return combinationText(value as Array<{ angle: string; reversed?: unknown }>);
  }
  return JSON.stringify(value);
}

