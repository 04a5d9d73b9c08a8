import { formatDms } from '../angle/angle-text';
import { calculateAngleBlocks } from '../calc/angle-blocks';
import { Dec, asinDeg, fixedText } from '../calc/decimal-math';
import { fewestBlocks, formatBlock, formatStack, resolveBox, type GaugeBox } from '../calc/gauge-stack';
import { calculateSineBar, unmakeableStack } from '../calc/sine-bar';
import { type CalcResult, fail, succeed } from '../calc/step';
import type { TaperResult } from '../calc/taper';
import { ANGLE_BLOCK_SETS } from '../data/angle-block-sets';
import { findGaugeSet } from '../data/gauge-sets';

/** How the part is held at the taper angle. The numbers of the cut do not change with it; the set-up does. */
export type HoldingKind = 'angle-block' | 'sine-plate' | 'tilted-vise';

/** The holding choices with their labels. */
export const HOLDING_OPTIONS: readonly { readonly value: HoldingKind; readonly label: string }[] = [
  { value: 'angle-block', label: 'Angle blocks in the vise' },
  { value: 'sine-plate', label: 'Sine plate on gauge blocks' },
  { value: 'tilted-vise', label: 'Tilting vise' },
];

/** The angle-block sets, for the set picker. */
export const ANGLE_SET_OPTIONS = ANGLE_BLOCK_SETS.map((s) => ({ id: s.id, name: s.name }));

/** Reads the holding control; anything unknown means angle blocks. */
export function holdingKind(value: string): HoldingKind {
  return value === 'sine-plate' || value === 'tilted-vise' ? value : 'angle-block';
}

/** What the drawing needs to show the holding. */
export type HoldingDrawing =
  | { readonly kind: 'angle-block'; readonly blocks: readonly string[] }
  | {
      readonly kind: 'sine-plate';
      /** Roll centre distance of the plate. */
      readonly plateLength: number;
      /** The stack under the free roll, bottom first (one plain piece without a set). */
      readonly blocks: readonly { readonly size: number; readonly label: string }[];
      /** The stack's label ("0.6526 in stack"). */
      readonly stackLabel: string;
      /** The chosen set cannot make the stack: drawn as an outline of the height needed, not as blocks. */
      readonly unmakeable?: boolean;
    }
  | { readonly kind: 'tilted-vise' };

/** The set-up for one holding: what to do, in order, and what to look out for. */
export interface HoldingPlan {
  readonly kind: HoldingKind;
  /** Heading of the set-up list. */
  readonly heading: string;
  /** The steps, in order. */
  readonly instructions: readonly string[];
  /** Notes: a stack the box cannot make, an angle the blocks cannot reach. */
  readonly warnings: readonly string[];
  /** For the drawing. */
  readonly drawing: HoldingDrawing;
}

/** The holding controls of the taper form. */
export interface HoldingValues {
  readonly unit: string;
  readonly holding: string;
  readonly angleSet: string;
  readonly plateLength: string;
  readonly plateSet: string;
}

/** A block's DMS mark without its zero places, for a drawing label ("0°30'00\"" → "30'"). */
export function shortAngle(dms: string): string {
  const m = /^(-?)(\d+)°(\d+)'([\d.]+)"$/.exec(dms);
  if (!m) return dms;
  const [, sign, d, min, sec] = m;
  const parts = [Number(d) ? `${Number(d)}°` : '', Number(min) ? `${Number(min)}'` : '', Number(sec) ? `${Number(sec)}"` : ''].filter(Boolean);
  return sign + (parts.join('') || '0°');
}

/** The last step of every set-up: where the numbers of the cut take over. */
function touchOffStep(r: TaperResult, leadIn = ''): string {
  return `${leadIn ? `${leadIn}, touch` : 'Touch'} the cutter off on the highest corner (the end of the top face), zero the DRO, and feed down ${r.depthToStop} ${r.unit}, taking the passes listed.`;
}

/** Most steps of the box's resolution searched either way for a stack the box can make. */
const NEAREST_SEARCH_STEPS = 2000;

