/**
 * The lathe-taper page's form and the engine request it makes (shared/calc/lathe-taper). A set-up
 * saved from that page keeps the form as its inputs; its results and sheet make the same request.
 */
import type { LatheTaperRequest } from '../api/calc';
import type { LengthUnit } from '../units/length-unit';

/** How the taper is given. */
export type TaperDefinition = 'standard' | 'tpf' | 'angle' | 'diameters';
/** How it is turned. */
export type TurningMethod = 'compound' | 'offset';

/** The form's values, all as typed. */
export interface LatheTapersForm {
  unit: LengthUnit;
  define: TaperDefinition;
  standard: string;
  taperPerFoot: string;
  includedAngle: string;
  largeDiameter: string;
  smallDiameter: string;
  length: string;
  workLength: string;
  method: TurningMethod;
  /** Distances from the large end, separated by commas or spaces. */
  stations: string;
}

/** Splits the stations text into distances; empty parts are left out. */
export function splitStations(text: string): string[] {
  return text.split(/[\s,;]+/).filter((s) => s !== '');
}

/** Turns the form's values into the engine's request, sending only what the chosen definition uses. */
export function latheRequest(v: LatheTapersForm): LatheTaperRequest {
  const base: LatheTaperRequest = { unit: v.unit, workLength: v.workLength, stations: splitStations(v.stations) };
  switch (v.define) {
    case 'standard':
      return { ...base, standard: v.standard };
    case 'tpf':
      return { ...base, taperPerFoot: v.taperPerFoot, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
    case 'angle':
      return { ...base, includedAngle: v.includedAngle, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
    default:
      return { ...base, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
  }
}
