/**
 * The taper page's form and the engine request it makes (shared/calc/taper). A set-up saved from
 * that page keeps the form as its inputs; its results and sheet make the same request from it.
 */
import type { TaperRequest } from '../api/calc';

/** The taper form's values: all text, as typed (a type alias, so it fits `Record<string, unknown>`). */
export type TaperFormValues = {
  unit: string;
  shape: string;
  given: string;
  thickness: string;
  angle: string;
  taperLength: string;
  endThickness: string;
  faceLength: string;
  partLength: string;
  depthPerPass: string;
  fluteLength: string;
  cutterDiameter: string;
  /** Work-holding: angle blocks, sine plate or tilting vise (see taper-holding.ts). */
  holding: string;
  /** Angle-block set for the angle-block holding. */
  angleSet: string;
  /** Sine plate's roll centre distance and the gauge-block set for its stack. */
  plateLength: string;
  plateSet: string;
};

/** Which of angle, taperLength, end, faceLength a choice of `given` uses. */
export function givenFields(given: string): { angle: boolean; taperLength: boolean; end: boolean; faceLength: boolean } {
  const [first, second] = given.split('-');
  const uses = (name: string) => first === name || second === name;
  return { angle: uses('angle'), taperLength: uses('length'), end: uses('end'), faceLength: uses('face') };
}

/**
 * The engine request for the form: only the two given sizes are sent; the end size goes as
 * `endThickness` for a taper and as `removedAtEnd` (the chamfer's leg on the end) for a chamfer.
 */
export function toTaperRequest(values: TaperFormValues): TaperRequest {
  const use = givenFields(values.given);
  const chamfer = values.shape === 'chamfer';
  return {
    unit: values.unit as TaperRequest['unit'],
    shape: chamfer ? 'chamfer' : 'taper',
    thickness: values.thickness,
    angle: use.angle ? values.angle : undefined,
    taperLength: use.taperLength ? values.taperLength : undefined,
    endThickness: use.end && !chamfer ? values.endThickness : undefined,
    removedAtEnd: use.end && chamfer ? values.endThickness : undefined,
    faceLength: use.faceLength ? values.faceLength : undefined,
    depthPerPass: values.depthPerPass,
    fluteLength: values.fluteLength,
    cutterDiameter: values.cutterDiameter,
  };
}
