import { z } from 'zod';
import { parseAngle } from '../angle/angle-text';
import { Dec } from '../calc/decimal-math';
import { fail, type CalcFailure } from '../calc/step';

/**
 * Request schemas for every calculation, shared by the API routes, the engine functions and the
 * forms. Numbers may be sent as JSON numbers or as decimal text ("0.7500"); text keeps every digit.
 * Angles may be decimal degrees (7.5, "7.5") or degrees-minutes-seconds text ("7°30'").
 * An optional field may be omitted, null or "" (an empty form box); all three mean "not given".
 */

/** Largest length, in the request's unit, any calculation accepts. */
export const MAX_LENGTH = 100_000;

const DECIMAL_TEXT = /^\s*[+-]?(\d+(\.\d*)?|\.\d+)\s*$/;

/** A number or decimal text, turned into an exact decimal. */
export const decimalValue = z
  .union([z.number(), z.string()], { error: 'must be a number, e.g. 0.750' })
  .transform((value, ctx) => {
    if (typeof value === 'string' && !DECIMAL_TEXT.test(value)) {
      const message = value.trim() === '' ? 'is empty; type a number, e.g. 0.750' : `must be a decimal number such as 0.750, got "${value}"`;
      ctx.addIssue({ code: 'custom', message });
      return z.NEVER;
    }
    return new Dec(typeof value === 'string' ? value.trim() : value);
  });

/** A length greater than 0 and at most MAX_LENGTH. */
export const positiveLength = decimalValue
  .refine((d) => d.gt(0), { message: 'must be greater than 0' })
  .refine((d) => d.lte(MAX_LENGTH), { message: `must be at most ${MAX_LENGTH}` });

/** A length of 0 or more and at most MAX_LENGTH. */
export const nonNegativeLength = decimalValue
  .refine((d) => d.gte(0), { message: 'must be 0 or more' })
  .refine((d) => d.lte(MAX_LENGTH), { message: `must be at most ${MAX_LENGTH}` });

/** An angle as decimal degrees or DMS text, turned into exact decimal degrees. */
export const angleValue = z
  .union([z.number(), z.string()], { error: 'must be an angle, e.g. 7.5 or "7°30\'"' })
  .transform((value, ctx) => {
    const parsed = parseAngle(value);
    if (!parsed.ok) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    return parsed.degrees;
  });

/** An angle limited to a range; `open` ends exclude the limit. */
export function angleBetween(min: number, max: number, open: { min?: boolean; max?: boolean } = { min: true, max: true }) {
  const lo = open.min ? `greater than ${min}°` : `at least ${min}°`;
  const hi = open.max ? `less than ${max}°` : `at most ${max}°`;
  return angleValue.refine((d) => (open.min ? d.gt(min) : d.gte(min)) && (open.max ? d.lt(max) : d.lte(max)), {
    message: `must be ${lo} and ${hi}`,
  });
}

/** Treats null, "" and blank text as "not given" so form values can be passed straight in. */
export function optional<T extends z.ZodType>(schema: T) {
  return z.preprocess((value) => (value === null || (typeof value === 'string' && value.trim() === '') ? undefined : value), schema.optional());
}

/** Length unit of a request. */
export const lengthUnitSchema = z.enum(['in', 'mm'], { error: 'must be "in" or "mm"' });

// ---------------------------------------------------------------------------------------------
// Taper on an angle block (mill), with a chamfer variant.

/** POST /api/calc/taper body. Give the thickness and exactly two of angle, taperLength, endThickness (or removedAtEnd), faceLength. */
export const taperRequestSchema = z.object({
  unit: lengthUnitSchema,
  /** 'taper' (default): a taper to the end of the part; 'chamfer': a bevel on an edge given by its legs. */
  shape: optional(z.enum(['taper', 'chamfer'], { error: 'must be "taper" or "chamfer"' })),
  thickness: optional(positiveLength),
  angle: optional(angleBetween(0, 90)),
  taperLength: optional(positiveLength),
  endThickness: optional(nonNegativeLength),
  removedAtEnd: optional(positiveLength),
  faceLength: optional(positiveLength),
  depthPerPass: optional(positiveLength),
  fluteLength: optional(positiveLength),
  cutterDiameter: optional(positiveLength),
});
/** Taper request as sent (numbers or text). */
export type TaperRequest = z.input<typeof taperRequestSchema>;
/** Taper request after validation (exact decimals). */
export type TaperParsed = z.output<typeof taperRequestSchema>;

