import { parseAngle } from '../../../shared/angle/angle-text';
import {
  type CompoundSineResult, type SineBarResult, type SineTableResult, type SineTableRow, calculateCompoundSinePlate, calculateSineBar,
  calculateSineTable, compoundStackBlocks, unmakeableRows,
} from '../../../shared/calc/sine-bar';
import { type CalcResult, type Step, invalid, succeed } from '../../../shared/calc/step';
import type { ResultItem } from '../workbench/result-list';
import { type SineBarFormValues, compoundFormBox, sizeList, sineBarResultItems, toCompoundSineRequest, toSineBarRequest } from './sine-bar-form';
import type { SineBarSceneInput } from './sine-bar-scene';

/** What the page works out: one setting (from an angle or a stack), a table over a range, or a compound plate. */
export type SineBarMode = 'angle' | 'stack' | 'table' | 'compound';

/** The page's modes with their toggle labels. */
export const SINE_BAR_MODES: readonly { readonly value: SineBarMode; readonly label: string }[] = [
  { value: 'angle', label: 'Stack for an angle' },
  { value: 'stack', label: 'Angle from a stack' },
  { value: 'table', label: 'Table of stacks' },
  { value: 'compound', label: 'Compound plate' },
];

/** Reads the mode control; anything unknown (an old or edited URL) means a stack for an angle. */
export function sineBarMode(value: string): SineBarMode {
  return value === 'stack' || value === 'table' || value === 'compound' ? value : 'angle';
}

/**
 * Most rows the page lists. The engine allows far more (MAX_TABLE_ROWS), but a table for the
 * bench is read and printed: a few pages at most, and each row needs its own block search.
 */
export const SCREEN_TABLE_ROWS = 400;

/** The answer for the page in each mode, with what every mode shows: warnings and the derivation. */
export type SineBarOutcome =
  | { readonly mode: 'angle' | 'stack'; readonly single: SineBarResult; readonly warnings: readonly string[]; readonly steps: readonly Step[] }
  | { readonly mode: 'table'; readonly table: SineTableResult; readonly warnings: readonly string[]; readonly steps: readonly Step[] }
  | {
      readonly mode: 'compound';
      readonly compound: CompoundSineResult;
      /** Fewest blocks for each axis' stack (largest first), null without a set or when the box cannot make it. */
      readonly blocksA: readonly string[] | null;
      readonly blocksB: readonly string[] | null;
      readonly warnings: readonly string[];
      readonly steps: readonly Step[];
    };

/** Engine field → control, for every mode (the table and compound engines name their fields their own way). */
export const SINE_BAR_ALIASES: Readonly<Record<string, string>> = {
  'missing.0': 'missing',
  from: 'tableFrom',
  to: 'tableTo',
  step: 'tableStep',
  lengthA: 'barLength',
  angleA: 'angle',
  stackA: 'stackHeight',
};

/**
 * How many rows a range gives, or null when a bound does not parse yet (the engine then names
 * the field). Same rule as the engine: ⌊(to − from) / step⌋ + 1.
 */
export function tableRowCount(from: string, to: string, step: string): number | null {
  const [a, b, s] = [parseAngle(from), parseAngle(to), parseAngle(step)];
  if (!a.ok || !b.ok || !s.ok || !s.degrees.gt(0) || a.degrees.lt(0) || b.degrees.lt(a.degrees) || b.degrees.gte(90)) return null;
  return b.degrees.minus(a.degrees).div(s.degrees).plus('1e-20').floor().toNumber() + 1;
}

/** The engine request of a table. */
export function toSineTableRequest(v: SineBarFormValues) {
  return {
    unit: v.unit as 'in' | 'mm',
    barLength: v.barLength,
    from: v.tableFrom,
    to: v.tableTo,
    step: v.tableStep,
    set: v.set || undefined,
    missing: v.set ? sizeList(v.missing) : undefined,
  };
}

/**
 * The blocks of both stacks of a compound plate from the chosen standard set, as marked: each
 * block under one stack only (shared/calc/sine-bar compoundStackBlocks); none without a set.
 */
function compoundBlocks(v: SineBarFormValues, c: CompoundSineResult): CalcResult<{ blocksA: string[] | null; blocksB: string[] | null; warnings: string[] }> {
  const boxed = compoundFormBox(v);
  if (!boxed.ok) return boxed;
  if (!boxed.value) return succeed({ blocksA: null, blocksB: null, warnings: [] });
  return succeed(compoundStackBlocks(boxed.value, c.axisA.stackHeight, c.axisB.stackHeight, c.unit));
}