/** A stack the box can make near the one it cannot, and the angle it stands a plate at. */
interface NearStack {
  readonly stack: string;
  readonly blocks: readonly string[];
  readonly angleDms: string;
  /** Signed, arc-seconds, 1 decimal ("+262.7"). */
  readonly errorArcSec: string;
}

/**
 * The stacks nearest `stack` (one shorter, one taller, each shorter than the plate) that the box
 * can make, with the angle each stands a plate of roll distance `plate` at and its error from
 * `wanted` (θ = asin(H / L), REFERENCE.md §2.1). Searched in the box's own step, a bounded way.
 */
function nearestStacks(box: GaugeBox, stack: Dec, plate: Dec, wanted: Dec): NearStack[] {
  const found: NearStack[] = [];
  for (const dir of [-1, 1]) {
    for (let i = 1; i <= NEAREST_SEARCH_STEPS; i++) {
      const h = stack.plus(box.step.mul(i * dir));
      if (h.lte(0) || h.gte(plate)) break;
      const blocks = fewestBlocks(box, h);
      if (!blocks) continue;
      const angle = asinDeg(h.div(plate));
      const error = angle.minus(wanted).mul(3600);
      found.push({
        stack: formatStack(h, box),
        blocks: blocks.map((b) => formatBlock(b, box)),
        angleDms: formatDms(angle, 1),
        errorArcSec: `${error.gte(0) ? '+' : ''}${fixedText(error, 1)}`,
      });
      break;
    }
  }
  return found;
}

/**
 * The set-up for holding the part at the taper's angle: angle blocks from a set (fewest blocks,
 * reversed ones subtract), a sine plate on a gauge-block stack (H = L·sin α, REFERENCE.md §2.1),
 * or a tilting vise set on its scale. Uses the exact angle of the taper answer. A bad holding
 * input fails with the control's name as the field.
 */
