import { Dec } from '../calc/decimal-math';

/** Degrees, minutes and seconds of an angle (seconds may carry decimals). */
export interface DmsParts {
  /** -1 for negative angles, otherwise 1. */
  sign: 1 | -1;
  /** Whole degrees. */
  degrees: number;
  /** Whole minutes, 0–59. */
  minutes: number;
  /** Seconds, 0 ≤ s < 60, rounded to the requested decimals. */
  seconds: Dec;
}

/** Result of reading angle text. */
export type AngleParse = { ok: true; degrees: Dec } | { ok: false; error: string };

const NUMBER = String.raw`\d+(?:\.\d*)?|\.\d+`;
/** One number and its optional mark; the mark's group tells degrees (2), minutes (3) or seconds (4). */
const TOKEN = new RegExp(
  String.raw`(${NUMBER})\s*(?:(°|º|˚|degrees?|degs?|d)|(′|’|'(?!')|minutes?|mins?|m)|(″|”|"|''|′′|seconds?|secs?|s))?\s*`,
  'iy',
);

/**
 * Reads an angle typed as decimal degrees ("7.5", 7.5) or degrees-minutes-seconds ("7°30'",
 * "7°30", "7 30", "7d30m", "14°30'15\"", "7:30:15"); a leading "-" or "+" sets the sign. A number
 * without a mark takes the next place after the previous one (degrees first). Minutes and seconds
 * must be below 60 when a larger place is given. Returns decimal degrees.
 */
export function parseAngle(input: unknown): AngleParse {
  if (typeof input === 'number') {
    return Number.isFinite(input) ? { ok: true, degrees: new Dec(input) } : { ok: false, error: 'must be a finite number of degrees' };
  }
  if (typeof input !== 'string') return { ok: false, error: 'must be an angle, e.g. 7.5 or 7°30\'' };
  let text = input.trim().replace(/:/g, ' ');
  if (text === '') return { ok: false, error: 'is empty; type an angle, e.g. 7.5 or 7°30\'' };
  let sign = 1;
  if (text[0] === '-' || text[0] === '+' || text[0] === '−') {
    sign = text[0] === '+' ? 1 : -1;
    text = text.slice(1).trim();
  }
  const bad = { ok: false as const, error: `"${input}" is not an angle; use decimal degrees (7.5) or degrees-minutes-seconds (7°30'15")` };
  const places: (Dec | undefined)[] = [undefined, undefined, undefined];
  let last = -1;
  TOKEN.lastIndex = 0;
  while (TOKEN.lastIndex < text.length) {
    const start = TOKEN.lastIndex;
    const match = TOKEN.exec(text);
    if (!match || TOKEN.lastIndex === start) return bad;
    const place = match[2] ? 0 : match[3] ? 1 : match[4] ? 2 : last + 1;
    if (place <= last || place > 2) return bad;
    // Only the last place may carry decimals: "7.5 30" is ambiguous.
    if (last >= 0 && places[last]?.isInteger() === false) return bad;
    places[place] = new Dec(match[1]);
    last = place;
  }
  if (last < 0) return bad;
  const [d, m, s] = places;
  if (d !== undefined && m?.gte(60)) return { ok: false, error: `minutes must be below 60, got ${m.toString()}` };
  if ((d !== undefined || m !== undefined) && s?.gte(60)) return { ok: false, error: `seconds must be below 60, got ${s.toString()}` };
  const degrees = (d ?? new Dec(0)).plus((m ?? new Dec(0)).div(60)).plus((s ?? new Dec(0)).div(3600));
  return { ok: true, degrees: degrees.mul(sign) };
}

/** Splits decimal degrees into degrees, minutes and seconds rounded to `secondDecimals`. */
export function toDms(degrees: Dec, secondDecimals = 0): DmsParts {
  const sign: 1 | -1 = degrees.isNeg() && !degrees.isZero() ? -1 : 1;
  // Round the total seconds first so 59.6" carries into the next minute.
  const totalSeconds = degrees.abs().mul(3600).toDecimalPlaces(secondDecimals, Dec.ROUND_HALF_UP);
  const wholeMinutes = totalSeconds.div(60).floor();
  const seconds = totalSeconds.minus(wholeMinutes.mul(60));
  const whole = wholeMinutes.toNumber();
  const isZero = totalSeconds.isZero();
  return { sign: isZero ? 1 : sign, degrees: Math.floor(whole / 60), minutes: whole % 60, seconds };
}

/** Formats decimal degrees as D°MM'SS" (e.g. 7°30'00"), seconds to `secondDecimals` places. */
export function formatDms(degrees: Dec, secondDecimals = 0): string {
  const p = toDms(degrees, secondDecimals);
  const mm = String(p.minutes).padStart(2, '0');
  const ss = p.seconds.toFixed(secondDecimals).padStart(secondDecimals > 0 ? 3 + secondDecimals : 2, '0');
  return `${p.sign < 0 ? '-' : ''}${p.degrees}°${mm}'${ss}"`;
}

/** Formats decimal degrees at 0.0001° (the reporting resolution for angles in degrees). */
export function formatDegrees(degrees: Dec, decimals = 4): string {
  const text = degrees.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}
