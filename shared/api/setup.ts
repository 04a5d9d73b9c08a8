import { z } from 'zod';

/** Calculation areas a set-up can belong to (the `kind` of a set-up). */
export const SETUP_KINDS = ['taper', 'sine-bar', 'gauge-blocks', 'angle-blocks', 'lathe-taper', 'pins-rolls'] as const;
export type SetupKind = (typeof SETUP_KINDS)[number];
/** Names of the set-up kinds (the calculation areas) as the app's pages and sheets show them. */
export const SETUP_KIND_LABELS: Readonly<Record<SetupKind, string>> = {
  taper: 'Taper planner',
  'sine-bar': 'Sine bar & plate',
  'gauge-blocks': 'Gauge blocks',
  'angle-blocks': 'Angle blocks',
  'lathe-taper': 'Lathe tapers',
  'pins-rolls': 'Pins & rolls',
};
/** A kind's name, or the kind itself when unknown. */
export const kindLabel = (kind: string): string => SETUP_KIND_LABELS[kind as SetupKind] ?? kind;

export const SETUP_STATUSES = ['draft', 'released', 'archived'] as const;
export type SetupStatus = (typeof SETUP_STATUSES)[number];

/** Units a measured check value can be in. */
export const CHECK_UNITS = ['in', 'mm', 'deg'] as const;
export type CheckUnit = (typeof CHECK_UNITS)[number];

/**
 * A value measured on every part of a batch run (end thickness, face length, over-pins reading…)
 * with its tolerance band: a part passes when nominal − minus ≤ value ≤ nominal + plus.
 * Numbers are decimal text so no digit is lost.
 */
export interface SetupCheck {
  /** Short id, unique within the set-up (e.g. "end-thickness"). */
  key: string;
  /** What is measured, in trade words (e.g. "End thickness at the edge"). */
  label: string;
  unit: CheckUnit;
  nominal: string;
  /** Allowed amount over nominal (0 or more). */
  plus: string;
  /** Allowed amount under nominal (0 or more). */
  minus: string;
}

export interface SetupDto {
  id: number;
  name: string;
  kind: string;
  inputs: Record<string, unknown>;
  notes: string;
  job: string | null;
  status: SetupStatus;
  /** Increases with every change; PUT must send the version it was based on. */
  version: number;
  /** The check values a batch run measures on each part. */
  checks: SetupCheck[];
  ownerId: number;
  ownerName: string | null;
  /** When the current content was released, or null while a draft. */
  releasedAt: string | null;
  releasedByName: string | null;
  /**
   * The version last released, or null if never. A draft with one is a revision of a released
   * set-up: the team still reads it (its runs and sheet are in use) until a lead releases it again.
   */
  releasedVersion: number | null;
  createdAt: string;
  updatedAt: string;
}

/** Decimal text as typed on the shop floor: optional sign, up to 6 digits before and after the point. */
export const DECIMAL_TEXT = /^-?\d{1,6}(\.\d{1,6})?$/;

/** A decimal typed without its leading zero (".5", as on the shop floor) with it ("0.5"); other text as it is. */
export function withLeadingZero(text: string): string {
  return /^\.\d/.test(text) ? `0${text}` : text;
}

/**
 * Decimal text as the shop floor writes it, in the form kept: "+.002" → "0.002", "-.5" → "-0.5".
 * Other text as it is (the schema then says what is wrong with it).
 */
export function normalDecimalText(text: string): string {
  const t = text.trim().replace(/^\+(?=[\d.])/, '');
  return t.startsWith('-') ? `-${withLeadingZero(t.slice(1))}` : withLeadingZero(t);
}

/**
 * A decimal number sent as text or as a JSON number, kept as text. `min0` fields (tolerances) are
 * amounts: `sign` says which way, for the message when one is typed with a minus sign.
 */
export function decimalText(what: string, opts: { min0?: boolean; sign?: string } = {}) {
  return z
    .union([z.string(), z.number()], { error: `${what} must be a number such as 0.750.` })
    .transform((v) => (typeof v === 'number' ? String(v) : normalDecimalText(v)))
    .check((ctx) => {
      const v = ctx.value;
      if (!DECIMAL_TEXT.test(v)) {
        ctx.issues.push({ code: 'custom', input: v, message: `${what} must be a decimal number such as 0.750 (at most 6 decimals).` });
      } else if (opts.min0 && v.startsWith('-')) {
        const how = opts.sign ? `: it is how far ${opts.sign} nominal a part may be, so type it without a minus sign (${v.slice(1)}, not ${v})` : '';
        ctx.issues.push({ code: 'custom', input: v, message: `${what} must be 0 or more${how}.` });
      }
    });
}

