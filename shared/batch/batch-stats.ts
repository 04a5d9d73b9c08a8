import { Dec, fixedText } from '../calc/decimal-math';
import type { CheckStats, PartDeviation } from '../api/batch';
import type { SetupCheck } from '../api/setup';

/** A part's readings as the statistics need them. */
export interface PartReadings {
  partNo: number;
  values: Readonly<Record<string, string>>;
}

/** Pass/fail of one part against every check of the run. */
export interface PartVerdict {
  pass: boolean;
  /** Keys whose value lies outside the band. */
  outOfBand: string[];
  /** Keys with no value given. */
  missing: string[];
}

/** Number of decimals written in a decimal text ("0.5850" → 4). */
export function decimalsIn(text: string): number {
  const dot = text.indexOf('.');
  return dot < 0 ? 0 : text.length - dot - 1;
}

/** The band of a check: [nominal − minus, nominal + plus]. */
export function checkBand(check: SetupCheck): { low: Dec; high: Dec } {
  const nominal = new Dec(check.nominal);
  return { low: nominal.minus(check.minus), high: nominal.plus(check.plus) };
}

/** Whether a value lies inside a check's band (limits included). */
export function inBand(check: SetupCheck, value: string): boolean {
  const { low, high } = checkBand(check);
  const v = new Dec(value);
  return v.gte(low) && v.lte(high);
}

/** Checks a part's values against every check: it passes only when all are given and in band. */
export function partVerdict(checks: readonly SetupCheck[], values: Readonly<Record<string, string>>): PartVerdict {
  const outOfBand: string[] = [];
  const missing: string[] = [];
  for (const check of checks) {
    const value = values[check.key];
    if (value === undefined || value === '') missing.push(check.key);
    else if (!inBand(check, value)) outOfBand.push(check.key);
  }
  return { pass: outOfBand.length === 0 && missing.length === 0, outOfBand, missing };
}

/** Decimals of a check as written in its set-up: the most of nominal, plus and minus ("0.5854 +0.001" → 4). */
export function checkDecimals(check: SetupCheck): number {
  return Math.max(decimalsIn(check.nominal), decimalsIn(check.plus), decimalsIn(check.minus));
}

/**
 * Statistics of every check over the parts (in part-number order): mean, min, max, range, the
 * largest deviation from the first part, and the sample standard deviation. The band keeps the
 * check's own decimals; every figure is given to one decimal more than the check (common practice
 * for averages of readings, and the same for all figures so a column never changes its width),
 * whatever decimals a single reading was written with.
 */
export function checkStats(checks: readonly SetupCheck[], parts: readonly PartReadings[]): CheckStats[] {
  const ordered = [...parts].sort((a, b) => a.partNo - b.partNo);
  return checks.map((check) => {
    const { low, high } = checkBand(check);
    const nominal = new Dec(check.nominal);
    const rows = ordered.filter((p) => p.values[check.key] !== undefined && p.values[check.key] !== '');
    const texts = rows.map((p) => p.values[check.key] as string);
    const own = checkDecimals(check);
    const decimals = own + 1;
    const values = texts.map((t) => new Dec(t));
    const base: CheckStats = {
      key: check.key, label: check.label, unit: check.unit, nominal: check.nominal,
      low: fixedText(low, own), high: fixedText(high, own),
      n: values.length, mean: null, min: null, max: null, range: null, spreadFromFirst: null, stdDev: null, decimals,
      passCount: 0, failCount: 0, deviations: [],
    };
    if (values.length === 0) return base;
    const first = values[0] as Dec;
    const sum = values.reduce((a, v) => a.plus(v), new Dec(0));
    const mean = sum.div(values.length);
    const min = Dec.min(...values);
    const max = Dec.max(...values);
    const spread = values.reduce((a, v) => Dec.max(a, v.minus(first).abs()), new Dec(0));
    let stdDev: string | null = null;
    if (values.length > 1) {
      const squares = values.reduce((a, v) => a.plus(v.minus(mean).pow(2)), new Dec(0));
      stdDev = fixedText(squares.div(values.length - 1).sqrt(), decimals);
    }
    const deviations: PartDeviation[] = rows.map((p, i) => {
      const v = values[i] as Dec;
      return {
        partNo: p.partNo,
        value: texts[i] as string,
        fromNominal: fixedText(v.minus(nominal), decimals),
        fromFirst: fixedText(v.minus(first), decimals),
        pass: v.gte(low) && v.lte(high),
      };
    });
    const passCount = deviations.filter((d) => d.pass).length;
    return {
      ...base,
      mean: fixedText(mean, decimals),
      min: fixedText(min, decimals),
      max: fixedText(max, decimals),
      range: fixedText(max.minus(min), decimals),
      spreadFromFirst: fixedText(spread, decimals),
      stdDev,
      passCount,
      failCount: deviations.length - passCount,
      deviations,
    };
  });
}