// ---------------------------------------------------------------------------------------------
// Gauge blocks.

/** Most blocks of one size the stack solver takes (no stack needs more; a box may hold more shims). */
export const MAX_SOLVER_BLOCKS_OF_A_SIZE = 20;

/** One entry of a custom block list: a size, or a size with how many of it the box holds. */
export const blockEntrySchema = z.union([
  decimalValue,
  z.object({ size: decimalValue, count: optional(z.number().int().min(0).max(MAX_SOLVER_BLOCKS_OF_A_SIZE)) }),
]);

/** ISO 3650 grades for which the tolerance table holds values. */
export const gaugeGradeSchema = z.enum(['K', '0', '1', '2'], { error: 'must be one of K, 0, 1, 2' });

/** Fields shared by every request that builds a gauge-block stack from a box of blocks. */
const boxFields = {
  /** A standard set id from GET /api/calc/gauge-sets. */
  set: optional(z.string().min(1).max(40)),
  /** A custom box: sizes or {size, count}. */
  blocks: optional(z.array(blockEntrySchema).min(1).max(200)),
  /** Sizes missing from the box (one entry per missing block). */
  missing: optional(z.array(decimalValue).max(200)),
  /** Thickness of the wear blocks wrung to both ends of the stack. */
  wearBlocks: optional(positiveLength),
};

/** POST /api/calc/gauge-stack body. */
export const gaugeStackRequestSchema = z.object({
  target: positiveLength,
  unit: optional(lengthUnitSchema),
  ...boxFields,
  grade: optional(gaugeGradeSchema),
  /** Temperature of the blocks in °C, for the length change away from 20 °C. */
  temperature: optional(decimalValue.refine((d) => d.gte(-50) && d.lte(100), { message: 'must be between -50 and 100 °C' })),
  /** Expansion coefficient in 1/K (default: steel, 11.5e-6). */
  expansionCoefficient: optional(decimalValue.refine((d) => d.gte(-0.0001) && d.lte(0.0001), { message: 'must be between -0.0001 and 0.0001 per K' })),
});
/** Gauge-stack request as sent. */
export type GaugeStackRequest = z.input<typeof gaugeStackRequestSchema>;
/** Gauge-stack request after validation. */
export type GaugeStackParsed = z.output<typeof gaugeStackRequestSchema>;

// ---------------------------------------------------------------------------------------------
// Sine bar and sine plate.

/** POST /api/calc/sine-bar body: give angle or stackHeight. */
export const sineBarRequestSchema = z.object({
  unit: lengthUnitSchema,
  barLength: positiveLength,
  angle: optional(angleBetween(0, 90, { min: false, max: true })),
  stackHeight: optional(nonNegativeLength),
  ...boxFields,
  /** Step to round the stack to; default the set's finest step, else the unit's resolution. */
  resolution: optional(positiveLength),
});
/** Sine-bar request as sent. */
export type SineBarRequest = z.input<typeof sineBarRequestSchema>;
/** Sine-bar request after validation. */
export type SineBarParsed = z.output<typeof sineBarRequestSchema>;

/** POST /api/calc/sine-table body. */
export const sineTableRequestSchema = z.object({
  unit: lengthUnitSchema,
  barLength: positiveLength,
  from: angleBetween(0, 90, { min: false, max: true }),
  to: angleBetween(0, 90, { min: false, max: true }),
  step: angleBetween(0, 90, { min: true, max: false }),
  ...boxFields,
  resolution: optional(positiveLength),
});
/** Sine-table request as sent. */
export type SineTableRequest = z.input<typeof sineTableRequestSchema>;
/** Sine-table request after validation. */
export type SineTableParsed = z.output<typeof sineTableRequestSchema>;

