import { Dec } from '../calc/decimal-math';
import type { LengthUnit } from '../units/length-unit';
import type { DataStatus } from './gauge-sets';

/** A standard machine taper. */
export interface MachineTaper {
  /** Id used by the API (e.g. "morse-2"). */
  id: string;
  /** Family: Morse, Brown & Sharpe, Jarno, steep 7:24, taper pin, metric. */
  family: 'morse' | 'brown-sharpe' | 'jarno' | 'steep' | 'taper-pin' | 'metric';
  /** Display name. */
  name: string;
  /** Unit of the diameters and length. */
  unit: LengthUnit;
  /** Taper per foot (diametral, in/ft; for metric tapers the same ratio × 12). */
  taperPerFoot: string;
  /** Large-end (gauge) diameter, when the source gives it. */
  largeDiameter: string | null;
  /** Small-end diameter, when the source gives it. */
  smallDiameter: string | null;
  /**
   * Length of the taper, when the source gives it. For a 'published' taper the calculation shows it
   * as given; a 'published-secondary' table's rounder lengths are worked out from the diameters.
   */
  length: string | null;
  /** Where the numbers come from (for the tests and maintainers). */
  source: string;
  /** What the page says the numbers rest on, in a machinist's words. */
  basis: string;
  /** How well they are backed. */
  status: DataStatus;
}

const MORSE_SOURCE =
  'Machinery\'s Handbook "Morse Taper Shanks" (engineersedge.com copy; plug depth P as listed by sizes.com "Morse taper shanks and sockets") and SCI General Catalog "Standard of Tapers — Morse Taper", REFERENCE.md §4.2';
/**
 * Morse taper shanks. The plug depth P is the published fraction (2-9/16, 3-3/16 …), not worked
 * back from A and D: those are rounded to 0.001 in, and (A − D) · 12 / TPF gives 5.1876 for No. 5
 * and 7.2501 for No. 6 instead of 5-3/16 and 7-1/4.
 */
const MORSE: [string, string, string, string][] = [
  // [TPF, gauge diameter A (in), small end of plug D (in), plug depth P (in)]
  ['0.62460', '0.3561', '0.252', '2'],
  ['0.59858', '0.475', '0.369', '2.125'],
  ['0.59941', '0.700', '0.572', '2.5625'],
  ['0.60235', '0.938', '0.778', '3.1875'],
  ['0.62326', '1.231', '1.020', '4.0625'],
  ['0.63151', '1.748', '1.475', '5.1875'],
  ['0.62565', '2.494', '2.116', '7.25'],
  ['0.62400', '3.270', '2.750', '10'],
];

const BS_SOURCE = 'vintagemachinery.org wiki "Tapers" / "Dimensions of Standard Tapers", REFERENCE.md §4.3';
const BROWN_SHARPE: [number, string, string, string, string][] = [
  [1, '0.2392', '0.2000', '0.94', '0.5020'],
  [2, '0.2997', '0.2500', '1.19', '0.5020'],
  [3, '0.3753', '0.3125', '1.50', '0.5020'],
  [4, '0.4207', '0.3500', '1.69', '0.5024'],
  [5, '0.5388', '0.4500', '2.13', '0.5016'],
  [6, '0.5996', '0.5000', '2.38', '0.5033'],
  [7, '0.7201', '0.6000', '2.88', '0.5015'],
  [8, '0.8987', '0.7500', '3.56', '0.5010'],
  [9, '1.0775', '0.9001', '4.25', '0.5009'],
  [10, '1.2597', '1.0447', '5.00', '0.5161'],
  [11, '1.4978', '1.2500', '5.94', '0.5010'],
  [12, '1.7968', '1.5001', '7.13', '0.4997'],
  [13, '2.0731', '1.7501', '7.75', '0.5002'],
  [14, '2.3438', '2.0000', '8.25', '0.5000'],
  [15, '2.6146', '2.2500', '8.75', '0.5000'],
];

function jarno(n: number): MachineTaper {
  return {
    id: `jarno-${n}`,
    family: 'jarno',
    name: `Jarno No. ${n}`,
    unit: 'in',
    taperPerFoot: '0.600',
    largeDiameter: new Dec(n).div(8).toString(),
    smallDiameter: new Dec(n).div(10).toString(),
    length: new Dec(n).div(2).toString(),
    source: 'US Army OD1645 (tpub Od16450080–0081): large end N/8, small end N/10, length N/2, 0.600 in/ft, REFERENCE.md §4.4',
    basis: 'Jarno taper rule: large end N/8 in, small end N/10 in, length N/2 in, 0.600 in/ft',
    status: 'published',
  };
}

/** Standard machine tapers. */
export const MACHINE_TAPERS: readonly MachineTaper[] = [
  ...MORSE.map(([tpf, large, small, plugDepth], n): MachineTaper => ({
    id: `morse-${n}`,
    family: 'morse',
    name: `Morse No. ${n}`,
    unit: 'in',
    taperPerFoot: tpf,
    largeDiameter: large,
    smallDiameter: small,
    length: plugDepth,
    source: MORSE_SOURCE,
    basis: 'Morse taper shank dimensions as published in Machinery\'s Handbook ("Morse Taper Shanks")',
    status: 'published',
  })),
  ...BROWN_SHARPE.map(([n, large, small, length, tpf]): MachineTaper => ({
    id: `brown-sharpe-${n}`,
    family: 'brown-sharpe',
    name: `Brown & Sharpe No. ${n}`,
    unit: 'in',
    taperPerFoot: tpf,
    largeDiameter: large,
    smallDiameter: small,
    length,
    source: BS_SOURCE,
    basis: 'Brown & Sharpe taper table (diameters given to 0.01 in, so the length is worked out from them)',
    status: 'published-secondary',
  })),
  ...Array.from({ length: 19 }, (_, i) => jarno(i + 2)),
  {
    id: 'steep-7-24',
    family: 'steep',
    name: 'Steep taper 7:24 (3-1/2 in/ft)',
    unit: 'in',
    taperPerFoot: '3.5',
    largeDiameter: null,
    smallDiameter: null,
    length: null,
    source: 'US Army OD1645 (3-1/2 in/ft); Machinery\'s Handbook ("included angle … over 16 degrees"), REFERENCE.md §4.5',
    basis: '7:24 steep taper (3-1/2 in per foot), as published for machine spindles',
    status: 'published',
  },
  {
    id: 'taper-pin',
    family: 'taper-pin',
    name: 'Standard taper pin (1/4 in/ft)',
    unit: 'in',
    taperPerFoot: '0.25',
    largeDiameter: null,
    smallDiameter: null,
    length: null,
    source: 'US Army OD1645 (tpub Od16450081), sizes 7/0 to 10, REFERENCE.md §4.5',
    basis: 'Standard taper pins, 1/4 in per foot on the diameter',
    status: 'published',
  },
  ...[4, 6, 80, 100, 120, 160, 200].map((n): MachineTaper => ({
    id: `metric-${n}`,
    family: 'metric',
    name: `Metric ${n} (1:20)`,
    unit: 'mm',
    taperPerFoot: '0.6',
    largeDiameter: String(n),
    smallDiameter: null,
    length: null,
    source: 'ISO metric taper 1:20, gauge diameter = the number in mm (from memory, unverified; REFERENCE.md §4.5)',
    basis: 'Metric taper 1:20, the gauge diameter being the number in mm; check it against your tooling before cutting',
    status: 'from-memory',
  })),
];

/** Finds a machine taper by id. */
export function findMachineTaper(id: string): MachineTaper | undefined {
  return MACHINE_TAPERS.find((t) => t.id === id);
}
