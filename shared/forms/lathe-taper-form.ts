/**
 * The lathe-taper page's form and the engine request it makes (shared/calc/lathe-taper). A set-up
 * saved from that page keeps the form as its inputs; its results and sheet make the same request.
 */
import type { LatheTaperRequest } from '../api/calc';
import { findMachineTaper } from '../data/machine-tapers';
import { sizeList } from './form-text';
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
  return sizeList(text) ?? [];
}

/**
 * Whether a standard taper fixes its sizes (Morse, Jarno, metric…), or only the taper itself (the
 * 7:24 steep taper, the taper pin): then the part's own diameters and length are asked for.
 */
export function standardHasSizes(id: string): boolean {
  const t = findMachineTaper(id);
  return !t || t.largeDiameter !== null;
}

/** Turns the form's values into the engine's request, sending only what the chosen definition uses. */
export function latheRequest(v: LatheTapersForm): LatheTaperRequest {
  const base: LatheTaperRequest = { unit: v.unit, workLength: v.workLength, stations: splitStations(v.stations) };
  switch (v.define) {
    case 'standard': {
      if (standardHasSizes(v.standard)) return { ...base, standard: v.standard };
      // Only the taper is standard: the part's sizes come from the form, and diameters along it
      // are listed once there is a diameter to start from.
      const sized = v.largeDiameter.trim() !== '' || (v.smallDiameter.trim() !== '' && v.length.trim() !== '');
      return { ...base, stations: sized ? base.stations : [], standard: v.standard, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
    }
    case 'tpf':
      return { ...base, taperPerFoot: v.taperPerFoot, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
    case 'angle':
      return { ...base, includedAngle: v.includedAngle, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
    default:
      return { ...base, largeDiameter: v.largeDiameter, smallDiameter: v.smallDiameter, length: v.length };
  }
}
