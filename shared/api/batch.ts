import { z } from 'zod';
import { DECIMAL_TEXT, type SetupCheck } from './setup';

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
    .transform((v) => (v === null ? null : typeof v === 'number' ? String(v) : v.trim()))
    .transform((v) => (v === '' ? null : v))
    .refine((v) => v === null || DECIMAL_TEXT.test(v), `${what} must be a decimal number such as 0.1645 (at most 6 decimals).`);

/** POST /api/batches/:id/parts (and PUT …/parts/:partNo): one part's readings. */
export const batchPartBody = z.object({
  /** Part number; default the next one. */
  partNo: z.number({ error: 'Part number must be a whole number.' }).int('Part number must be a whole number.').min(1, 'Part number must be at least 1.').max(MAX_BATCH_PARTS).optional(),
  touchOff: reading('Touch-off').optional(),
  droAtStop: reading('DRO at stop').optional(),
  values: z.record(z.string(), z.union([z.string(), z.number()]), { error: 'Values must be an object of check key → reading.' }),
  note: z.string({ error: 'Note must be text.' }).max(500, 'Keep the note under 500 characters.').optional(),
});
export type BatchPartBody = z.infer<typeof batchPartBody>;