export const setupCheckSchema = z.object({
  key: z.string({ error: 'Give the check a short key.' }).regex(/^[a-z][a-z0-9-]{0,39}$/, 'Key: lower-case letters, digits and dashes, starting with a letter (40 at most).'),
  label: z.string({ error: 'Say what is measured.' }).trim().min(1, 'Say what is measured.').max(80, 'Keep the label under 80 characters.'),
  unit: z.enum(CHECK_UNITS, { error: `Unit must be one of: ${CHECK_UNITS.join(', ')}.` }),
  nominal: decimalText('Nominal'),
  plus: decimalText('Plus tolerance', { min0: true, sign: 'over' }),
  minus: decimalText('Minus tolerance', { min0: true, sign: 'under' }),
}).superRefine((check, ctx) => {
  // A size or an angle measured on the part is never below 0 (a minus sign is a slip: every reading
  // would then fail). 0 stays for what is measured from zero, such as flatness or runout.
  const problem = nominalProblem(check.unit, check.nominal);
  if (problem) ctx.addIssue({ code: 'custom', path: ['nominal'], message: problem });
});

/**
 * What is wrong with a check's nominal for its unit, or null: lengths and angles measured on a part
 * are 0 or more, and an angle under 360°. (Nominal text that is not a decimal is reported by its own rule.)
 */
export function nominalProblem(unit: string, nominal: string): string | null {
  if (!DECIMAL_TEXT.test(nominal)) return null;
  const value = Number(nominal);
  if (unit === 'deg') {
    if (value < 0) return 'Nominal must be 0° or more: an angle measured on the part has no sign.';
    if (value >= 360) return 'Nominal must be under 360°.';
    return null;
  }
  if (value < 0) return `Nominal must be 0 or more: a size measured on the part is never below 0 ${unit}. Take off the minus sign.`;
  return null;
}

const checks = z
  .array(setupCheckSchema, { error: 'Checks must be a list.' })
  .max(12, 'At most 12 check values per set-up.')
  .refine((list) => new Set(list.map((c) => c.key)).size === list.length, 'Each check needs its own key.')
  .superRefine((list, ctx) => {
    // Two checks of one name cannot be told apart on the batch sheet or in its CSV.
    const seen = new Set<string>();
    list.forEach((c, i) => {
      const name = c.label.trim().toLowerCase();
      if (seen.has(name)) ctx.addIssue({ code: 'custom', path: [i, 'label'], message: `"${c.label}" is already a check of this set-up; give each check its own name.` });
      seen.add(name);
    });
  });

const inputs = z
  .record(z.string(), z.unknown(), { error: 'Inputs must be an object of the area\'s input fields.' })
  .refine((value) => JSON.stringify(value).length <= 20_000, 'Inputs are too large (20,000 characters at most).');

export const setupCreateBody = z.object({
  name: z.string({ error: 'Give the set-up a name.' }).trim().min(1, 'Give the set-up a name.').max(160, 'Keep the name under 160 characters.'),
  kind: z.enum(SETUP_KINDS, { error: `Kind must be one of: ${SETUP_KINDS.join(', ')}.` }),
  inputs,
  notes: z.string({ error: 'Notes must be text.' }).max(10_000, 'Keep the notes under 10,000 characters.').optional(),
  job: z.string({ error: 'Job must be text.' }).trim().max(80, 'Keep the job number under 80 characters.').nullable().optional(),
  checks: checks.optional(),
}, { error: 'Send the set-up as an object with its name, kind and inputs.' });
export type SetupCreateBody = z.infer<typeof setupCreateBody>;

/**
 * PUT replaces the editable fields. `version` is required: it is the version the edit was based on,
 * and a stale one is refused with 409 so that no edit is silently lost.
 */
export const setupUpdateBody = setupCreateBody.extend({
  version: z
    .number({ error: 'Send the version your edit is based on (a whole number).' })
    .int('Version must be a whole number.')
    .positive('Version must be positive.'),
});
export type SetupUpdateBody = z.infer<typeof setupUpdateBody>;

/** Body of POST /api/setups/:id/release and /archive: the version the lead looked at (optional). */
export const setupStatusBody = z.object({
  version: z.number({ error: 'Version must be a whole number.' }).int('Version must be a whole number.').positive('Version must be positive.').optional(),
});

