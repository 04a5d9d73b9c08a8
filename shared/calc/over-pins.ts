import { formatDegrees, formatDms } from '../angle/angle-text';
import { overPinsRequestSchema, parseRequest, type OverPinsParsed, type OverPinsRequest } from '../api/calc';
import { formatLength, type LengthUnit } from '../units/length-unit';
import { Dec, EXACT_DIGITS, asinDeg, atanDeg, cosDeg, exactText, fixedText, sinDeg, sqrt, tanDeg } from './decimal-math';
import { guarded, impossible, invalid, step, succeed, type CalcResult, type Step } from './step';

/**
 * Measuring over pins, rolls, discs and balls (REFERENCE.md §5):
 *  - dovetail over/between two equal rolls: x = a + D·(1 + cot(α/2)), y = b − D·(1 + cot(α/2)),
 *    c = h·cot α (Machinery's Handbook "Measuring dovetail slides");
 *  - dovetail angle from two roll sizes: cot(α/2) = Δx/ΔD − 1 (derived from the same formula);
 *  - pin in a V-groove: pin top over the surface = r/sin(β/2) + r − (W/2)·cot(β/2) (derived);
 *  - taper from readings at two heights: tan(α/2) = (M₂ − M₁)/(2·ΔH) (common practice/derived);
 *  - two-disc taper: K = (D − d)/(2C), TPF = 24K/√(1−K²) or, one side square,
 *    24K√(1−K²)/(1−2K²) (Machinery's Handbook 31 p. 701; Jones, Turning and Boring);
 *  - internal taper with two balls: sin(α/2) = (R − r)/(centre distance) (derived).
 */

/** Answer of {@link calculateOverPins}; the fields present depend on `kind`. */
export interface OverPinsResult {
  /** Which measurement. */
  kind: OverPinsParsed['kind'];
  /** Unit of every length. */
  unit: LengthUnit;
  /** Named results as decimal text (lengths at the unit's resolution, angles in degrees). */
  values: Record<string, string>;
  /** Angles as DMS, by the same names as in `values`. */
  dms: Record<string, string>;
  /** Notes (pin contact, direction). */
  warnings: string[];
  /** The derivation. */
  steps: Step[];
  /** Full-precision values by the same names. */
  exact: Record<string, string>;
}

const AREA = 'Over pins';

/**
 * Dovetail angles (flank to base) accepted, in degrees. Dovetails in use run about 30°–75°, most
 * often 45°, 55° or 60° (common practice); 30°–75° only earns a warning. Outside 10°–80° the
 * figure is taken for a slip (0.25" is read as a quarter of a second of arc; an angle taken from
 * the wrong face): a 5° flank would need the rolls 12 diameters outside the corners, and past 80°
 * the flank is near enough square that the rolls barely register the angle (derived).
 */
export const DOVETAIL_ANGLE_RANGE = { min: 10, max: 80 } as const;

function cot(deg: Dec): Dec {
  return new Dec(1).div(tanDeg(deg));
}

/** Whether a dovetail angle lies outside {@link DOVETAIL_ANGLE_RANGE}. */
function outsideDovetailRange(angle: Dec): boolean {
  return angle.lt(DOVETAIL_ANGLE_RANGE.min) || angle.gt(DOVETAIL_ANGLE_RANGE.max);
}

/** An angle for a message: to the second, or to the hundredth of a second when under a minute. */
function shownAngle(angle: Dec): string {
  return formatDms(angle, angle.lt(new Dec(1).div(60)) ? 2 : 0);
}

