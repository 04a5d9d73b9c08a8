import { z } from 'zod';
import { readReading, readingProblem } from '../batch/reading';
import type { SetupCheck } from './setup';

export const BATCH_STATUSES = ['open', 'closed'] as const;
export type BatchStatus = (typeof BATCH_STATUSES)[number];

/** Most parts one run may hold. */
export const MAX_BATCH_PARTS = 500;

/** One part of a batch run as entered at the machine. */
export interface BatchPartDto {
  id: number;
  partNo: number;
  /** DRO reading where the cutter touched off, or null. */
  touchOff: string | null;
  /** DRO reading at the stop, or null. */
  droAtStop: string | null;
  /** Measured value per check key, as decimal text. */
  values: Record<string, string>;
  pass: boolean;
  /** Keys of the checks outside their band. */
  outOfBand: string[];
  operatorId: number | null;
  operatorName: string | null;
  measuredAt: string;
  note: string;
  /** When the part's readings were last corrected (null: as recorded). */
  correctedAt: string | null;
  correctedByName: string | null;
  /** The readings as first recorded, before any correction (null: never corrected). */
  firstRecorded: PartReadings | null;
  /**
   * A tag of the part as stored (readings, note and who last corrected it): a correction sends the
   * tag of the part it was based on and is refused with 409 when the part has changed since.
   */
  revision: string;
}

/** A part's readings: the DRO figures and the measured value per check. */
export interface PartReadings {
  touchOff: string | null;
  droAtStop: string | null;
  values: Record<string, string>;
}

/** A part's deviation on one check. */
export interface PartDeviation {
  partNo: number;
  value: string;
  fromNominal: string;
  fromFirst: string;
  pass: boolean;
}

/** Statistics of one check over the parts entered so far. */
export interface CheckStats {
  key: string;
  label: string;
  unit: string;
  nominal: string;
  /** Lower and upper limit of the band. */
  low: string;
  high: string;
  n: number;
  mean: string | null;
  min: string | null;
  max: string | null;
  /** max − min. */
  range: string | null;
  /** The largest |value − first part's value|: how far the batch strays from the first part. */
  spreadFromFirst: string | null;
  /** Sample standard deviation (n − 1), or null below two parts. */
  stdDev: string | null;
  /** Decimals of every figure above (mean to std dev): one more than the check's own, for any reading. */
  decimals: number;
  passCount: number;
  failCount: number;
  deviations: PartDeviation[];
}

/** A batch run: a released set-up made on N parts. */
export interface BatchRunDto {
  id: number;
  setupId: number;
  setupName: string;
  /** The set-up's version the run was started from (its checks are copied into the run). */
  setupVersion: number;
  label: string;
  partCount: number;
  status: BatchStatus;
  checks: SetupCheck[];
  startedById: number | null;
  startedByName: string | null;
  closedAt: string | null;
  closedByName: string | null;
  version: number;
  summary: { entered: number; passed: number; failed: number };
  createdAt: string;
  updatedAt: string;
  parts?: BatchPartDto[];
  stats?: CheckStats[];
}

/** POST /api/batches. */
export const batchCreateBody = z.object({
  setupId: z.number({ error: 'Choose the released set-up to run (setupId).' }).int('setupId must be a whole number.').positive('setupId must be positive.'),
  partCount: z.number({ error: 'Say how many parts the batch has.' }).int('Part count must be a whole number.').min(1, 'Part count must be at least 1.').max(MAX_BATCH_PARTS, `Part count must be at most ${MAX_BATCH_PARTS}.`),
  label: z.string({ error: 'Label must be text.' }).trim().max(120, 'Keep the label under 120 characters.').optional(),
});
export type BatchCreateBody = z.infer<typeof batchCreateBody>;

const reading = (what: string) =>
  z
    .union([z.string(), z.number(), z.null()], { error: `${what} must be a number such as 0.1645.` })
    .transform((v, ctx) => {
      const text = v === null ? '' : typeof v === 'number' ? String(v) : v.trim();
      if (text === '') return null;
      const read = readReading(text);
      if (read.ok) return read.text;
      ctx.addIssue({ code: 'custom', message: readingProblem(what, read.problem, '0.1645') });
      return z.NEVER;
    });

/** POST /api/batches/:id/parts: one part's readings. */
export const batchPartBody = z.object({
  /**
   * The part number the person means to record (the form sends the one it shows). Without it, the
   * lowest part not yet entered. A part already recorded meanwhile is refused with 409.
   */
  partNo: z.number({ error: 'Part number must be a whole number.' }).int('Part number must be a whole number.').min(1, 'Part number must be at least 1.').max(MAX_BATCH_PARTS).optional(),
  touchOff: reading('Touch-off').optional(),
  droAtStop: reading('DRO at stop').optional(),
  values: z.record(z.string(), z.union([z.string(), z.number()]), { error: 'Values must be an object of check key → reading.' }),
  note: z.string({ error: 'Note must be text.' }).max(500, 'Keep the note under 500 characters.').optional(),
  /** true: readings far from their nominal (a decimal-point slip, as a rule) are right as measured. */
  confirm: z.boolean({ error: 'Confirm must be true or false.' }).optional(),
});
export type BatchPartBody = z.infer<typeof batchPartBody>;

/**
 * PUT /api/batches/:id/parts/:partNo: the corrected readings, and the part's `revision` the correction
 * was based on (a part changed since is refused with 409, so no correction is silently lost).
 */
export const batchCorrectionBody = batchPartBody.extend({
  revision: z
    .string({ error: 'Send the revision of the part your correction is based on (from the part as loaded).' })
    .min(1, 'Send the revision of the part your correction is based on (from the part as loaded).')
    .max(64, 'Revision must be the text of the part\'s revision as loaded.'),
});
export type BatchCorrectionBody = z.infer<typeof batchCorrectionBody>;
