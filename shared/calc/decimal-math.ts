import DecimalBase from 'decimal.js';

/**
 * The decimal type used by every calculation: 40 significant digits, plain (non-exponential)
 * text for any value a workshop will meet.
 */
export const Dec = DecimalBase.clone({ precision: 40, rounding: DecimalBase.ROUND_HALF_UP, toExpNeg: -40, toExpPos: 40 });

/** A decimal value of the calculation precision. */
export type Dec = InstanceType<typeof Dec>;

/** Anything `Dec` accepts. */
export type DecInput = Dec | number | string;

/** π to the working precision. */
export const PI: Dec = Dec.acos(-1);

const HALF_PI = PI.div(2);
const DEG_PER_RAD = new Dec(180).div(PI);
const RAD_PER_DEG = PI.div(180);

/** Significant digits kept in the `exact` values returned to callers. */
export const EXACT_DIGITS = 30;

/** Makes a decimal from a number or decimal text. */
export function dec(value: DecInput): Dec {
  return new Dec(value);
}

/** Degrees to radians. */
export function toRadians(degrees: Dec): Dec {
  return degrees.mul(RAD_PER_DEG);
}

/** Radians to degrees. */
export function toDegrees(radians: Dec): Dec {
  return radians.mul(DEG_PER_RAD);
}

/** 1/n! for the short series below. */
const INV_FACTORIAL: Dec[] = (() => {
  const out: Dec[] = [new Dec(1)];
  for (let n = 1; n <= 9; n++) out.push(out[n - 1].div(n));
  return out;
})();

const RAD_PER_MINUTE = RAD_PER_DEG.div(60);
const TINY = new Dec('1e-39');
const RAD_PER_MINUTE_NUMBER = RAD_PER_MINUTE.toNumber();
const MINUTES_PER_QUADRANT = 5400;

/** sin/cos of whole arc-minutes 0…5400 (0°…90°), filled one degree at a time on first use. */
const minuteSin: Dec[] = [];
const minuteCos: Dec[] = [];

let wholeDegrees: { sin: Dec[]; cos: Dec[] } | undefined;

/** sin/cos of 0°…90° by rotating 1° at a time: 90 steps cost far less than 90 series and lose only a few units in the 39th digit. */
function wholeDegreeTable(): { sin: Dec[]; cos: Dec[] } {
  if (!wholeDegrees) {
    const s1 = Dec.sin(RAD_PER_DEG);
    const c1 = Dec.cos(RAD_PER_DEG);
    const sin = [new Dec(0)];
    const cos = [new Dec(1)];
    for (let d = 1; d <= 90; d++) {
      sin.push(sin[d - 1].mul(c1).plus(cos[d - 1].mul(s1)));
      cos.push(cos[d - 1].mul(c1).minus(sin[d - 1].mul(s1)));
    }
    wholeDegrees = { sin, cos };
  }
  return wholeDegrees;
}

const SIN_ONE_MINUTE = Dec.sin(RAD_PER_MINUTE);
const COS_ONE_MINUTE = Dec.cos(RAD_PER_MINUTE);

function fillDegree(degree: number): void {
  const first = degree * 60;
  const table = wholeDegreeTable();
  let sin = table.sin[degree];
  let cos = table.cos[degree];
  minuteSin[first] = sin;
  minuteCos[first] = cos;
  if (degree === 90) return;
  // Rotate by 1′ at a time within the degree.
  for (let m = 1; m < 60; m++) {
    [sin, cos] = [sin.mul(COS_ONE_MINUTE).plus(cos.mul(SIN_ONE_MINUTE)), cos.mul(COS_ONE_MINUTE).minus(sin.mul(SIN_ONE_MINUTE))];
    minuteSin[first + m] = sin;
    minuteCos[first + m] = cos;
  }
}

/** sin and cos of a whole number of arc-minutes in the first quadrant (0…5400). */
function quadrantMinute(m: number): { sin: Dec; cos: Dec } {
  if (minuteSin[m] === undefined) fillDegree(Math.floor(m / 60));
  return { sin: minuteSin[m], cos: minuteCos[m] };
}

/**
 * sin and cos of an angle in radians.
 *
 * decimal.js's `sin` costs 0.1–0.3 ms at 40 digits; a sine-bar table needs thousands. The angle
 * is split into a whole number of arc-minutes k (from a table filled lazily) and a remainder
 * |b| ≤ 0.5′ where the Taylor series is below 1e-44 after 9 terms; then the sum formulas
 * sin(k + b) = sin k·cos b + cos k·sin b and cos(k + b) = cos k·cos b − sin k·sin b.
 */