/** Runs the engine for the form in its mode. Never throws: bad input gives a failure naming the field. */
export function runSineBar(v: SineBarFormValues): CalcResult<SineBarOutcome> {
  const mode = sineBarMode(v.mode);
  // The engines take "an angle or a stack"; an empty box is named here, on the box the user sees.
  const required = (names: readonly (keyof SineBarFormValues)[], what: string): CalcResult<never> | null => {
    const empty = names.find((n) => v[n].trim() === '');
    return empty ? invalid('Sine bar', empty, `is required: type ${what}`) : null;
  };
  const missing =
    mode === 'angle'
      ? required(['angle'], 'an angle, e.g. 14°30\'')
      : mode === 'stack'
        ? required(['stackHeight'], 'the stack height')
        : mode === 'table'
          ? required(['tableFrom', 'tableTo', 'tableStep'], 'an angle, e.g. 10 or 10°30\'')
          : v.compoundBy === 'stacks'
            ? required(['stackHeight', 'stackB'], 'the stack height')
            : required(['angle', 'angleB'], 'an angle, e.g. 14°30\'');
  if (missing) return missing;
  if (mode === 'table') {
    const rows = tableRowCount(v.tableFrom, v.tableTo, v.tableStep);
    if (rows !== null && rows > SCREEN_TABLE_ROWS) {
      return invalid('Sine table', 'tableStep', `gives ${rows} rows; the page lists at most ${SCREEN_TABLE_ROWS}: use a larger step or a shorter range`);
    }
    const t = calculateSineTable(toSineTableRequest(v));
    if (!t.ok) return t;
    const warnings = t.value.unreachable
      ? [unmakeableRows(t.value.unreachable)]
      : [];
    return succeed({ mode, table: t.value, warnings, steps: t.value.steps });
  }
  if (mode === 'compound') {
    // With a set, each stack is rounded to the box's finest step so the blocks can make it.
    const c = calculateCompoundSinePlate(toCompoundSineRequest(v));
    if (!c.ok) return c;
    const picked = compoundBlocks(v, c.value);
    if (!picked.ok) return picked;
    const { blocksA, blocksB } = picked.value;
    return succeed({ mode, compound: c.value, blocksA, blocksB, warnings: [...c.value.warnings, ...picked.value.warnings], steps: c.value.steps });
  }
  const r = calculateSineBar(toSineBarRequest({ ...v, mode }));
  if (!r.ok) return r;
  return succeed({ mode, single: r.value, warnings: r.value.warnings, steps: r.value.steps });
}

/** The result list of an outcome. */
export function outcomeItems(o: SineBarOutcome): ResultItem[] {
  if (o.mode === 'table') {
    const t = o.table;
    return [
      { label: 'Rows', value: String(t.rows.length), unit: '', emphasis: true, note: `${t.rows[0]?.angleDms ?? ''} to ${t.rows[t.rows.length - 1]?.angleDms ?? ''}` },
      { label: 'Bar length', value: t.barLength, unit: t.unit, note: 'Roll centre distance' },
      { label: 'Stacks rounded to', value: t.resolution, unit: t.unit, note: 'The finest step of the box, or of the unit' },
    ];
  }
  if (o.mode !== 'compound') return sineBarResultItems(o.single, o.mode === 'angle');
  const c = o.compound;
  const u = c.unit;
  const axis = (name: 'A' | 'B', ax: typeof c.axisA, blocks: readonly string[] | null, lower: boolean): ResultItem[] => [
    {
      label: `Stack ${name}`,
      value: ax.stackHeight,
      unit: u,
      emphasis: true,
      note: `Under the ${lower ? 'lower' : 'upper'} plate's roll, ${ax.length} ${u} plate`,
    },
    { label: `Angle ${name}`, value: ax.angleDms, unit: '', note: `Achieved ${ax.achievedAngleDeg}°, error ${ax.errorArcSec}″` },
    ...(blocks ? [{ label: `Blocks ${name}`, value: blocks.join(' + ') || 'none', unit: '', note: `${blocks.length} in wringing order, largest first` }] : []),
  ];
  return [
    ...axis('A', c.axisA, o.blocksA, true),
    ...axis('B', c.axisB, o.blocksB, false),
    { label: 'Resultant tilt', value: c.resultantTiltDms, unit: '', note: `${c.resultantTiltDeg}° of the top face from level: cos φ = cos θA · cos θB` },
  ];
}

/** A table row drawn: the bar at the angle the row's stack makes, with its blocks. */
export function tableRowScene(t: SineTableResult, row: SineTableRow): SineBarSceneInput {
  return {
    barLength: Number(t.barLength),
    angleDeg: Number(row.achievedAngleDeg),
    stackHeight: Number(row.stackHeight),
    blocks: (row.blocks ?? []).map((b) => ({ size: Number(b), label: b })),
    labels: { barLength: `L ${t.barLength} ${t.unit}`, stackHeight: `H ${row.stackHeight} ${t.unit}`, angle: row.angleDms },
  };
}

/** One axis of a compound plate drawn as a sine bar seen along the other axis. */
export function compoundAxisScene(c: CompoundSineResult, axis: 'A' | 'B', blocks: readonly string[] | null): SineBarSceneInput {
  const ax = axis === 'A' ? c.axisA : c.axisB;
  return {
    barLength: Number(ax.length),
    angleDeg: Number(ax.achievedAngleDeg),
    stackHeight: Number(ax.stackHeight),
    blocks: (blocks ?? []).map((b) => ({ size: Number(b), label: b })),
    labels: { barLength: `L${axis} ${ax.length} ${c.unit}`, stackHeight: `H${axis} ${ax.stackHeight} ${c.unit}`, angle: ax.angleDms },
  };
}
