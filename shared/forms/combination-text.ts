import { toDms } from '../angle/angle-text';
import { Dec } from '../calc/decimal-math';

/** One block of a typed combination: its angle text as typed and whether it is reversed. */
export interface TypedBlock {
  /** The block's angle as typed ("27°", "9'", "30\""). */
  readonly angle: string;
  /** True when written with a minus sign: the block is turned end for end and subtracts. */
  readonly reversed: boolean;
}

/** Result of reading a combination. */
export type CombinationParse = { ok: true; blocks: TypedBlock[] } | { ok: false; error: string };

/** A sign (ASCII or typographic minus) and the text up to the next sign. */
const TERM = /\s*([+\-−–])?\s*([^+\-−–]*)/y;

/**
 * Reads a combination of angle blocks typed as a sum, e.g. `27° − 9° − 1° + 27' + 9' − 1'`: a
 * block written with a minus is reversed (subtracts), the first block may go without a sign.
 * Each block's angle text is kept as typed for the engine to read (decimal degrees or DMS).
 */
export function parseCombination(text: string): CombinationParse {
  const blocks: TypedBlock[] = [];
  const source = text.trim();
  if (!source) return { ok: false, error: 'is empty; type blocks such as 27° − 9° + 30\'' };
  TERM.lastIndex = 0;
  while (TERM.lastIndex < source.length) {
    const at = TERM.lastIndex;
    const match = TERM.exec(source);
    if (!match || TERM.lastIndex === at) break;
    const sign = match[1];
    const angle = match[2].trim();
    if (!angle) return { ok: false, error: `has a sign with no block after it (at "${source.slice(at).trim() || sign}")` };
    if (!sign && blocks.length) return { ok: false, error: `needs + or − between blocks (before "${angle}")` };
    blocks.push({ angle, reversed: sign !== undefined && sign !== '+' });
  }
  return { ok: true, blocks };
}

/** The shortest DMS text of an angle: `27°`, `9′`, `30″`, `1°30′`, `0°09′30″` becomes `9′30″`. */
export function compactAngle(degrees: Dec | string): string {
  const parts = toDms(new Dec(degrees), 0);
  const out: string[] = [];
  if (parts.degrees) out.push(`${parts.degrees}°`);
  if (parts.minutes) out.push(`${parts.minutes}′`);
  if (!parts.seconds.isZero()) out.push(`${parts.seconds.toString()}″`);
  return `${parts.sign < 0 ? '−' : ''}${out.join('') || '0°'}`;
}

/** Writes blocks as a combination text, e.g. `27° − 9° + 27′`. */
export function formatCombination(blocks: readonly { angleDeg: string; reversed: boolean }[]): string {
  return blocks
    .map((b, i) => `${b.reversed ? (i ? '− ' : '−') : i ? '+ ' : ''}${compactAngle(b.angleDeg)}`)
    .join(' ');
}
