import { z } from 'zod';
import { formatDegrees, formatDms } from '../angle/angle-text';
import { MAX_LENGTH, latheTaperRequestSchema, optional, parseRequest, type LatheTaperRequest } from '../api/calc';
import { findMachineTaper, MACHINE_TAPERS, type MachineTaper } from '../data/machine-tapers';
import { convertLength, formatLength, type LengthUnit } from '../units/length-unit';
import { Dec, EXACT_DIGITS, atanDeg, exactText, fixedText, tanDeg } from './decimal-math';
import { guarded, impossible, invalid, step, succeed, type CalcResult, type Step } from './step';

/**
 * Lathe tapers (REFERENCE.md §4.1): with D and d the large and small diameters over length l,
 * the diametral taper per unit length is k = (D − d)/l (taper per inch); TPF = 12·k; ratio 1:(1/k);
 * half angle (compound setting) α/2 = atan(k/2) = atan(TPF/24); included angle α = 2·atan(TPF/24)
 * (Jones, Turning and Boring; lathes.co.uk FAQ; US Army OD1645). Tail-stock offset for a work
 * length L between centres: TPF·L/24 = k·L/2 (Rose, Modern Machine Shop Practice; US Navy
 * "Using the Compound Rest").
 */

/** Diameter at a station along the taper. */
export interface TaperStation {
  /** Distance from the large end. */
  distance: string;
  /** Diameter there. */
  diameter: string;
}

/** Answer of {@link calculateLatheTaper}. Lengths in the request's unit. */
export interface LatheTaperResult {
  /** Unit of the lengths. */
  unit: LengthUnit;
  /** Diametral taper per foot (in/ft; for mm work the same ratio × 12), 5 decimals. */
  taperPerFoot: string;
  /** Diametral taper per unit length (in/in or mm/mm), 6 decimals. */
  taperPerInch: string;
  /** Taper ratio as "1:x" (x to 3 decimals). */
  ratio: string;
  /** Included angle, decimal degrees. */
  includedAngleDeg: string;
  /** Included angle, DMS. */
  includedAngleDms: string;
  /** Half angle (compound-rest setting from the axis), decimal degrees. */
  halfAngleDeg: string;
  /** Half angle, DMS. */
  halfAngleDms: string;
  /** Large diameter, when known. */
  largeDiameter: string | null;
  /** Small diameter, when known. */
  smallDiameter: string | null;
  /** Taper length, when known. */
  length: string | null;
  /** Tail-stock offset for the work length, when given. */
  tailstockOffset: string | null;
  /** Diameters at the requested stations. */
  stations: TaperStation[];
  /** The standard taper used, when one was named. */
  standard: MachineTaper | null;
  /** Notes. */
  warnings: string[];
  /** Published cautions. */
  cautions: string[];
  /** The derivation. */
  steps: Step[];
  /** Full-precision values. */
  exact: { taperPerFoot: string; includedAngleDeg: string; halfAngleDeg: string; tailstockOffset: string | null };
}

/** Published cautions for taper turning (REFERENCE.md §7.4, §7.7). */
export const LATHE_TAPER_CAUTIONS: readonly string[] = [
  'After turning a taper by offsetting the tail stock, set the tail stock back on centre (US Navy training manual, "Using the Compound Rest").',
  'Tapers must be kept free of dirt, chips, nicks and burrs, and free of oil, or they will not hold (US Army OD1645).',
  'Do not measure work while the lathe is turning; let the chuck stop on its own (US Army TM 1-1500-204-23-8).',
];

const AREA = 'Lathe taper';

/** "1:20", " 1 : 20 ", "7:24", "1:0.5". */
const RATIO_TEXT = /^\s*(\d+(?:\.\d*)?|\.\d+)\s*:\s*(\d+(?:\.\d*)?|\.\d+)\s*$/;
/** "20", " 20.5 ". */
const BARE_NUMBER = /^\s*[+-]?(\d+(\.\d*)?|\.\d+)\s*$/;