/** Columns the library list can be sorted by. */
export const SETUP_SORTS = ['name', 'kind', 'status', 'job', 'owner', 'updatedAt', 'createdAt'] as const;
export type SetupSort = (typeof SETUP_SORTS)[number];

/** Largest page the library list returns. */
export const MAX_PAGE_SIZE = 100;

const positiveIntText = (what: string, max: number) =>
  z
    .string({ error: `${what} must be a whole number.` })
    .regex(/^\d{1,9}$/, `${what} must be a whole number.`)
    .transform(Number)
    .refine((n) => n >= 1 && n <= max, `${what} must be between 1 and ${max}.`);

/** Query of GET /api/setups: search, filters, sort and paging (all optional). */
export const setupListQuery = z.object({
  /** Words searched in name, job and notes. */
  q: z.string().trim().max(100, 'Keep the search under 100 characters.').optional(),
  kind: z.enum(SETUP_KINDS, { error: `Kind must be one of: ${SETUP_KINDS.join(', ')}.` }).optional(),
  status: z.enum(SETUP_STATUSES, { error: `Status must be one of: ${SETUP_STATUSES.join(', ')}.` }).optional(),
  ownerId: positiveIntText('Owner', 4_294_967_295).optional(),
  job: z.string().trim().max(80, 'Keep the job under 80 characters.').optional(),
  sort: z.enum(SETUP_SORTS, { error: `Sort must be one of: ${SETUP_SORTS.join(', ')}.` }).optional(),
  dir: z.enum(['asc', 'desc'], { error: 'Dir must be asc or desc.' }).optional(),
  page: positiveIntText('Page', 1_000_000).optional(),
  pageSize: positiveIntText('Page size', MAX_PAGE_SIZE).optional(),
});
export type SetupListQuery = z.input<typeof setupListQuery>;

/** Someone who owns set-ups the caller may see, with how many: the library's owner filter. */
export interface SetupOwnerDto {
  id: number;
  name: string;
  count: number;
}

/** Answer of GET /api/setups/owners, sorted by name. */
export interface SetupOwnersDto {
  owners: SetupOwnerDto[];
}

/** A page of the library: the set-ups plus the paging figures. */
export interface SetupPageDto {
  setups: SetupDto[];
  /** How many set-ups match the filters in all (not only this page). */
  total: number;
  page: number;
  pageSize: number;
}

/** What one revision changed: a field and its old and new value (values shortened for display). */
export interface FieldChange {
  field: string;
  from: string;
  to: string;
}

export const REVISION_ACTIONS = ['created', 'edited', 'released', 'archived', 'imported', 'attached', 'detached'] as const;
export type RevisionAction = (typeof REVISION_ACTIONS)[number];

/** One entry of a set-up's history. */
export interface RevisionDto {
  id: number;
  /** The set-up's version after this change. */
  version: number;
  action: RevisionAction;
  userId: number | null;
  userName: string | null;
  createdAt: string;
  changes: FieldChange[];
  /** Status of the set-up after the change. */
  status: SetupStatus;
}

/** The JSON file a set-up is exported as, and the body import accepts. */
export const SETUP_EXPORT_FORMAT = 'slantwise.setup/1';

export const setupImportBody = z.object({
  format: z.literal(SETUP_EXPORT_FORMAT, { error: `This is not a set-up file exported from Slantwise (its format must be "${SETUP_EXPORT_FORMAT}").` }),
  setup: setupCreateBody,
}, { error: 'A set-up file is a JSON object with its format and the set-up.' });
export type SetupImportBody = z.infer<typeof setupImportBody>;

/** GET /api/setups/:id/export body. */
export interface SetupExportDto {
  format: typeof SETUP_EXPORT_FORMAT;
  exportedAt: string;
  source: { team: string; id: number; version: number; status: SetupStatus };
  setup: { name: string; kind: string; inputs: Record<string, unknown>; notes: string; job: string | null; checks: SetupCheck[] };
}

/** An uploaded drawing or photo of a set-up. */
export interface AttachmentDto {
  id: number;
  setupId: number;
  /** The name the file had on the uploader's computer (shown and offered on download only). */
  fileName: string;
  contentType: 'application/pdf' | 'image/png' | 'image/jpeg';
  size: number;
  sha256: string;
  hasThumbnail: boolean;
  width: number | null;
  height: number | null;
  uploadedById: number | null;
  uploadedByName: string | null;
  createdAt: string;
}
