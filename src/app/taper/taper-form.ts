import type { TaperResult } from '../../../shared/calc/taper';
import type { ResultItem } from '../workbench/result-list';
import type { HoldingDrawing } from '../../../shared/forms/taper-holding';
import type { TaperSceneInput } from './taper-scene';
import type { TaperFormValues } from '../../../shared/forms/taper-form';

export { givenFields, toTaperRequest, type TaperFormValues } from '../../../shared/forms/taper-form';

/** Which two of the four taper sizes the user gives. */
export type TaperGiven = 'angle-length' | 'angle-end' | 'angle-face' | 'length-end' | 'length-face' | 'end-face';

/** The pairs a taper can be defined by, with their labels. */
export const TAPER_GIVEN_OPTIONS: readonly { readonly value: TaperGiven; readonly label: string }[] = [
  { value: 'angle-length', label: 'Angle and taper length' },
  { value: 'angle-end', label: 'Angle and end thickness' },
  { value: 'angle-face', label: 'Angle and face length' },
  { value: 'length-end', label: 'Taper length and end thickness' },
  { value: 'length-face', label: 'Taper length and face length' },
  { value: 'end-face', label: 'End thickness and face length' },
];

/** The same pairs in a chamfer's words: its two legs instead of the taper length and end thickness. */
export const CHAMFER_GIVEN_OPTIONS: readonly { readonly value: TaperGiven; readonly label: string }[] = TAPER_GIVEN_OPTIONS.map((o) => ({
  value: o.value,
  label: o.label.replace('taper length', 'top-face leg').replace('Taper length', 'Top-face leg').replace('end thickness', 'end-face leg').replace('End thickness', 'End-face leg'),
}));

/**
 * Defaults from the demo scenario: a fixture wedge of 3/4 in stock with a 7°30' taper over the
 * last 2.5 in of a 4 in part, cut 0.1 in a pass with a 3/4 in end mill (1 in of flute).
 */
export const TAPER_DEFAULTS: TaperFormValues = {
  unit: 'in',
  shape: 'taper',
  given: 'angle-length',
  thickness: '0.75',
  angle: "7°30'",
  taperLength: '2.5',
  endThickness: '',
  faceLength: '',
  partLength: '4',
  depthPerPass: '0.1',
  fluteLength: '1',
  cutterDiameter: '0.75',
  holding: 'angle-block',
  angleSet: 'angle-16',
  plateLength: '5',
  plateSet: 'inch-81',
};

/** The length controls, converted when the unit changes. */
export const TAPER_LENGTH_FIELDS = ['thickness', 'taperLength', 'endThickness', 'faceLength', 'partLength', 'depthPerPass', 'fluteLength', 'cutterDiameter', 'plateLength'] as const;

/** The numbers of a taper answer for the result list, the stop readings first. */
export function taperResultItems(r: TaperResult): ResultItem[] {
  const u = r.unit;
  const items: ResultItem[] = [
    { label: 'Depth to stop', value: r.depthToStop, unit: u, emphasis: true, note: 'Cutter travel down from touching off on the highest corner' },
  ];
  if (r.endThickness !== null) items.push({ label: 'End thickness', value: r.endThickness, unit: u, emphasis: true, note: 'Read with a micrometer at the end' });
  items.push(
    { label: 'Face length', value: r.faceLength, unit: u, note: 'Aligned dimension: read with a scale along the face' },
    { label: 'Angle', value: r.angleDms, unit: '', note: `${r.angleDeg}° — tilt of the block, plate or vise` },
    r.shape === 'chamfer'
      ? { label: 'Leg on the top face', value: r.taperLength, unit: u, note: 'From the edge, along the top face' }
      : { label: 'Taper length', value: r.taperLength, unit: u, note: 'From the end, along the top face' },
    r.shape === 'chamfer'
      ? { label: 'Leg on the end face', value: r.removedAtEnd, unit: u, note: 'From the edge, down the end face' }
      : { label: 'Removed at the end', value: r.removedAtEnd, unit: u, note: 'Square to the top face' },
    { label: 'Table travel', value: r.tableTravel, unit: u, note: 'To sweep the whole face' },
  );
  if (r.passes.length) items.push({ label: 'Passes', value: String(r.passes.length), unit: '', note: 'See the pass list for each DRO reading' });
  return items;
}

/** Reads a decimal text as a number for drawing only (never for a reported value); NaN → 0. */
export function drawingNumber(text: string | null | undefined): number {
  const n = Number(text);
  return Number.isFinite(n) ? n : 0;
}

/** The drawing's model from an answer and the form (part length and cutter come from the form). */
export function taperSceneInput(r: TaperResult, values: TaperFormValues, selectedPass: number, holding?: HoldingDrawing): TaperSceneInput {
  const thickness = r.thickness !== null ? drawingNumber(r.thickness) : 2 * drawingNumber(r.removedAtEnd);
  const u = r.unit;
  return {
    thickness,
    taperLength: drawingNumber(r.taperLength),
    removedAtEnd: drawingNumber(r.removedAtEnd),
    angleDeg: drawingNumber(r.angleDeg),
    partLength: drawingNumber(values.partLength),
    cutterDiameter: drawingNumber(values.cutterDiameter),
    readings: r.passes.map((p) => drawingNumber(p.reading)),
    selectedPass,
    holding,
    labels: {
      depthToStop: `${r.depthToStop} ${u}`,
      faceLength: `${r.faceLength} ${u}`,
      endThickness: r.endThickness !== null ? `${r.endThickness} ${u}` : '',
      angle: r.angleDms,
      cutter: values.cutterDiameter ? `Ø${values.cutterDiameter} ${u} cutter` : 'cutter',
      cutterShort: values.cutterDiameter ? `Ø${values.cutterDiameter} ${u}` : 'cutter',
    },
  };
}