/**
 * A taper ratio as the trade writes it, "1:20" or "1 : 20" (diameter change 1 over length 20; "7:24"
 * works too), or a bare number x read as 1:x (20 → 1:20). A bare number below 1 is refused: 0.05
 * would be 1:0.05, a 168.58° cone, where the sender almost surely meant 1:20 (0.05 as the taper per
 * unit length). Parsed as the two sides a:b.
 */
export const taperRatioValue = z
  .union([z.number(), z.string()], { error: 'must be a taper ratio such as "1:20"' })
  .transform((value, ctx) => {
    const refuse = (message: string) => {
      ctx.addIssue({ code: 'custom', message });
      return z.NEVER;
    };
    const sides = typeof value === 'string' ? RATIO_TEXT.exec(value) : null;
    if (sides) {
      const [a, b] = [new Dec(sides[1]), new Dec(sides[2])];
      if (a.lte(0) || b.lte(0)) return refuse(`must have both sides greater than 0, such as "1:20", got "${sides[0].trim()}"`);
      if (b.div(a).gt(MAX_LENGTH)) return refuse(`must be at most 1:${MAX_LENGTH}`);
      return { a, b };
    }
    if (typeof value === 'string' && !BARE_NUMBER.test(value)) {
      return refuse(`must be a taper ratio such as "1:20" (a diameter change of 1 over a length of 20), got "${value.trim()}"`);
    }
    const x = new Dec(typeof value === 'string' ? value.trim() : value);
    if (!x.isFinite() || x.lte(0)) return refuse('must be a taper ratio such as "1:20"; a bare number x means 1:x and must be greater than 0');
    if (x.gt(MAX_LENGTH)) return refuse(`must be at most 1:${MAX_LENGTH}`);
    if (x.lt(1)) {
      const text = x.toString();
      const meant = new Dec(1).div(x).toDecimalPlaces(3).toString();
      return refuse(
        `is unclear as a bare number below 1: ${text} would be read as 1:${text}, a diameter change of 1 over a length of ${text}. ` +
          `Write the ratio with its colon ("1:${meant}" for a taper of 1 in ${meant}, or "1:${text}" if that is meant), or give ${text} as the taper per inch`,
      );
    }
    return { a: new Dec(1), b: x };
  });

/**
 * The lathe-taper request as the engine (and so POST /api/calc/lathe-taper) reads it: the shared
 * schema, with the ratio read as the trade writes it ({@link taperRatioValue}).
 */
export const latheTaperEngineSchema = latheTaperRequestSchema.extend({
  ratio: optional(taperRatioValue).describe(
    'Taper ratio as the trade writes it: "1:20" (diameter change 1 over length 20), "1 : 20" or "7:24". A bare number x means 1:x (20 → 1:20); one below 1 is refused as unclear (write "1:0.5", or send the taper per inch).',
  ),
});

/**
 * Most tail stocks set over about 1/2 in (13 mm) at most (common practice, from memory: the
 * set-over scale on the tail stock rarely reads further). Past it, the compound rest or a taper
 * attachment turns the taper.
 */
export const TAILSTOCK_OFFSET_LIMIT_IN = new Dec('0.5');

/**
 * Half angle (the tilt of the work on the centres), degrees, above which the offset method is not
 * used: the centres then bear on the edges of the centre holes (common practice, from memory: the
 * offset method is for slight tapers, up to about 10° included).
 */
export const OFFSET_HALF_ANGLE_LIMIT = new Dec(5);

/**
 * Included angle, degrees, above which a "taper" is a very flat cone, nearer a face than a taper:
 * the flattest cones in common use, drill points and countersinks, stay below about 140° (common
 * practice, from memory).
 */
export const FLAT_CONE_INCLUDED_ANGLE = new Dec(150);