export function planHolding(values: HoldingValues, r: TaperResult): CalcResult<HoldingPlan> {
  const kind = holdingKind(values.holding);
  const angle = r.exact.angleDeg;
  if (kind === 'angle-block') {
    const found = calculateAngleBlocks({ set: values.angleSet, angle });
    if (!found.ok) return fail(found.kind, 'Angle blocks', { angleSet: found.fields['set'] ?? Object.values(found.fields)[0] ?? found.error });
    const a = found.value;
    const parts = a.blocks.map((b, i) => (b.direction === 'reverse' ? `− ${b.angle}` : i === 0 ? b.angle : `+ ${b.angle}`));
    const list = parts.join(' ');
    const reversed = a.blocks.some((b) => b.direction === 'reverse');
    return succeed({
      kind,
      heading: 'Set-up on angle blocks',
      instructions: [
        `Wring ${a.count === 1 ? 'the angle block' : `${a.count} angle blocks`}: ${list} = ${a.achievedAngleDms}${reversed ? ' (a “−” block is turned end for end, so it subtracts)' : ''}.`,
        'Stand the blocks on the vise bed or a parallel, thick end under the end to be tapered, and put the part on top.',
        'Close the jaws on the part and tap it down until the blocks cannot be moved under it; clamp firmly.',
        touchOffStep(r),
      ],
      // The engine's own warning already says how near the set comes (and by how much).
      warnings: a.warnings,
      drawing: { kind, blocks: a.blocks.map((b, i) => (b.direction === 'reverse' ? '−' : i === 0 ? '' : '+') + shortAngle(b.angle)) },
    });
  }
  if (kind === 'sine-plate') {
    const plate = calculateSineBar({ unit: values.unit === 'mm' ? 'mm' : 'in', barLength: values.plateLength, angle, set: values.plateSet || undefined });
    if (!plate.ok) {
      const fields: Record<string, string> = {};
      for (const [path, message] of Object.entries(plate.fields)) {
        if (path === 'barLength') fields['plateLength'] = message;
        else if (path === 'set' || path.startsWith('missing')) fields['plateSet'] = message;
        else if (path === 'angle') fields['angle'] = `is too steep for a sine plate: ${message}`;
        else fields[path] = message;
      }
      return fail(plate.kind, 'Sine plate', fields);
    }
    const p = plate.value;
    const blocks = p.blocks ?? [];
    const u = p.unit;
    const drawing: HoldingDrawing = {
      kind,
      plateLength: Number(p.barLength),
      blocks: blocks.length ? blocks.map((b) => ({ size: Number(b), label: b })) : [{ size: Number(p.stackHeight), label: p.stackHeight }],
      stackLabel: `${p.stackHeight} ${u} stack`,
    };
    const box = values.plateSet && p.blocks === null ? resolveBox('Sine plate', { set: values.plateSet, unit: u }) : null;
    if (box?.ok) {
      // The set cannot make the stack. A sine plate's hinge roll stays on its hinge (common
      // practice), so the sine bar's way out — both rolls on equal stacks, the difference built
      // on top — is not open: the steps give the nearest stacks the set can make and the other
      // holdings instead, and the warning says so in place of the sine bar's.
      const setName = findGaugeSet(values.plateSet)?.name ?? 'box';
      const near = nearestStacks(box.value, new Dec(p.stackHeight), new Dec(p.barLength), new Dec(angle));
      const nearText = near.length
        ? `The nearest ${near.length === 1 ? 'stack' : 'stacks'} it can make: ${near.map((n) => `${n.stack} ${u} (${n.blocks.join(' + ')}) stands the plate at ${n.angleDms}, ${n.errorArcSec}″ from the taper angle`).join('; ')}. To use ${near.length === 1 ? 'it' : 'one'}, type its angle as the taper angle so that the depth and the end thickness are worked out for it.`
        : 'No stack near it can be made from this set.';
      return succeed({
        kind,
        heading: 'Set-up on a sine plate',
        instructions: [
          `The ${setName} cannot make the ${p.stackHeight} ${u} stack this angle needs (H = L · sin α for the ${p.barLength} ${u} plate), and a sine plate's hinge roll cannot be raised on a stack of its own to build the difference.`,
          nearText,
          'Otherwise hold the part on angle blocks or in a tilting vise (under “Held on”), or build the stack from a set that has the blocks for it.',
          touchOffStep(r, `Once the part is held at ${r.angleDms}`),
        ],
        warnings: [
          ...p.warnings.filter((w) => w !== unmakeableStack(p.stackHeight, u, true)),
          `The ${setName} cannot make a ${p.stackHeight} ${u} stack, and a sine plate's hinge roll cannot be raised to build the difference on two stacks: change the angle to one the set can make, or hold the part another way (see the set-up).`,
        ],
        drawing: { ...drawing, blocks: [{ size: Number(p.stackHeight), label: p.stackHeight }], stackLabel: `${p.stackHeight} ${u}: not in set`, unmakeable: true },
      });
    }
    return succeed({
      kind,
      heading: 'Set-up on a sine plate',
      instructions: [
        `Wring a ${p.stackHeight} ${u} stack${blocks.length ? `: ${blocks.join(' + ')}` : ''} (H = L · sin α for the ${p.barLength} ${u} plate).`,
        'Set the stack on the base under the free roll; the hinge roll stays where it is.',
        `Lower the plate onto the stack: it stands at ${p.achievedAngleDms} (${p.errorArcSec}″ from the taper angle). Lock the plate.`,
        'Clamp the part to the plate against its end stop, the end to taper toward the raised roll.',
        touchOffStep(r),
      ],
      warnings: p.warnings,
      drawing,
    });
  }
  return succeed({
    kind,
    heading: 'Set-up in a tilting vise',
    instructions: [
      `Tilt the vise body to ${r.angleDms} on its scale and lock it.`,
      'A vise scale reads to about a degree: check the bed with a protractor, or with a sine bar and an indicator, before cutting (common practice).',
      'Clamp the part in the jaws on parallels, tapped down, the end to taper toward the raised end of the vise.',
      touchOffStep(r),
    ],
    warnings: [],
    drawing: { kind },
  });
}
