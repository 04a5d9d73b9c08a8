import type { DataStatus } from './gauge-sets';

/** Grades with a length-tolerance column below. */
export type GaugeGrade = 'K' | '0' | '1' | '2';

/** Limit deviation ±te of length (µm) for blocks up to `upToMm` long. */
export interface ToleranceBand {
  /** Upper end of the nominal-length band, mm (inclusive). */
  upToMm: number;
  /** ±te per grade, µm. */
  te: Readonly<Record<GaugeGrade, string>>;
}

/**
 * Standing of each grade's column and the basis shown with a stack's tolerance. Where the values
 * come from (for the tests): grades 0, 1, 2 from a DIN 861 table stated to correspond with
 * ISO 3650 (REFERENCE.md §3.1, a supplier's copy); grade K from memory, unverified.
 */
export const GRADE_STATUS: Readonly<Record<GaugeGrade, { status: DataStatus; source: string }>> = {
  K: { status: 'from-memory', source: "ISO 3650 grade K limit deviations; confirm them against the set's calibration certificate" },
  '0': { status: 'published-secondary', source: 'ISO 3650 limit deviations of length, grade 0 (the same values as DIN 861)' },
  '1': { status: 'published-secondary', source: 'ISO 3650 limit deviations of length, grade 1 (the same values as DIN 861)' },
  '2': { status: 'published-secondary', source: 'ISO 3650 limit deviations of length, grade 2 (the same values as DIN 861)' },
};

/** Limit deviation of length at any point, ±te in µm, per nominal-length band (REFERENCE.md §3.1). */
export const LENGTH_TOLERANCES: readonly ToleranceBand[] = [
  { upToMm: 10, te: { K: '0.20', '0': '0.12', '1': '0.20', '2': '0.45' } },
  { upToMm: 25, te: { K: '0.30', '0': '0.14', '1': '0.30', '2': '0.60' } },
  { upToMm: 50, te: { K: '0.40', '0': '0.20', '1': '0.40', '2': '0.80' } },
  { upToMm: 75, te: { K: '0.50', '0': '0.25', '1': '0.50', '2': '1.00' } },
  { upToMm: 100, te: { K: '0.60', '0': '0.30', '1': '0.60', '2': '1.20' } },
  { upToMm: 150, te: { K: '0.80', '0': '0.40', '1': '0.80', '2': '1.60' } },
];

/**
 * Linear expansion coefficient of gauge-block steel, 1/K: 11.5 × 10⁻⁶ ("typical" for steel,
 * H. Jack, Engineer On a Disk: Manufacturing §35.6.2 "Compensating for Temperature Variations",
 * citing T. Doiron, NIST); ISO 3650 states (11.5 ± 1.0) × 10⁻⁶ K⁻¹ (from memory).
 */
export const STEEL_EXPANSION_PER_K = '0.0000115';

/** Reference temperature for length, °C (ISO 1). */
export const REFERENCE_TEMPERATURE_C = 20;