/** The ways of giving the taper, in words for messages. */
const DEFINER_WORDS = {
  taperPerFoot: 'the taper per foot',
  taperPerInch: 'the taper per inch',
  ratio: 'the ratio',
  includedAngle: 'the included angle',
  halfAngle: 'the half angle',
  standard: 'the standard taper',
} as const;

/**
 * Converts and completes a lathe taper: give one of taperPerFoot, taperPerInch, ratio,
 * includedAngle, halfAngle or standard (optionally with two of largeDiameter, smallDiameter,
 * length to find the third), or all three of largeDiameter, smallDiameter and length.
 * With workLength, the tail-stock offset; with stations, the diameter at each.
 */
export function calculateLatheTaper(input: LatheTaperRequest | unknown): CalcResult<LatheTaperResult> {
  return guarded<LatheTaperResult>(AREA, () => {
    const parsed = parseRequest(AREA, latheTaperEngineSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    const unit = p.unit;
    const len = (x: Dec) => formatLength(x, unit);
    const steps: Step[] = [];
    // A metric job reads the taper per mm of length and as a ratio, never per inch or per foot.
    const metric = unit === 'mm';
    const perUnit = metric ? 'Taper per mm of length' : 'Taper per inch';
    const definers = (['taperPerFoot', 'taperPerInch', 'ratio', 'includedAngle', 'halfAngle', 'standard'] as const).filter((f) => p[f] !== undefined);
    if (definers.length > 1) return invalid(AREA, definers[1], `conflicts with ${DEFINER_WORDS[definers[0]]}: define the taper one way only`);
    let D = p.largeDiameter;
    let d = p.smallDiameter;
    let l = p.length;
    let k: Dec;
    let standard: MachineTaper | null = null;
    const definer = definers[0];
    if (definer === undefined) {
      if (!D || !d || !l) {
        const missing = !D ? 'largeDiameter' : !d ? 'smallDiameter' : 'length';
        return invalid(AREA, missing, 'is required: give the taper (as a taper per foot, an angle, a ratio or a standard taper) or both diameters and the length');
      }
      if (D.lte(d)) return invalid(AREA, 'largeDiameter', 'must be larger than the small diameter');
      k = D.minus(d).div(l);
      steps.push(step(perUnit, 'k = (D − d) / l', `k = (${len(D)} − ${len(d)}) / ${len(l)}`, fixedText(k, 6), `${unit}/${unit}`));
    } else {
      if (D && d && l) return invalid(AREA, 'length', 'leave one of the large diameter, small diameter and taper length empty when the taper is given');
      if (definer === 'taperPerFoot') {
        k = (p.taperPerFoot as Dec).div(12);
        steps.push(step(perUnit, 'k = TPF / 12', `k = ${(p.taperPerFoot as Dec).toString()} / 12`, fixedText(k, 6), `${unit}/${unit}`));
      } else if (definer === 'taperPerInch') {
        k = p.taperPerInch as Dec;
      } else if (definer === 'ratio') {
        const { a, b } = p.ratio as { a: Dec; b: Dec };
        k = a.div(b);
        steps.push(step(perUnit, 'k = a / b (ratio a:b)', `k = ${a.toString()} / ${b.toString()}`, fixedText(k, 6), `${unit}/${unit}`));
      } else if (definer === 'includedAngle') {
        k = tanDeg((p.includedAngle as Dec).div(2)).mul(2);
        steps.push(step(perUnit, 'k = 2 · tan(α / 2)', `k = 2 · tan(${formatDms(p.includedAngle as Dec)} / 2)`, fixedText(k, 6), `${unit}/${unit}`));
      } else if (definer === 'halfAngle') {
        k = tanDeg(p.halfAngle as Dec).mul(2);
        steps.push(step(perUnit, 'k = 2 · tan(α/2)', `k = 2 · tan ${formatDms(p.halfAngle as Dec)}`, fixedText(k, 6), `${unit}/${unit}`));
      } else {
        standard = findMachineTaper(p.standard as string) ?? null;
        if (!standard) return invalid(AREA, 'standard', `unknown taper "${p.standard}"; see GET /api/calc/machine-tapers`);
        k = new Dec(standard.taperPerFoot).div(12);
        steps.push(step(`${perUnit} (${standard.name})`, 'k = TPF / 12', `k = ${standard.taperPerFoot} / 12`, fixedText(k, 6), `${unit}/${unit}`));
        if (!D && !d && !l) {
          const from = (x: string | null) => (x === null ? undefined : convertLength(new Dec(x), standard!.unit, unit));
          D = from(standard.largeDiameter);
          d = from(standard.smallDiameter);
          l = from(standard.length);
          if (D && d && l) {
            // A length from a primary table (Morse plug depth, Jarno N/2) is shown as published: worked
            // back from diameters rounded to 0.001 in it can miss by 0.0001 in (Morse No. 5: 5.1876).
            // A secondary table's lengths (Brown & Sharpe, to 0.01 in) are coarser than its diameters,
            // so those are worked out below.
            if (standard.status === 'published') {
              steps.push(step('Taper length', `l (${standard.name}, as published)`, `l = ${standard.length} ${standard.unit}`, len(l), unit));
            } else {
              l = undefined;
            }
          }
        }
      }
      if (D && d && !l) {
        if (D.lte(d)) return invalid(AREA, 'largeDiameter', 'must be larger than the small diameter');
        l = D.minus(d).div(k);
        steps.push(step('Taper length', 'l = (D − d) / k', `l = (${len(D)} − ${len(d)}) / ${fixedText(k, 6)}`, len(l), unit));
      } else if (D && l && !d) {
        d = D.minus(k.mul(l));
        if (d.lte(0)) return impossible(AREA, 'length', `is too long: the taper would come to a point before ${len(l)} ${unit}`);
        steps.push(step('Small diameter', 'd = D − k · l', `d = ${len(D)} − ${fixedText(k, 6)} · ${len(l)}`, len(d), unit));
      } else if (d && l && !D) {
        D = d.plus(k.mul(l));
        steps.push(step('Large diameter', 'D = d + k · l', `D = ${len(d)} + ${fixedText(k, 6)} · ${len(l)}`, len(D), unit));
      }
    }
    const tpf = k.mul(12);
    const half = atanDeg(k.div(2));
    const included = half.mul(2);
    const ratio = `1:${fixedText(new Dec(1).div(k), 3)}`;
    if (metric) {
      // Metric drawings give a taper as a ratio 1:x; the angles follow from k itself.
      if (definer !== 'ratio') steps.push(step('Taper ratio', '1 : x, x = 1 / k', `x = 1 / ${fixedText(k, 6)}`, ratio, ''));
      steps.push(step('Half angle (compound setting)', 'α/2 = atan(k / 2)', `α/2 = atan(${fixedText(k, 6)} / 2)`, formatDegrees(half), '°'));
      steps.push(step('Included angle', 'α = 2 · atan(k / 2)', `α = 2 · atan(${fixedText(k, 6)} / 2)`, formatDegrees(included), '°'));
    } else {
      // A taper given by its taper per foot (or a standard's) needs no step back to it.
      if (definer !== 'taperPerFoot' && definer !== 'standard') steps.push(step('Taper per foot', 'TPF = 12 · k', `TPF = 12 · ${fixedText(k, 6)}`, fixedText(tpf, 5), 'in/ft'));
      steps.push(step('Half angle (compound setting)', 'α/2 = atan(TPF / 24)', `α/2 = atan(${fixedText(tpf, 5)} / 24)`, formatDegrees(half), '°'));
      steps.push(step('Included angle', 'α = 2 · atan(TPF / 24)', `α = 2 · atan(${fixedText(tpf, 5)} / 24)`, formatDegrees(included), '°'));
    }
    let offset: Dec | null = null;
    const warnings: string[] = [];
    // The limits below are compared without the last digits' noise: 10° in comes back 10.000…01°.
    const settledHalf = half.toSignificantDigits(EXACT_DIGITS);
    if (p.workLength) {
      offset = k.mul(p.workLength).div(2);
      steps.push(step('Tail-stock offset', metric ? 'offset = k · L / 2' : 'offset = TPF · L / 24 = k · L / 2', `offset = ${fixedText(k, 6)} · ${len(p.workLength)} / 2`, len(offset), unit));
      if (l && p.workLength.lt(l)) warnings.push('The work length between centres is shorter than the taper length.');
      if (offset.toSignificantDigits(EXACT_DIGITS).gt(convertLength(TAILSTOCK_OFFSET_LIMIT_IN, 'in', unit))) {
        warnings.push(
          `The tail-stock offset, ${len(offset)} ${unit}, is more than a tail stock can usually be set over (about ${metric ? '13 mm' : '1/2 in'}, common practice): turn this taper with the compound rest or a taper attachment.`,
        );
      }
      if (settledHalf.gt(OFFSET_HALF_ANGLE_LIMIT)) {
        warnings.push(
          `At ${formatDms(included)} included the taper is too steep for the tail-stock offset method: the work would lean about ${formatDms(half)} on the centres and bear on the edges of its centre holes. Turn it with the compound rest (common practice: the offset method is for slight tapers, up to about 10° included).`,
        );
      }
    }
    if (settledHalf.mul(2).gt(FLAT_CONE_INCLUDED_ANGLE)) {
      const read = definer === 'ratio' ? ` The ratio ${ratio} means a diameter change of 1 over a length of ${fixedText(new Dec(1).div(k), 3)}; a taper of 1 in 20 is written 1:20.` : '';
      warnings.push(`An included angle of ${formatDms(included)} is a very flat cone, nearer a face than a taper (common cones stay below about 140°): check the taper was meant this way.${read}`);
    }
    const stations: TaperStation[] = [];
    if (p.stations && p.stations.length > 0) {
      if (!D) return invalid(AREA, 'stations', 'need the large diameter: give it, or the small diameter and the taper length');
      for (const x of p.stations) {
        const dia = D.minus(k.mul(x));
        if (dia.lte(0)) return impossible(AREA, 'stations', `${len(x)} ${unit} from the large end is past the point of the taper`);
        if (l && x.gt(l)) warnings.push(`Station ${len(x)} ${unit} is beyond the taper length ${len(l)} ${unit}.`);
        stations.push({ distance: len(x), diameter: len(dia) });
      }
      steps.push(step('Diameter along the taper', 'd(x) = D − k · x', `D = ${len(D)}, k = ${fixedText(k, 6)}`, `${stations.length} stations`, unit));
    }
    return succeed({
      unit,
      taperPerFoot: fixedText(tpf, 5),
      taperPerInch: fixedText(k, 6),
      ratio,
      includedAngleDeg: formatDegrees(included),
      includedAngleDms: formatDms(included),
      halfAngleDeg: formatDegrees(half),
      halfAngleDms: formatDms(half),
      largeDiameter: D ? len(D) : null,
      smallDiameter: d ? len(d) : null,
      length: l ? len(l) : null,
      tailstockOffset: offset ? len(offset) : null,
      stations,
      standard,
      warnings,
      cautions: [...LATHE_TAPER_CAUTIONS],
      steps,
      exact: { taperPerFoot: exactText(tpf), includedAngleDeg: exactText(included), halfAngleDeg: exactText(half), tailstockOffset: offset ? exactText(offset) : null },
    });
  });
}

/** All standard machine tapers (for pickers). */
export function listMachineTapers(): readonly MachineTaper[] {
  return MACHINE_TAPERS;
}
