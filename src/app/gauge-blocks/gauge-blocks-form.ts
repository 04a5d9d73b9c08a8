import { gaugeStackRequestSchema, parseRequest } from '../../../shared/api/calc';
import { DECIMAL_TEXT, withLeadingZero } from '../../../shared/api/setup';
import { type GaugeStackResult, type StackAnswer, calculateGaugeStack } from '../../../shared/calc/gauge-stack';
import { type CalcResult, invalid, succeed } from '../../../shared/calc/step';
import { GAUGE_BLOCK_SETS } from '../../../shared/data/gauge-sets';
import type { LengthUnit } from '../../../shared/units/length-unit';
import type { ResultItem } from '../workbench/result-list';
import type { GaugeBlockPiece, GaugeStackSceneInput } from './gauge-stack-scene';
import { type BoxStackQuery, boxIdOf } from './own-boxes';
import { type GaugeBlocksFormValues, toGaugeStackRequest } from '../../../shared/forms/gauge-blocks-form';

export { toGaugeStackRequest, type GaugeBlocksFormValues } from '../../../shared/forms/gauge-blocks-form';

/** Defaults from the demo scenario: the 1.2519 in stack under the 5 in sine plate at 14°30', from the 81-piece set. */
export const GAUGE_BLOCKS_DEFAULTS: GaugeBlocksFormValues = {
  unit: 'in',
  target: '1.2519',
  set: 'inch-81',
  missing: '',
  wearBlocks: '',
  grade: '0',
  temperature: '',
};

/** Length controls converted on a unit change (block sizes are not: the set changes with the unit). */
export const GAUGE_LENGTH_FIELDS = ['target'] as const;

/** Grades the tolerance table covers, with how well each column is backed. */
export const GRADE_OPTIONS: readonly { readonly value: string; readonly label: string }[] = [
  { value: '', label: 'No grade tolerance' },
  { value: 'K', label: 'K (calibration grade)' },
  { value: '0', label: '0' },
  { value: '1', label: '1' },
  { value: '2', label: '2' },
];

/** The standard sets in a unit. */
export function gaugeSetsInUnit(unit: LengthUnit): { id: string; name: string; notes: string }[] {
  return GAUGE_BLOCK_SETS.filter((s) => s.unit === unit).map((s) => ({ id: s.id, name: s.name, notes: s.notes }));
}

/**
 * What the page works from: the engine's answer in the browser for a standard set, or — for one
 * of the team's own sets — the checked query for the inventory route (the box is server data).
 */
export type GaugeOutcome =
  | { readonly source: 'engine'; readonly result: GaugeStackResult }
  | { readonly source: 'box'; readonly query: BoxStackQuery };

/** Fields the inventory route takes, checked with the engine's own rules so the messages match. */
const boxFieldsSchema = gaugeStackRequestSchema.pick({ target: true, grade: true });

/**
 * Runs the form: a standard set through the engine; an own box only checks the fields and gives
 * the query (stack length as typed, the box's wear-block pair when chosen, the grade or the box's
 * own grade when blank). Never throws.
 */
export function runGaugeBlocks(values: GaugeBlocksFormValues): CalcResult<GaugeOutcome> {
  const setId = boxIdOf(values.set);
  if (setId === null) {
    const r = calculateGaugeStack(toGaugeStackRequest(values));
    return r.ok ? succeed({ source: 'engine', result: r.value }) : r;
  }
  const checked = parseRequest('Gauge stack', boxFieldsSchema, { target: values.target, grade: values.grade || undefined });
  if (!checked.ok) return checked;
  // The inventory route reads plain decimals (no sign, at most 6 decimals); ".5" is sent as 0.5.
  const target = withLeadingZero(values.target.trim());
  if (!DECIMAL_TEXT.test(target)) return invalid('Gauge stack', 'target', 'must be a plain decimal such as 0.2507 (at most 6 decimals)');
  const query: BoxStackQuery = { setId, target, wear: values.wearBlocks !== '', ...(values.grade ? { grade: values.grade } : {}) };
  return succeed({ source: 'box', query });
}

/** The numbers of a stack answer for the result list. */
export function gaugeResultItems(r: GaugeStackResult): ResultItem[] {
  const u = r.unit;
  const items: ResultItem[] = [
    { label: 'Fewest blocks', value: r.labels.join(' + '), unit: '', emphasis: true, note: `${r.count} ${r.count === 1 ? 'block' : 'blocks'}, wringing order, largest first${r.wearBlock ? ', wear blocks at both ends' : ''}` },
    { label: 'Stack length', value: r.total, unit: u },
  ];
  if (r.lastDigit) items.push({ label: 'Last-digit method', value: r.lastDigit.labels.join(' + '), unit: '', note: `${r.lastDigit.count} ${r.lastDigit.count === 1 ? 'block' : 'blocks'}, the textbook way` });
  if (r.tolerance) {
    items.push(
      { label: `Tolerance, worst case (grade ${r.tolerance.grade})`, value: `±${r.tolerance.worstCase}`, unit: u, note: `±${r.tolerance.worstCaseUm} µm` },
      { label: `Tolerance, root-sum-square`, value: `±${r.tolerance.rss}`, unit: u, note: `±${r.tolerance.rssUm} µm` },
    );
  }
  if (r.temperature) {
    items.push({ label: `Length at ${r.temperature.temperatureC} °C`, value: r.temperature.lengthAtTemperature, unit: u, note: `Change ${r.temperature.change} ${u} from 20 °C` });
  }
  items.push({ label: 'Finest step of the box', value: r.resolution, unit: u });
  return items;
}

/** A stack's blocks bottom first, wear blocks marked (they sit at both ends). */
function pieces(stack: StackAnswer, wearBlock: string | null): GaugeBlockPiece[] {
  return stack.blocks.map((b, i) => ({ size: Number(b), label: b, wear: wearBlock !== null && (i === 0 || i === stack.blocks.length - 1) }));
}

/** The drawing's model from an answer. */
export function gaugeSceneInput(r: GaugeStackResult): GaugeStackSceneInput {
  return {
    target: Number(r.total),
    fewest: pieces(r, r.wearBlock),
    lastDigit: r.lastDigit ? pieces(r.lastDigit, r.wearBlock) : null,
    totalLabel: `${r.total} ${r.unit}`,
  };
}