/** POST /api/calc/compound-sine-plate body: per axis give the angle or the stack. */
export const compoundSineRequestSchema = z.object({
  unit: lengthUnitSchema,
  /** Roll centre distance of the lower (first) plate. */
  lengthA: positiveLength,
  /** Roll centre distance of the upper (second) plate; default lengthA. */
  lengthB: optional(positiveLength),
  angleA: optional(angleBetween(0, 90, { min: false, max: true })),
  angleB: optional(angleBetween(0, 90, { min: false, max: true })),
  stackA: optional(nonNegativeLength),
  stackB: optional(nonNegativeLength),
  resolution: optional(positiveLength),
});
/** Compound sine-plate request as sent. */
export type CompoundSineRequest = z.input<typeof compoundSineRequestSchema>;
/** Compound sine-plate request after validation. */
export type CompoundSineParsed = z.output<typeof compoundSineRequestSchema>;

// ---------------------------------------------------------------------------------------------
// Angle blocks.

/** One block of a combination: its angle and whether it is reversed (subtracts). */
export const angleBlockUseSchema = z.object({
  angle: angleBetween(0, 360),
  reversed: optional(z.boolean({ error: 'must be true or false' })),
});

/** POST /api/calc/angle-blocks body: give `angle` to find the fewest blocks, or `combination` to total one. */
export const angleBlocksRequestSchema = z.object({
  /** A set id from GET /api/calc/angle-block-sets. */
  set: optional(z.string().min(1).max(40)),
  /** A custom set: the angle of each block. */
  blocks: optional(z.array(angleBetween(0, 360)).min(1).max(24)),
  angle: optional(angleBetween(0, 360)),
  combination: optional(z.array(angleBlockUseSchema).min(1).max(24)),
});
/** Angle-block request as sent. */
export type AngleBlocksRequest = z.input<typeof angleBlocksRequestSchema>;
/** Angle-block request after validation. */
export type AngleBlocksParsed = z.output<typeof angleBlocksRequestSchema>;

// ---------------------------------------------------------------------------------------------
// Lathe tapers.

/** POST /api/calc/lathe-taper body: define the taper once (or by two diameters and a length). */
export const latheTaperRequestSchema = z.object({
  unit: lengthUnitSchema,
  taperPerFoot: optional(positiveLength),
  taperPerInch: optional(positiveLength),
  /** x of a taper ratio 1:x (diameter change 1 over length x). */
  ratio: optional(positiveLength),
  includedAngle: optional(angleBetween(0, 180)),
  halfAngle: optional(angleBetween(0, 90)),
  /** A standard machine taper id from GET /api/calc/machine-tapers. */
  standard: optional(z.string().min(1).max(40)),
  largeDiameter: optional(positiveLength),
  smallDiameter: optional(positiveLength),
  length: optional(positiveLength),
  /** Total length of the work between centres, for the tail-stock offset. */
  workLength: optional(positiveLength),
  /** Distances from the large end at which to give the diameter. */
  stations: optional(z.array(nonNegativeLength).max(50)),
});
/** Lathe-taper request as sent. */
export type LatheTaperRequest = z.input<typeof latheTaperRequestSchema>;
/** Lathe-taper request after validation. */
export type LatheTaperParsed = z.output<typeof latheTaperRequestSchema>;

// ---------------------------------------------------------------------------------------------
// Pins and rolls.

/** Dovetail over (male) or between (female) two equal rolls; give width or measurement. */
export const dovetailRequestSchema = z.object({
  kind: z.literal('dovetail'),
  unit: lengthUnitSchema,
  side: z.enum(['male', 'female'], { error: 'must be "male" or "female"' }),
  /** Angle between flank and base (usually 60°). */
  angle: angleBetween(0, 90),
  rollDiameter: positiveLength,
  /** Sharp-corner width at the roll side. */
  width: optional(positiveLength),
  /** Reading over (male) or between (female) the rolls. */
  measurement: optional(positiveLength),
  /** Dovetail depth, for the flank run c = h·cot α. */
  depth: optional(positiveLength),
});