/** Whether typed angle text carries a seconds mark (" ″ ''), which a person may have meant as inches. */
function hasSecondsMark(typed: unknown): boolean {
  return typeof typed === 'string' && /["″”]|''/.test(typed);
}

/**
 * A trigonometric result with the last digits' noise taken off: kept to the significant digits of
 * the `exact` values, as those show it. cos 60° comes out 0.4999…9 at the working precision, so
 * 0.1875 · (1 + cos 60°) is 0.2812499…9 and would print as 0.2812 instead of 0.28125 → 0.2813
 * (half up, as everywhere else).
 */
function settled(x: Dec): Dec {
  return x.toSignificantDigits(EXACT_DIGITS);
}

/**
 * Measurement over pins or rolls and the reverse, chosen by `kind`: dovetail, dovetail-angle,
 * v-groove, taper-two-heights, taper-discs, taper-balls.
 */
export function calculateOverPins(input: OverPinsRequest | unknown): CalcResult<OverPinsResult> {
  return guarded<OverPinsResult>(AREA, () => {
    const parsed = parseRequest(AREA, overPinsRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    const unit = p.unit;
    const len = (x: Dec) => formatLength(settled(x), unit);
    const values: Record<string, string> = {};
    const dms: Record<string, string> = {};
    const exact: Record<string, string> = {};
    const steps: Step[] = [];
    const warnings: string[] = [];
    const putLength = (name: string, x: Dec) => {
      values[name] = len(x);
      exact[name] = exactText(x);
    };
    const putAngle = (name: string, x: Dec) => {
      values[name] = formatDegrees(settled(x));
      dms[name] = formatDms(settled(x));
      exact[name] = exactText(x);
    };
    const taperFromHalf = (half: Dec) => {
      putAngle('halfAngleDeg', half);
      putAngle('includedAngleDeg', half.mul(2));
      const tpf = settled(tanDeg(half).mul(24));
      values.taperPerFoot = fixedText(tpf, 5);
      exact.taperPerFoot = exactText(tpf);
      steps.push(step('Included angle', 'α = 2 · (α/2)', `α = 2 · ${formatDegrees(half)}°`, values.includedAngleDeg, '°'));
      steps.push(step('Taper per foot', 'TPF = 24 · tan(α/2)', `TPF = 24 · tan ${formatDms(half)}`, values.taperPerFoot, 'in/ft'));
    };

    switch (p.kind) {
      case 'dovetail': {
        if (outsideDovetailRange(p.angle)) {
          const typed = (input as { angle?: unknown }).angle;
          const mark = hasSecondsMark(typed) ? ' (in an angle " marks seconds of arc, not inches)' : '';
          return invalid(
            AREA,
            'angle',
            `must be from ${DOVETAIL_ANGLE_RANGE.min}° to ${DOVETAIL_ANGLE_RANGE.max}° for a dovetail, got ${shownAngle(p.angle)}${mark}: dovetails are usually 45°, 55° or 60° from the base (common practice)`,
          );
        }
        const k = cot(p.angle.div(2)).plus(1);
        steps.push(step('Roll constant', 'k = 1 + cot(α/2)', `k = 1 + cot(${formatDms(p.angle)} / 2)`, fixedText(k, 7), ''));
        if ((p.width === undefined) === (p.measurement === undefined)) return invalid(AREA, 'width', 'give exactly one of the corner width and the reading over (or between) the rolls');
        const male = p.side === 'male';
        if (p.width) {
          const m = male ? p.width.plus(p.rollDiameter.mul(k)) : p.width.minus(p.rollDiameter.mul(k));
          if (m.lte(0)) return impossible(AREA, 'rollDiameter', 'is too large for this female dovetail: the rolls would overlap');
          putLength('width', p.width);
          putLength('measurement', m);
          steps.push(step(male ? 'Over the rolls' : 'Between the rolls', male ? 'x = a + D · k' : 'y = b − D · k', `${len(p.width)} ${male ? '+' : '−'} ${len(p.rollDiameter)} · ${fixedText(k, 7)}`, len(m), unit));
        } else {
          const m = p.measurement as Dec;
          const w = male ? m.minus(p.rollDiameter.mul(k)) : m.plus(p.rollDiameter.mul(k));
          if (w.lte(0)) return impossible(AREA, 'measurement', 'is smaller than the rolls alone: check the reading and roll size');
          putLength('width', w);
          putLength('measurement', m);
          steps.push(step('Sharp-corner width', male ? 'a = x − D · k' : 'b = y + D · k', `${len(m)} ${male ? '−' : '+'} ${len(p.rollDiameter)} · ${fixedText(k, 7)}`, len(w), unit));
        }
        putAngle('angleDeg', p.angle);
        if (p.angle.lt(30) || p.angle.gt(75)) {
          warnings.push(
            `A dovetail angle of ${formatDms(p.angle)} between the flank and the base is unusual: common dovetails are 45°, 55° and 60° (common practice). Check the angle is measured from the base and not from the vertical (that would make it ${formatDms(new Dec(90).minus(p.angle))}).`,
          );
        }
        if (p.depth) {
          const c = p.depth.mul(cot(p.angle));
          putLength('flankRun', c);
          steps.push(step('Flank run over the depth', 'c = h · cot α', `c = ${len(p.depth)} · cot ${formatDms(p.angle)}`, len(c), unit));
          // The roll touches the flank at a height of r·(1 + cos α) above the base.
          const contact = p.rollDiameter.div(2).mul(cosDeg(p.angle).plus(1));
          putLength('contactHeight', contact);
          if (contact.gte(p.depth)) warnings.push(`The roll touches the flank ${len(contact)} ${unit} up, at or above the dovetail depth: use a smaller roll so the contact is below the corner (Machinery's Handbook).`);
        }
        break;
      }
      case 'dovetail-angle': {
        const dD = p.rollDiameter2.minus(p.rollDiameter1);
        if (dD.isZero()) return invalid(AREA, 'rollDiameter2', 'must differ from the first roll diameter D₁');
        const male = p.side === 'male';
        const [m1, m2] = male ? ['x₁', 'x₂'] : ['y₁', 'y₂'];
        const dM = male ? p.measurement2.minus(p.measurement1) : p.measurement1.minus(p.measurement2);
        const k = dM.div(dD);
        steps.push(step('Roll constant', male ? 'k = (x₂ − x₁) / (D₂ − D₁)' : 'k = (y₁ − y₂) / (D₂ − D₁)', `k = ${len(dM)} / ${len(dD)}`, fixedText(k, 7), ''));
        if (k.lte(1)) return impossible(AREA, 'measurement2', `does not fit a dovetail with ${m1} (1 + cot(α/2) must exceed 1): check which reading goes with which roll`);
        const half = atanDeg(new Dec(1).div(k.minus(1)));
        const angle = half.mul(2);
        const w = male ? p.measurement1.minus(p.rollDiameter1.mul(k)) : p.measurement1.plus(p.rollDiameter1.mul(k));
        // A reading slip (a digit dropped or added) shows as a corner width of nothing or less, or an
        // angle no dovetail has: refuse rather than draw it. Both readings enter k, so name both.
        if (w.lte(0)) {
          return impossible(
            AREA,
            'measurement2',
            `with ${m1} ${len(p.measurement1)} gives a corner width of ${len(w)} ${unit} (it must be more than 0): check ${m2} and ${m1}, and that each reading goes with its roll`,
          );
        }
        if (outsideDovetailRange(angle)) {
          return impossible(
            AREA,
            'measurement2',
            `with ${m1} ${len(p.measurement1)} gives a dovetail angle of ${shownAngle(angle)}, outside ${DOVETAIL_ANGLE_RANGE.min}°–${DOVETAIL_ANGLE_RANGE.max}° (dovetails are usually 45°, 55° or 60°): check ${m2} and ${m1}, and that each reading goes with its roll`,
          );
        }
        putAngle('angleDeg', angle);
        steps.push(step('Dovetail angle', 'α = 2 · atan(1 / (k − 1))', `α = 2 · atan(1 / ${fixedText(k.minus(1), 7)})`, values.angleDeg, '°'));
        putLength('width', w);
        steps.push(step('Sharp-corner width', male ? 'a = x₁ − D₁ · k' : 'b = y₁ + D₁ · k', `${len(p.measurement1)} ${male ? '−' : '+'} ${len(p.rollDiameter1)} · ${fixedText(k, 7)}`, len(w), unit));
        break;
      }
      case 'v-groove': {
        const halfBeta = p.includedAngle.div(2);
        const r = p.pinDiameter.div(2);
        const centreAboveApex = r.div(sinDeg(halfBeta));
        steps.push(step('Pin centre above the apex', 'c = r / sin(β/2)', `c = ${len(r)} / sin ${formatDms(halfBeta)}`, len(centreAboveApex), unit));
        if ((p.grooveWidth === undefined) === (p.measurement === undefined)) return invalid(AREA, 'grooveWidth', 'give exactly one of the groove width and the pin height over the surface');
        let apexDepth: Dec;
        if (p.grooveWidth) {
          apexDepth = p.grooveWidth.div(2).mul(cot(halfBeta));
          const m = centreAboveApex.plus(r).minus(apexDepth);
          putLength('grooveWidth', p.grooveWidth);
          putLength('measurement', m);
          steps.push(step('Groove depth to the apex', 'e = (W/2) · cot(β/2)', `e = ${len(p.grooveWidth.div(2))} · cot ${formatDms(halfBeta)}`, len(apexDepth), unit));
          steps.push(step('Pin top over the surface', 'm = c + r − e', `m = ${len(centreAboveApex)} + ${len(r)} − ${len(apexDepth)}`, len(m), unit));
        } else {
          const m = p.measurement as Dec;
          apexDepth = centreAboveApex.plus(r).minus(m);
          if (apexDepth.lte(0)) return impossible(AREA, 'measurement', 'puts the apex above the surface: check the reading');
          const w = apexDepth.mul(tanDeg(halfBeta)).mul(2);
          putLength('grooveWidth', w);
          putLength('measurement', m);
          steps.push(step('Groove depth to the apex', 'e = c + r − m', `e = ${len(centreAboveApex)} + ${len(r)} − ${len(m)}`, len(apexDepth), unit));
          steps.push(step('Sharp-corner width', 'W = 2 · e · tan(β/2)', `W = 2 · ${len(apexDepth)} · tan ${formatDms(halfBeta)}`, len(w), unit));
        }
        putLength('apexDepth', apexDepth);
        putAngle('includedAngleDeg', p.includedAngle);
        // The pin touches each flank r·cot(β/2) from the apex; the flank is e / cos(β/2) long.
        const contact = r.mul(cot(halfBeta));
        const flank = apexDepth.div(cosDeg(halfBeta));
        if (contact.gte(flank)) warnings.push('The pin is too large: it would touch the edges of the groove, not its flanks. Use a smaller pin.');
        break;
      }
      case 'taper-two-heights': {
        const dM = p.measurement2.minus(p.measurement1);
        // Equal readings: the sides are parallel, which an inspector checking a parallel part wants to see as 0°.
        const half = atanDeg(dM.abs().div(p.heightDifference.mul(2)));
        steps.push(step('Half angle', 'tan(α/2) = |M₂ − M₁| / (2 · ΔH)', `tan(α/2) = ${len(dM.abs())} / (2 · ${len(p.heightDifference)})`, formatDegrees(half), '°'));
        taperFromHalf(half);
        warnings.push(
          dM.isZero()
            ? 'The readings are equal: the sides are parallel (no taper).'
            : dM.isNeg() ? 'The work narrows toward the second (upper) reading.' : 'The work widens toward the second (upper) reading.',
        );
        break;
      }
      case 'taper-discs': {
        const side = p.reference === 'side';
        if (p.largeDisc.lte(p.smallDisc)) return invalid(AREA, 'largeDisc', 'must be larger than the small disc d');
        const defined = [p.centreDistance, p.taperPerFoot, p.includedAngle].filter((v) => v !== undefined).length;
        if (defined !== 1) return invalid(AREA, 'centreDistance', 'give exactly one of the centre distance, the taper per foot and the angle');
        const halfDiff = p.largeDisc.minus(p.smallDisc).div(2);
        if (p.centreDistance) {
          const C = p.centreDistance;
          const K = halfDiff.div(C);
          if (K.gte(1)) return impossible(AREA, 'centreDistance', 'is too short: the discs would overlap');
          steps.push(step('Disc constant', 'K = (D − d) / (2C)', `K = (${len(p.largeDisc)} − ${len(p.smallDisc)}) / (2 · ${len(C)})`, fixedText(K, 8), ''));
          const root = sqrt(new Dec(1).minus(K.mul(K)));
          if (side) {
            const denom = new Dec(1).minus(K.mul(K).mul(2));
            if (denom.lte(0)) return impossible(AREA, 'centreDistance', 'gives an angle of 90° or more between the sides');
            const tpf = K.mul(24).mul(root).div(denom);
            values.taperPerFoot = fixedText(settled(tpf), 5);
            exact.taperPerFoot = exactText(tpf);
            steps.push(step('Taper per foot (one side square)', 'T = 24K√(1 − K²) / (1 − 2K²)', `K = ${fixedText(K, 8)}`, values.taperPerFoot, 'in/ft'));
            putAngle('includedAngleDeg', asinDeg(K).mul(2));
          } else {
            const tpf = K.mul(24).div(root);
            values.taperPerFoot = fixedText(settled(tpf), 5);
            exact.taperPerFoot = exactText(tpf);
            steps.push(step('Taper per foot', 'T = 24K / √(1 − K²)', `K = ${fixedText(K, 8)}`, values.taperPerFoot, 'in/ft'));
            putAngle('halfAngleDeg', asinDeg(K));
            putAngle('includedAngleDeg', asinDeg(K).mul(2));
          }
          putLength('centreDistance', C);
        } else {
          // Angle between the sides the discs touch.
          let between: Dec;
          if (p.includedAngle) between = p.includedAngle;
          else between = side ? atanDeg((p.taperPerFoot as Dec).div(12)) : atanDeg((p.taperPerFoot as Dec).div(24)).mul(2);
          const C = halfDiff.div(sinDeg(between.div(2)));
          putAngle('includedAngleDeg', between);
          putLength('centreDistance', C);
          steps.push(step('Centre distance of the discs', 'C = ((D − d) / 2) / sin(α/2)', `C = ${len(halfDiff)} / sin ${formatDms(between.div(2))}`, len(C), unit));
        }
        break;
      }
      case 'taper-balls': {
        const R = p.largeBall.div(2);
        const r = p.smallBall.div(2);
        if (R.lte(r)) return invalid(AREA, 'largeBall', 'must be larger than the small ball');
        const centres = p.smallBallDepth.plus(r).minus(p.largeBallDepth.plus(R));
        steps.push(step('Centre distance of the balls', 's = (h₂ + r) − (h₁ + R)', `s = (${len(p.smallBallDepth)} + ${len(r)}) − (${len(p.largeBallDepth)} + ${len(R)})`, len(centres), unit));
        if (centres.lte(R.minus(r))) return impossible(AREA, 'smallBallDepth', 'puts the balls too close together for a taper: check the depths');
        const half = asinDeg(R.minus(r).div(centres));
        steps.push(step('Half angle', 'sin(α/2) = (R − r) / s', `sin(α/2) = ${len(R.minus(r))} / ${len(centres)}`, formatDegrees(half), '°'));
        putLength('centreDistance', centres);
        taperFromHalf(half);
        break;
      }
    }
    return succeed({ kind: p.kind, unit, values, dms, warnings, steps, exact });
  });
}