export function sinCosRad(x: Dec): { sin: Dec; cos: Dec } {
  // Whole minutes in double precision: an off-by-one near a half minute only makes |b| a hair
  // over 0.5′, which the series below still covers.
  const k = Math.round(x.toNumber() / RAD_PER_MINUTE_NUMBER);
  if (!Number.isSafeInteger(k)) throw new Error(`sinCosRad: angle ${x.toString()} rad is out of range`);
  const b = x.minus(RAD_PER_MINUTE.mul(k));
  const full = MINUTES_PER_QUADRANT * 4;
  const whole = ((k % full) + full) % full;
  const quadrant = Math.floor(whole / MINUTES_PER_QUADRANT);
  const base = quadrantMinute(whole % MINUTES_PER_QUADRANT);
  let sinK = base.sin;
  let cosK = base.cos;
  if (quadrant === 1) [sinK, cosK] = [cosK, sinK.neg()];
  else if (quadrant === 2) [sinK, cosK] = [sinK.neg(), cosK.neg()];
  else if (quadrant === 3) [sinK, cosK] = [cosK.neg(), sinK];
  // Whole minutes (a sine table) leave only rounding noise in b: skip the series.
  if (b.abs().lt(TINY)) return { sin: sinK, cos: cosK };
  let power = b;
  let sinB = b;
  let cosB = new Dec(1);
  for (let n = 2; n <= 9; n++) {
    power = power.mul(b);
    const term = power.mul(INV_FACTORIAL[n]);
    // Signs: cos b = 1 − b²/2! + b⁴/4! − …, sin b = b − b³/3! + b⁵/5! − …
    if (n % 2 === 0) cosB = n % 4 === 0 ? cosB.plus(term) : cosB.minus(term);
    else sinB = n % 4 === 1 ? sinB.plus(term) : sinB.minus(term);
  }
  return { sin: sinK.mul(cosB).plus(cosK.mul(sinB)), cos: cosK.mul(cosB).minus(sinK.mul(sinB)) };
}

/** Sine of an angle in degrees. */
export function sinDeg(degrees: Dec): Dec {
  return sinCosRad(toRadians(degrees)).sin;
}

/** Cosine of an angle in degrees. */
export function cosDeg(degrees: Dec): Dec {
  return sinCosRad(toRadians(degrees)).cos;
}

/** Tangent of an angle in degrees (callers keep the angle away from 90°). */
export function tanDeg(degrees: Dec): Dec {
  const { sin, cos } = sinCosRad(toRadians(degrees));
  return sin.div(cos);
}

/**
 * Arc sine in radians for -1 ≤ x ≤ 1.
 *
 * decimal.js's own `asin` takes about 1 ms at 40 digits, too slow for a 3 600-row table, so this
 * starts from the double-precision estimate (≈16 correct digits) and applies one Halley step on
 * f(θ) = sin θ − x, which triples the correct digits (cubic convergence) to beyond the working
 * precision. Above 0.75 the complementary form π/2 − asin(√(1 − x²)) keeps cos θ away from 0.
 */
export function asinRad(x: Dec): Dec {
  if (x.isZero()) return new Dec(0);
  if (x.isNeg()) return asinRad(x.neg()).neg();
  if (x.gte(1)) return HALF_PI;
  if (x.gt(0.75)) return HALF_PI.minus(asinRad(Dec.sqrt(new Dec(1).minus(x.mul(x)))));
  // Math.asin is within about 2e-16 (relative) here, so one cubic step lands below 1e-45.
  const theta = new Dec(Math.asin(x.toNumber()));
  const { sin: s, cos: c } = sinCosRad(theta);
  const f = s.minus(x);
  // Halley: θ₁ = θ₀ − 2·f·f′ / (2·f′² − f·f″), with f′ = cos θ, f″ = −sin θ.
  return theta.minus(f.mul(c).mul(2).div(c.mul(c).mul(2).plus(f.mul(s))));
}

/** Arc sine in degrees. */
export function asinDeg(x: Dec): Dec {
  return toDegrees(asinRad(x));
}

/** Arc cosine in degrees for -1 ≤ x ≤ 1. */
export function acosDeg(x: Dec): Dec {
  return toDegrees(HALF_PI.minus(asinRad(x)));
}

/** Arc tangent in degrees (any real argument). */
export function atanDeg(y: Dec): Dec {
  return toDegrees(asinRad(y.div(Dec.sqrt(y.mul(y).plus(1)))));
}

/** Square root. */
export function sqrt(x: Dec): Dec {
  return Dec.sqrt(x);
}

/** Full-precision text of a value (30 significant digits, no exponent). */
export function exactText(value: Dec): string {
  return value.toSignificantDigits(EXACT_DIGITS).toString();
}

/**
 * Fixed-point text with the given number of decimals (half-up, no "-0"). The value is first taken
 * to the 30 significant digits of an exact value, so the trig's noise in the 40th digit cannot
 * turn an exact half (0.28125 from cos 60° = 0.4999…9) into a value that rounds down.
 */
export function fixedText(value: Dec, decimals: number): string {
  const text = value.toSignificantDigits(EXACT_DIGITS).toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}
