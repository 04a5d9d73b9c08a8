import type { GaugeStackRequest } from '../../../shared/api/calc';
import type { GaugeStackResult, StackAnswer } from '../../../shared/calc/gauge-stack';
import { GAUGE_BLOCK_SETS } from '../../../shared/data/gauge-sets';
import type { LengthUnit } from '../../../shared/units/length-unit';
import type { ResultItem } from '../workbench/result-list';
import type { GaugeBlockPiece, GaugeStackSceneInput } from './gauge-stack-scene';

/** The gauge-block form's values: all text, as typed. */
export type GaugeBlocksFormValues = {
  unit: string;
  target: string;
  set: string;
  missing: string;
  wearBlocks: string;
  grade: string;
  temperature: string;
};

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
  { value: 'K', label: 'K (calibration; values from memory)' },
  { value: '0', label: '0' },
  { value: '1', label: '1' },
  { value: '2', label: '2' },
];

/** The standard sets in a unit. */
export function gaugeSetsInUnit(unit: LengthUnit): { id: string; name: string; notes: string }[] {
  return GAUGE_BLOCK_SETS.filter((s) => s.unit === unit).map((s) => ({ id: s.id, name: s.name, notes: s.notes }));
}

/** Sizes typed as a list → text entries, or undefined for none. */
export function sizeList(text: string): string[] | undefined {
  const sizes = text.split(/[\s,;]+/).filter((s) => s !== '');
  return sizes.length ? sizes : undefined;
}

/** The engine request for the form. */
export function toGaugeStackRequest(values: GaugeBlocksFormValues): GaugeStackRequest {
  return {
    target: values.target,
    unit: values.unit as GaugeStackRequest['unit'],
    set: values.set,
    missing: sizeList(values.missing),
    wearBlocks: values.wearBlocks,
    grade: (values.grade || undefined) as GaugeStackRequest['grade'],
    temperature: values.temperature,
  };
}

/** The numbers of a stack answer for the result list. */
export function gaugeResultItems(r: GaugeStackResult): ResultItem[] {
  const u = r.unit;
  const items: ResultItem[] = [
    { label: 'Fewest blocks', value: r.blocks.join(' + '), unit: '', emphasis: true, note: `${r.count} blocks, wringing order, largest first` },
    { label: 'Stack length', value: r.total, unit: u },
  ];
  if (r.lastDigit) items.push({ label: 'Last-digit method', value: r.lastDigit.blocks.join(' + '), unit: '', note: `${r.lastDigit.count} blocks, the textbook way` });
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
