/**
 * The pins-and-rolls page's form, and the engine request (shared/calc/over-pins) each kind of
 * measurement makes from it. A set-up saved from that page keeps the whole form as its inputs;
 * the set-up's results and sheet run the engine on the same request the page does, so the three
 * always show the same answer.
 */
import type { LengthUnit } from '../units/length-unit';
import { savedForm } from './form-text';

/** What is measured. */
export type RollKind = 'dovetail' | 'v-groove' | 'dovetail-angle' | 'taper-two-heights' | 'taper-discs' | 'taper-balls';
/** Every kind of measurement, in the order the page offers them. */
export const ROLL_KIND_VALUES: readonly RollKind[] = ['dovetail', 'v-groove', 'dovetail-angle', 'taper-two-heights', 'taper-discs', 'taper-balls'];

/** Whether a value (from an address, a saved set-up) is one of the kinds of measurement. */
export function isRollKind(value: unknown): value is RollKind {
  return (ROLL_KIND_VALUES as readonly unknown[]).includes(value);
}
/** Which side of a dovetail. */
export type DovetailSide = 'male' | 'female';
/** Work toward a reading ('cut') or back from one measured on the work ('check'). */
export type RollMode = 'cut' | 'check';
/** Which of the two-disc figures is given. */
export type DiscGiven = 'centreDistance' | 'taperPerFoot' | 'includedAngle';

/** The form's values, all as typed. */
export interface PinsRollsForm {
  unit: LengthUnit;
  kind: RollKind;
  mode: RollMode;
  side: DovetailSide;
  /** Dovetail angle between flank and base. */
  angle: string;
  rollDiameter: string;
  /** Sharp-corner width at the roll side (a or b): the drawing size. */
  width: string;
  depth: string;
  /** Reading measured over (or between) the rolls, in check mode. */
  reading: string;
  /** Included angle of the V. */
  includedAngle: string;
  pinDiameter: string;
  /** Sharp-corner width of the V at the surface: the drawing size. */
  grooveWidth: string;
  /** Pin top over the surface as measured, in check mode. */
  pinHeight: string;
  rollDiameter1: string;
  measurement1: string;
  rollDiameter2: string;
  measurement2: string;
  lowerReading: string;
  upperReading: string;
  heightDifference: string;
  largeDisc: string;
  smallDisc: string;
  discGiven: DiscGiven;
  centreDistance: string;
  discTaperPerFoot: string;
  discAngle: string;
  reference: 'axis' | 'side';
  largeBall: string;
  smallBall: string;
  largeBallDepth: string;
  smallBallDepth: string;
}

/** An engine request, and the form control behind each engine field whose name differs. */
export interface OverPinsRequest {
  readonly request: Record<string, unknown>;
  readonly names: Readonly<Record<string, string>>;
}

/**
 * The request toward a reading for the form's kind: for a dovetail or a V-groove, the reading to
 * cut to for the drawing size (the page's check mode adds its own requests from a measured reading);
 * for the other kinds, the angle or taper from the readings as set up.
 */
export function overPinsRequest(v: PinsRollsForm): OverPinsRequest {
  switch (v.kind) {
    case 'dovetail':
      return { request: { kind: 'dovetail', unit: v.unit, side: v.side, angle: v.angle, rollDiameter: v.rollDiameter, width: v.width, depth: v.depth }, names: {} };
    case 'v-groove':
      return { request: { kind: 'v-groove', unit: v.unit, includedAngle: v.includedAngle, pinDiameter: v.pinDiameter, grooveWidth: v.grooveWidth }, names: {} };
    case 'dovetail-angle':
      return {
        request: { kind: 'dovetail-angle', unit: v.unit, side: v.side, rollDiameter1: v.rollDiameter1, measurement1: v.measurement1, rollDiameter2: v.rollDiameter2, measurement2: v.measurement2 },
        names: {},
      };
    case 'taper-two-heights':
      return {
        request: { kind: 'taper-two-heights', unit: v.unit, measurement1: v.lowerReading, measurement2: v.upperReading, heightDifference: v.heightDifference },
        names: { measurement1: 'lowerReading', measurement2: 'upperReading' },
      };
    case 'taper-discs': {
      const given = {
        centreDistance: v.discGiven === 'centreDistance' ? v.centreDistance : undefined,
        taperPerFoot: v.discGiven === 'taperPerFoot' ? v.discTaperPerFoot : undefined,
        includedAngle: v.discGiven === 'includedAngle' ? v.discAngle : undefined,
      };
      const givenControl = v.discGiven === 'centreDistance' ? 'centreDistance' : v.discGiven === 'taperPerFoot' ? 'discTaperPerFoot' : 'discAngle';
      return {
        request: { kind: 'taper-discs', unit: v.unit, largeDisc: v.largeDisc, smallDisc: v.smallDisc, reference: v.reference, ...given },
        names: { taperPerFoot: 'discTaperPerFoot', includedAngle: 'discAngle', centreDistance: givenControl },
      };
    }
    case 'taper-balls':
      return {
        request: { kind: 'taper-balls', unit: v.unit, largeBall: v.largeBall, smallBall: v.smallBall, largeBallDepth: v.largeBallDepth, smallBallDepth: v.smallBallDepth },
        names: {},
      };
    default:
      // A kind no page offers (a mistyped address, a damaged saved set-up): the engine refuses it by name.
      return { request: { kind: v.kind, unit: v.unit }, names: {} };
  }
}

const FORM_ONLY = ['mode', 'lowerReading', 'upperReading', 'discGiven', 'discTaperPerFoot', 'discAngle', 'reading', 'pinHeight'] as const;

/**
 * Check mode of a dovetail or a V-groove: the request from the reading measured on the work (the
 * dovetail's `reading`, the pin's `pinHeight`) back to the work as it is now.
 */
export function checkReadingRequest(v: PinsRollsForm): Record<string, unknown> {
  return v.kind === 'dovetail'
    ? { kind: 'dovetail', unit: v.unit, side: v.side, angle: v.angle, rollDiameter: v.rollDiameter, depth: v.depth, measurement: v.reading }
    : { kind: 'v-groove', unit: v.unit, includedAngle: v.includedAngle, pinDiameter: v.pinDiameter, measurement: v.pinHeight };
}

/**
 * The engine request for a saved set-up's inputs: a form saved from the page becomes the request
 * the page makes toward a reading (a dovetail or V-groove saved in check mode without a drawing
 * size: the request from its measured reading); inputs already in the engine's shape (saved
 * through the API) are used as they are.
 */
export function overPinsRequestFromInputs(inputs: Record<string, unknown>): Record<string, unknown> {
  if (!FORM_ONLY.some((key) => key in inputs)) return inputs;
  const form = savedForm<PinsRollsForm>(inputs);
  const drawingSize = form.kind === 'dovetail' ? form.width : form.kind === 'v-groove' ? form.grooveWidth : 'n/a';
  if (form.mode === 'check' && !drawingSize.trim()) return checkReadingRequest(form);
  return overPinsRequest(form).request;
}
