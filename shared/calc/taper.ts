import { formatDegrees, formatDms } from '../angle/angle-text';
import { parseRequest, taperRequestSchema, type TaperRequest } from '../api/calc';
import { UNIT_DECIMALS, formatLength, unitResolution, type LengthUnit } from '../units/length-unit';
import { Dec, atanDeg, exactText, sinDeg, sqrt, tanDeg, cosDeg } from './decimal-math';
import { guarded, impossible, invalid, step, succeed, type CalcResult, type Step } from './step';

/**
 * Taper (or chamfer) milled with the work tilted on an angle block, sine plate or tilted vise so
 * that the sloped face is cut horizontally.
 *
 * Geometry (REFERENCE.md §1, plain right-triangle geometry): the part of thickness T lies on its
 * base; the taper starts on the top face at distance L (taper length) from the end and makes the
 * angle α with the top face. Then d = L·tan α is removed at the end (square to the top face),
 * t = T − d remains, the sloped face is F = L / cos α = √(L² + d²) long (the aligned dimension),
 * and with the face set horizontal the cutter goes down h = L·sin α from touching off on the
 * highest corner (the top edge at the end) — h is what this calculation calls the depth to stop.
 */

/** One pass of the cut. */
export interface TaperPass {
  /** 1-based pass number. */
  pass: number;
  /** Depth taken on this pass. */
  cut: string;
  /** DRO / quill reading after this pass, measured down from the touch-off point. */
  reading: string;
}

/** Answer of {@link calculateTaper}; lengths are decimal text at the unit's resolution. */
export interface TaperResult {
  /** Unit of every length. */
  unit: LengthUnit;
  /** 'taper' or 'chamfer'. */
  shape: 'taper' | 'chamfer';
  /** Angle α between the sloped face and the top face, decimal degrees (0.0001°). */
  angleDeg: string;
  /** α as degrees-minutes-seconds, nearest second. */
  angleDms: string;
  /** Stock thickness T (null for a chamfer given without one). */
  thickness: string | null;
  /** L: where the taper starts, measured from the end along the top face (chamfer: leg on the top face). */
  taperLength: string;
  /** t = T − d: thickness left at the end, to read with a micrometer (null without T). */
  endThickness: string | null;
  /** F: length of the sloped face (aligned dimension), to read with a scale. */
  faceLength: string;
  /** h = L·sin α: cutter travel from touching off on the highest corner, face set horizontal. */
  depthToStop: string;
  /** d = L·tan α: stock removed at the end, square to the top face (chamfer: leg on the end face). */
  removedAtEnd: string;
  /** Table travel to sweep the face: F, plus the cutter diameter when given. */
  tableTravel: string;
  /** Passes for the given depth per pass (empty when none was given). */
  passes: TaperPass[];
  /** Feasibility warnings, one sentence each. */
  warnings: string[];
  /** Safety cautions for the set-up, with their source. */
  cautions: string[];
  /** The derivation. */
  steps: Step[];
  /** Full-precision values (30 significant digits). */
  exact: { angleDeg: string; taperLength: string; endThickness: string | null; faceLength: string; depthToStop: string; removedAtEnd: string };
}

const AREA = 'Taper';
const MAX_PASSES = 1000;

/** Published cautions for milling on an angled set-up (REFERENCE.md §7.1–7.2). */
export const MILLING_CAUTIONS: readonly string[] = [
  'Clamp the work and what holds it at the angle (angle blocks, sine plate or vise) securely before the table moves toward the cutter; make adjustments and measurements only with the spindle and work stopped (Michigan Admin. Code R 408.12640 "Milling").',
  'Keep the table, vise, block and work clean and free of chips, nicks and burrs; do not change feed or speed while cutting (US Army TM 1-1500-204-23-8, machine-tool safety).',
  'Follow your shop rules and local regulations on guards and eye protection; take light cuts on a tilted set-up and deburr the sharp edge the taper leaves.',
];

/**
 * Plans a taper or chamfer: from the thickness and any two of angle, taperLength, endThickness
 * (or removedAtEnd) and faceLength, finds the other two, the depth to stop, the stock removed at
 * the end, the table travel and the passes. Never throws: bad input gives `{ok: false}`.
 */
