/**
 * The gauge-block page's form and the engine request it makes (shared/calc/gauge-stack). A set-up
 * saved from that page keeps the form as its inputs; its results and sheet make the same request.
 */
import { Dec } from '../calc/decimal-math';
import type { GaugeStackRequest } from '../api/calc';
import { sizeList } from './form-text';

/** The gauge-block form's values: all text, as typed. */
export type GaugeBlocksFormValues = {
  unit: string;
  target: string;
  set: string;
  missing: string;
  wearBlocks: string;
  grade: string;
  temperature: string;
};

/**
 * The team's set id of a set picker value `box:<id>` (one of the team's own boxes, answered by the
 * inventory route), or null for a standard set (or none).
 */
export function boxIdOf(set: string): number | null {
  const m = /^box:([1-9]\d{0,9})$/.exec(set);
  return m ? Number(m[1]) : null;
}

/** The engine request for the form. */
export function toGaugeStackRequest(values: GaugeBlocksFormValues): GaugeStackRequest {
  return {
    target: values.target,
    unit: values.unit as GaugeStackRequest['unit'],
    set: values.set,
    missing: sizeList(values.missing),
    wearBlocks: values.wearBlocks,
    grade: (values.grade || undefined) as GaugeStackRequest['grade'],
    temperature: celsiusOf(values.temperature),
  };
}

/**
 * The blocks' temperature in °C as the engine takes it: as typed, or converted from °F when it
 * ends with F ("68F", "68 °F" → 20), as inch shops read their thermometers.
 */
export function celsiusOf(text: string): string {
  const f = /^\s*(-?\d+(?:\.\d+)?)\s*°?\s*F\s*$/i.exec(text);
  if (!f) return text.replace(/\s*°?\s*C\s*$/i, '');
  // °C = (°F − 32) · 5/9 (definition of the Fahrenheit scale), to 0.01 °C.
  return new Dec(f[1]!).minus(32).mul(5).div(9).toDecimalPlaces(2).toString();
}
