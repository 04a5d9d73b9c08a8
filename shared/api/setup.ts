import { z } from 'zod';

/** Calculation areas a set-up can belong to (the `kind` of a set-up). */
export const SETUP_KINDS = ['taper', 'sine-bar', 'gauge-blocks', 'angle-blocks', 'lathe-taper', 'pins-rolls'] as const;
export type SetupKind = (typeof SETUP_KINDS)[number];

export const SETUP_STATUSES = ['draft', 'released', 'archived'] as const;
export type SetupStatus = (typeof SETUP_STATUSES)[number];

export interface SetupDto {
  id: number;
  name: string;
  kind: string;
  inputs: Record<string, unknown>;
  notes: string;
  job: string | null;
  status: SetupStatus;
  version: number;
  ownerId: number;
  ownerName: string | null;
  createdAt: string;
  updatedAt: string;
}

const inputs = z
  .record(z.string(), z.unknown(), { error: 'Inputs must be an object of the area\'s input fields.' })
  .refine((value) => JSON.stringify(value).length <= 20_000, 'Inputs are too large (20,000 characters at most).');

export const setupCreateBody = z.object({
  name: z.string({ error: 'Give the set-up a name.' }).trim().min(1, 'Give the set-up a name.').max(160, 'Keep the name under 160 characters.'),
  kind: z.enum(SETUP_KINDS, { error: `Kind must be one of: ${SETUP_KINDS.join(', ')}.` }),
  inputs,
  notes: z.string({ error: 'Notes must be text.' }).max(10_000, 'Keep the notes under 10,000 characters.').optional(),
  job: z.string({ error: 'Job must be text.' }).trim().max(80, 'Keep the job number under 80 characters.').nullable().optional(),
});
export type SetupCreateBody = z.infer<typeof setupCreateBody>;

/** PUT replaces the editable fields; `version` is the version the edit was based on (optional in the first cut). */
export const setupUpdateBody = setupCreateBody.extend({
  version: z.number({ error: 'Version must be a whole number.' }).int('Version must be a whole number.').positive('Version must be positive.').optional(),
});
export type SetupUpdateBody = z.infer<typeof setupUpdateBody>;