export function calculateTaper(input: TaperRequest | unknown): CalcResult<TaperResult> {
  return guarded<TaperResult>(AREA, () => {
    const parsed = parseRequest(AREA, taperRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    const unit = p.unit;
    const shape = p.shape ?? 'taper';
    const len = (x: Dec) => formatLength(x, unit);
    /** Whether a length reads zero at the unit's resolution (0.0000 in, 0.000 mm). */
    const readsZero = (x: Dec) => new Dec(len(x)).isZero();
    /**
     * Two lengths for a message, each at the unit's resolution; when they would read the same
     * there, each is carried (up to 8 places) to where they differ, with no trailing zeros past the
     * resolution: 1.00004 against 1.0000, not 1.00000.
     */
    const apart = (a: Dec, b: Dec): [string, string] => {
      if (len(a) !== len(b) || a.eq(b)) return [len(a), len(b)];
      let places = UNIT_DECIMALS[unit];
      while (places < 8 && a.toFixed(places) === b.toFixed(places)) places += 1;
      const shown = (x: Dec) => {
        let p = places;
        while (p > UNIT_DECIMALS[unit] && new Dec(x.toFixed(p - 1)).eq(x.toFixed(p))) p -= 1;
        return x.toFixed(p);
      };
      return [shown(a), shown(b)];
    };
    const T = p.thickness;
    if (shape === 'taper' && !T) return invalid(AREA, 'thickness', 'is required for a taper');
    if (p.endThickness && p.removedAtEnd) return invalid(AREA, 'removedAtEnd', 'give endThickness or removedAtEnd, not both');
    if (p.endThickness && !T) return invalid(AREA, 'thickness', 'is required when endThickness is given');
    if (T && p.endThickness && p.endThickness.gte(T)) {
      return impossible(AREA, 'endThickness', `must be less than the thickness ${apart(T, p.endThickness)[0]} ${unit}`);
    }
    const given = { angle: p.angle, taperLength: p.taperLength, removed: p.removedAtEnd ?? (p.endThickness && T ? T.minus(p.endThickness) : undefined), faceLength: p.faceLength };
    const names = ['angle', 'taperLength', shape === 'chamfer' ? 'removedAtEnd' : 'endThickness', 'faceLength'];
    const count = Object.values(given).filter((v) => v !== undefined).length;
    if (count !== 2) {
      const field = count < 2 ? 'body' : 'faceLength';
      return invalid(AREA, field, `give exactly two of ${names.join(', ')} (got ${count})`);
    }

    const steps: Step[] = [];
    let L: Dec;
    let d: Dec;
    let alpha: Dec;
    const { angle: a, taperLength: l, removed: r, faceLength: f } = given;
    if (r && p.endThickness && T) {
      steps.push(step('Stock removed at the end', 'd = T − t', `d = ${len(T)} − ${len(p.endThickness)}`, len(r), unit));
    }
    if (a && l) {
      alpha = a;
      L = l;
      d = L.mul(tanDeg(alpha));
      steps.push(step('Stock removed at the end', 'd = L · tan α', `d = ${len(L)} · tan ${formatDms(alpha)}`, len(d), unit));
    } else if (a && r) {
      alpha = a;
      d = r;
      L = d.div(tanDeg(alpha));
      steps.push(step('Taper length', 'L = d / tan α', `L = ${len(d)} / tan ${formatDms(alpha)}`, len(L), unit));
    } else if (a && f) {
      alpha = a;
      L = f.mul(cosDeg(alpha));
      d = f.mul(sinDeg(alpha));
      steps.push(step('Taper length', 'L = F · cos α', `L = ${len(f)} · cos ${formatDms(alpha)}`, len(L), unit));
      steps.push(step('Stock removed at the end', 'd = F · sin α', `d = ${len(f)} · sin ${formatDms(alpha)}`, len(d), unit));
    } else if (l && r) {
      L = l;
      d = r;
      alpha = atanDeg(d.div(L));
      steps.push(step('Angle', 'α = atan(d / L)', `α = atan(${len(d)} / ${len(L)})`, formatDegrees(alpha), '°'));
    } else if (l && f) {
      if (f.lte(l)) return impossible(AREA, 'faceLength', `must be longer than the taper length ${apart(l, f)[0]} ${unit}`);
      L = l;
      d = sqrt(f.mul(f).minus(L.mul(L)));
      alpha = atanDeg(d.div(L));
      steps.push(step('Stock removed at the end', 'd = √(F² − L²)', `d = √(${len(f)}² − ${len(L)}²)`, len(d), unit));
      steps.push(step('Angle', 'α = atan(d / L)', `α = atan(${len(d)} / ${len(L)})`, formatDegrees(alpha), '°'));
    } else if (r && f) {
      if (f.lte(r)) return impossible(AREA, 'faceLength', `must be longer than the stock removed at the end, ${apart(r, f)[0]} ${unit}`);
      d = r;
      L = sqrt(f.mul(f).minus(d.mul(d)));
      alpha = atanDeg(d.div(L));
      steps.push(step('Taper length', 'L = √(F² − d²)', `L = √(${len(f)}² − ${len(d)}²)`, len(L), unit));
      steps.push(step('Angle', 'α = atan(d / L)', `α = atan(${len(d)} / ${len(L)})`, formatDegrees(alpha), '°'));
    } else {
      return invalid(AREA, 'body', `give exactly two of ${names.join(', ')}`);
    }

    // Past the stock by more than the last digits of the trigonometry (40 digits; `exact` keeps 30).
    if (T && d.minus(T).gt('1e-24')) {
      // The cut plane meets the bottom face before the end: say where.
      const runOut = T.mul(L).div(d);
      const field = given.taperLength ? 'taperLength' : given.angle ? 'angle' : names[2];
      return impossible(
        AREA,
        field,
        // Two figures that round alike are shown to the place where they differ.
        `needs ${apart(d, T)[0]} ${unit} off the end but the stock is ${apart(d, T)[1]} ${unit} thick: the cut runs out through the bottom face ${apart(runOut, L)[0]} ${unit} from where the taper starts`,
      );
    }

    const F = sqrt(L.mul(L).plus(d.mul(d)));
    const h = L.mul(d).div(F);
    const t = T ? Dec.max(T.minus(d), 0) : null;
    if (!(given.faceLength && given.taperLength) && !(given.faceLength && given.removed)) {
      steps.push(step('Face length (aligned dimension)', 'F = L / cos α = √(L² + d²)', `F = √(${len(L)}² + ${len(d)}²)`, len(F), unit));
    }
    if (!(given.angle)) {
      steps.push(step('Angle (DMS)', 'α', formatDegrees(alpha) + '°', formatDms(alpha), ''));
    }
    if (t && T) steps.push(step('End thickness', 't = T − d', `t = ${len(T)} − ${len(d)}`, len(t), unit));
    steps.push(step('Depth to stop (from the highest corner, face horizontal)', 'h = L · sin α = L · d / F', `h = ${len(L)} · ${len(d)} / ${len(F)}`, len(h), unit));
    const travel = p.cutterDiameter ? F.plus(p.cutterDiameter) : F;
    steps.push(
      p.cutterDiameter
        ? step('Table travel', 'F + cutter Ø', `${len(F)} + ${len(p.cutterDiameter)}`, len(travel), unit)
        : step('Table travel', 'F', len(F), len(travel), unit),
    );

    const passes: TaperPass[] = [];
    // Nothing to cut at the resolution: the depth to stop (never more than d) reads zero.
    const tooSmall = readsZero(h);
    if (p.depthPerPass) {
      // Counted on the depth as read (0.20001 in is two passes of 0.1, not a third of 0.0000).
      const n = new Dec(len(h)).div(p.depthPerPass).ceil().toNumber();
      if (n > MAX_PASSES) return invalid(AREA, 'depthPerPass', `is too small: it would take ${n} passes (at most ${MAX_PASSES})`);
      let done = new Dec(0);
      for (let i = 1; i <= n; i++) {
        const next = i === n ? h : Dec.min(h, p.depthPerPass.mul(i));
        passes.push({ pass: i, cut: len(next.minus(done)), reading: len(next) });
        done = next;
      }
      steps.push(step('Passes', 'n = ⌈h / depth per pass⌉', `n = ⌈${len(h)} / ${len(p.depthPerPass)}⌉`, String(n), n === 1 ? 'pass' : 'passes'));
    }

    const warnings: string[] = [];
    // Zero but for the last digits of the trigonometry (T = 1 in, 45°, L = 1 in) is exactly zero.
    if (t && t.abs().lt('1e-24')) warnings.push('The taper runs out exactly at the bottom edge of the end: it leaves a knife edge.');
    // Left thinner than the unit's resolution (T = 1 in, 45°, L = 0.99996 in): as good as a knife edge.
    else if (t && readsZero(t)) warnings.push(`The taper runs out at the bottom edge of the end, to within ${unitResolution(unit).toString()} ${unit}: it leaves a knife edge.`);
    if (tooSmall) {
      warnings.push(
        `The ${shape} is too small to cut at ${unitResolution(unit).toString()} ${unit}: it takes ${len(d)} ${unit} off the end and the depth to stop reads ${len(h)} ${unit}, so there is nothing to remove. Check the angle and the ${shape === 'chamfer' ? 'legs' : 'lengths'}.`,
      );
    }
    if (p.fluteLength && h.gt(p.fluteLength)) {
      warnings.push(`Depth to stop ${len(h)} ${unit} is beyond the flute length ${len(p.fluteLength)} ${unit}: use a longer cutter or cut the face in steps.`);
    }
    if (shape === 'taper' && alpha.gt(45)) {
      warnings.push('The angle is over 45°: check that the angle block or vise can hold the work that steep.');
    }

    const value: TaperResult = {
      unit,
      shape,
      angleDeg: formatDegrees(alpha),
      angleDms: formatDms(alpha),
      thickness: T ? len(T) : null,
      taperLength: len(L),
      endThickness: t ? len(t) : null,
      faceLength: len(F),
      depthToStop: len(h),
      removedAtEnd: len(d),
      tableTravel: len(travel),
      passes,
      warnings,
      cautions: [...MILLING_CAUTIONS],
      steps,
      exact: {
        angleDeg: exactText(alpha),
        taperLength: exactText(L),
        endThickness: t ? exactText(t) : null,
        faceLength: exactText(F),
        depthToStop: exactText(h),
        removedAtEnd: exactText(d),
      },
    };
    return succeed(value);
  });
}