/** Dovetail angle from readings over two pairs of rolls of different sizes. */
export const dovetailAngleRequestSchema = z.object({
  kind: z.literal('dovetail-angle'),
  unit: lengthUnitSchema,
  side: z.enum(['male', 'female'], { error: 'must be "male" or "female"' }),
  rollDiameter1: positiveLength,
  measurement1: positiveLength,
  rollDiameter2: positiveLength,
  measurement2: positiveLength,
});

/** Pin in a V-groove: height of the pin top over the surface; give grooveWidth or measurement. */
export const vGrooveRequestSchema = z.object({
  kind: z.literal('v-groove'),
  unit: lengthUnitSchema,
  includedAngle: angleBetween(0, 180),
  pinDiameter: positiveLength,
  /** Sharp-corner width of the groove at the surface. */
  grooveWidth: optional(positiveLength),
  /** Height of the pin top above the surface (negative when below). */
  measurement: optional(decimalValue),
});

/** Taper angle from readings over rolls (or across) at two heights. */
export const taperTwoHeightsRequestSchema = z.object({
  kind: z.literal('taper-two-heights'),
  unit: lengthUnitSchema,
  measurement1: positiveLength,
  measurement2: positiveLength,
  heightDifference: positiveLength,
});

/** Two-disc taper method: give centreDistance, or taperPerFoot / includedAngle to find it. */
export const taperDiscsRequestSchema = z.object({
  kind: z.literal('taper-discs'),
  unit: lengthUnitSchema,
  largeDisc: positiveLength,
  smallDisc: positiveLength,
  centreDistance: optional(positiveLength),
  taperPerFoot: optional(positiveLength),
  includedAngle: optional(angleBetween(0, 180)),
  /** 'axis' (default): taper symmetric about the centre line; 'side': one side square to the base. */
  reference: optional(z.enum(['axis', 'side'], { error: 'must be "axis" or "side"' })),
});

/** Internal taper from two balls: depths of each ball's top below the face (negative when it stands proud). */
export const taperBallsRequestSchema = z.object({
  kind: z.literal('taper-balls'),
  unit: lengthUnitSchema,
  largeBall: positiveLength,
  smallBall: positiveLength,
  largeBallDepth: decimalValue,
  smallBallDepth: decimalValue,
});

/** POST /api/calc/over-pins body, chosen by `kind`. */
export const overPinsRequestSchema = z.discriminatedUnion(
  'kind',
  [dovetailRequestSchema, dovetailAngleRequestSchema, vGrooveRequestSchema, taperTwoHeightsRequestSchema, taperDiscsRequestSchema, taperBallsRequestSchema],
  { error: 'must be one of dovetail, dovetail-angle, v-groove, taper-two-heights, taper-discs, taper-balls' },
);
/** Over-pins request as sent. */
export type OverPinsRequest = z.input<typeof overPinsRequestSchema>;
/** Over-pins request after validation. */
export type OverPinsParsed = z.output<typeof overPinsRequestSchema>;

// ---------------------------------------------------------------------------------------------

/** Field path of an issue as the API reports it ("body" for the whole request). */
function fieldOf(path: readonly PropertyKey[]): string {
  return path.length ? path.map(String).join('.') : 'body';
}

/** The raw value at a path of the request, or undefined. */
function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let current: unknown = input;
  for (const key of path) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<PropertyKey, unknown>)[key];
  }
  return current;
}

/**
 * Validates a request with one of the schemas above. On failure returns an 'invalid' CalcFailure
 * with one message per field (the first issue of each field).
 */
export function parseRequest<S extends z.ZodType>(
  area: string,
  schema: S,
  input: unknown,
): { ok: true; value: z.output<S> } | CalcFailure {
  const parsed = schema.safeParse(input);
  if (parsed.success) return { ok: true, value: parsed.data };
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const key = fieldOf(issue.path);
    let message = issue.message;
    if (key === 'body' && issue.code === 'invalid_type') message = 'must be a JSON object';
    else if (valueAt(input, issue.path) === undefined && issue.code !== 'unrecognized_keys') message = 'is required';
    if (!(key in fields)) fields[key] = message;
  }
  return fail('invalid', area, fields);
}
