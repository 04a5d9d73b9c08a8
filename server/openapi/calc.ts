import { z } from 'zod';
import {
  angleBlocksRequestSchema,
  compoundSineRequestSchema,
  gaugeStackRequestSchema,
  overPinsRequestSchema,
  sineBarRequestSchema,
  sineTableRequestSchema,
  taperRequestSchema,
} from '../../shared/api/calc';
import { latheTaperEngineSchema } from '../../shared/calc/lathe-taper';

/**
 * OpenAPI 3.1 paths for the public calculation API (/api/calc). Request bodies are generated from
 * the same zod schemas the routes validate with. Number conventions: every length and angle in a
 * response is a decimal string (lengths at the unit's resolution — 0.0001 in, 0.001 mm, or 0.0005 mm
 * where the gauge set allows — angles in decimal degrees to 0.0001° plus a DMS string; angle blocks
 * to 0.000001°, as they come in whole arc-seconds); counts
 * (count, blockCount, pass) are JSON numbers; `exact` objects carry 30 significant digits.
 * In requests, numbers may be JSON numbers or decimal strings, angles decimal degrees or DMS text.
 */

type JsonSchema = Record<string, unknown>;

/** JSON Schema (2020-12, as OpenAPI 3.1 uses) of a request body, from its zod schema. */
function requestSchema(schema: z.ZodType): JsonSchema {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as JsonSchema;
  return rest;
}

const decimalString: JsonSchema = { type: 'string', pattern: '^-?\\d+(\\.\\d+)?$', description: 'Decimal number as text' };
const nullableDecimal: JsonSchema = { type: ['string', 'null'], description: 'Decimal number as text, or null' };
const dmsString: JsonSchema = { type: 'string', description: 'Angle as degrees-minutes-seconds, e.g. 7°30\'00"' };

const stepSchema: JsonSchema = {
  type: 'object',
  description: 'One line of the derivation',
  properties: {
    label: { type: 'string' },
    formula: { type: 'string' },
    substituted: { type: 'string' },
    value: { type: 'string' },
    unit: { type: 'string' },
  },
  required: ['label', 'formula', 'substituted', 'value', 'unit'],
};
const steps: JsonSchema = { type: 'array', items: stepSchema };
const strings: JsonSchema = { type: 'array', items: { type: 'string' } };

const errorBody: JsonSchema = {
  type: 'object',
  properties: {
    error: { type: 'string', description: 'One sentence naming the calculation, the field and the reason' },
    fields: { type: 'object', additionalProperties: { type: 'string' }, description: 'Message per field path; "body" for the whole request' },
  },
  required: ['error', 'fields'],
};

function object(properties: Record<string, JsonSchema>, required = Object.keys(properties)): JsonSchema {
  return { type: 'object', properties, required };
}

const stackAnswer = object({ blocks: strings, labels: { ...strings, description: 'The blocks as said to a person: wear blocks marked ("0.050 wear")' }, count: { type: 'integer' }, total: decimalString });

const responses = {
  taper: object({
    unit: { enum: ['in', 'mm'] },
    shape: { enum: ['taper', 'chamfer'] },
    angleDeg: decimalString,
    angleDms: dmsString,
    thickness: nullableDecimal,
    taperLength: decimalString,
    endThickness: nullableDecimal,
    faceLength: decimalString,
    depthToStop: decimalString,
    removedAtEnd: decimalString,
    tableTravel: decimalString,
    passes: { type: 'array', items: object({ pass: { type: 'integer' }, cut: decimalString, reading: decimalString }) },
    warnings: strings,
    cautions: strings,
    steps,
    exact: { type: 'object', additionalProperties: { type: ['string', 'null'] } },
  }),
  sineBar: object({
    unit: { enum: ['in', 'mm'] },
    barLength: decimalString,
    stackHeight: decimalString,
    angleDeg: decimalString,
    angleDms: dmsString,
    achievedAngleDeg: decimalString,
    achievedAngleDms: dmsString,
    errorArcSec: decimalString,
    sensitivityArcSec: decimalString,
    resolution: decimalString,
    complementDeg: decimalString,
    blocks: { type: ['array', 'null'], items: { type: 'string' } },
    blockCount: { type: ['integer', 'null'] },
    warnings: strings,
    cautions: strings,
    steps,
    exact: { type: 'object', additionalProperties: { type: 'string' } },
  }),
  sineTable: object({
    unit: { enum: ['in', 'mm'] },
    barLength: decimalString,
    resolution: decimalString,
    rows: {
      type: 'array',
      items: object({
        angleDeg: decimalString,
        angleDms: dmsString,
        stackHeight: decimalString,
        achievedAngleDeg: decimalString,
        errorArcSec: decimalString,
        blocks: { type: ['array', 'null'], items: { type: 'string' } },
        count: { type: ['integer', 'null'] },
      }),
    },
    unreachable: { type: 'integer' },
    steps,
  }),
  compound: object({
    unit: { enum: ['in', 'mm'] },
    axisA: { type: 'object' },
    axisB: { type: 'object' },
    resultantTiltDeg: decimalString,
    resultantTiltDms: dmsString,
    warnings: strings,
    steps,
  }),
  gaugeStack: object({
    unit: { enum: ['in', 'mm'] },
    set: { type: ['string', 'null'] },
    target: decimalString,
    resolution: decimalString,
    wearBlock: nullableDecimal,
    blocks: { ...strings, description: 'Block sizes in wringing order, largest first; wear blocks at both ends' },
    labels: { ...strings, description: 'The same blocks as said to a person: wear blocks marked ("0.050 wear")' },
    count: { type: 'integer' },
    total: decimalString,
    lastDigit: { oneOf: [stackAnswer, { type: 'null' }], description: 'The textbook last-digit stack (teaching answer)' },
    tolerance: { type: ['object', 'null'] },
    temperature: { type: ['object', 'null'] },
    warnings: strings,
    cautions: strings,
    steps,
  }),
  angleBlocks: object({
    set: { type: ['string', 'null'] },
    targetDeg: nullableDecimal,
    targetDms: { type: ['string', 'null'] },
    blocks: { type: 'array', items: object({ angle: dmsString, angleDeg: decimalString, direction: { enum: ['add', 'reverse'] } }) },
    count: { type: 'integer' },
    achievedAngleDeg: decimalString,
    achievedAngleDms: dmsString,
    errorArcSec: decimalString,
    exact: { type: 'boolean' },
    warnings: strings,
    steps,
  }),
  latheTaper: object(
    {
      unit: { enum: ['in', 'mm'] },
      taperPerFoot: { ...decimalString, description: 'Taper per foot on the diameter, in/ft (for mm work the same ratio × 12; the page shows mm work by its ratio instead)' },
      taperPerInch: { ...decimalString, description: 'Diameter change per unit of length: in/in, or mm per mm for mm work' },
      ratio: { type: 'string', description: '"1:x", x to 3 decimals (diameter change 1 over a length of x)' },
      includedAngleDeg: decimalString,
      includedAngleDms: dmsString,
      halfAngleDeg: decimalString,
      halfAngleDms: dmsString,
      largeDiameter: nullableDecimal,
      smallDiameter: nullableDecimal,
      length: nullableDecimal,
      tailstockOffset: nullableDecimal,
      stations: { type: 'array', items: object({ distance: decimalString, diameter: decimalString }) },
      standard: { type: ['object', 'null'] },
      warnings: strings,
      cautions: strings,
      steps,
    },
    ['unit', 'taperPerFoot', 'taperPerInch', 'includedAngleDeg', 'halfAngleDeg', 'steps'],
  ),
  overPins: object({
    kind: { type: 'string' },
    unit: { enum: ['in', 'mm'] },
    values: { type: 'object', additionalProperties: decimalString, description: 'Named results (e.g. measurement, width, includedAngleDeg, taperPerFoot)' },
    dms: { type: 'object', additionalProperties: dmsString },
    warnings: strings,
    steps,
    exact: { type: 'object', additionalProperties: { type: 'string' } },
  }),
};

function post(summary: string, description: string, body: z.ZodType, ok: JsonSchema, impossible: string) {
  return {
    post: {
      tags: ['calculations'],
      summary,
      description,
      security: [],
      requestBody: { required: true, content: { 'application/json': { schema: requestSchema(body) } } },
      responses: {
        '200': { description: 'The answer with its derivation', content: { 'application/json': { schema: ok } } },
        '400': { description: 'Malformed JSON or an invalid field', content: { 'application/json': { schema: errorBody } } },
        '422': { description: impossible, content: { 'application/json': { schema: errorBody } } },
        '429': { description: 'Rate limit reached' },
      },
    },
  };
}

function list(summary: string, key: string) {
  return {
    get: {
      tags: ['calculations'],
      summary,
      security: [],
      responses: { '200': { description: 'The data with source and status per entry', content: { 'application/json': { schema: object({ [key]: { type: 'array', items: { type: 'object' } } }) } } } },
    },
  };
}

/** OpenAPI paths of the calculation routes, merged into the served document. */
export const calcPaths = {
  '/api/calc/taper': post(
    'Taper or chamfer milled on an angle block',
    'Give thickness and exactly two of angle, taperLength, endThickness (or removedAtEnd), faceLength. shape "chamfer": two of angle, taperLength (leg on the top face), removedAtEnd (leg on the end), faceLength; thickness optional. depthToStop is h = L·sin α measured from touching off on the highest corner with the face set horizontal; removedAtEnd is d = L·tan α square to the top face.',
    taperRequestSchema,
    responses.taper,
    'The taper needs more than the stock (says where it runs out through the bottom), or the given lengths contradict each other',
  ),
  '/api/calc/sine-bar': post(
    'Sine bar / sine plate: stack for an angle or angle for a stack',
    'Give angle or stackHeight. With set (or blocks) the fewest gauge blocks for the stack are listed, largest first.',
    sineBarRequestSchema,
    responses.sineBar,
    'The stack would be as tall as or taller than the bar',
  ),
  '/api/calc/sine-table': post('Table of sine-bar stacks over an angle range', 'Rows from `from` to `to` every `step`; at most 20 000 rows.', sineTableRequestSchema, responses.sineTable, 'An angle in the range needs a stack as tall as the bar'),
  '/api/calc/compound-sine-plate': post('Compound sine plate: two angles ↔ two stacks', 'Per axis give the angle or the stack.', compoundSineRequestSchema, responses.compound, 'A stack would be as tall as the plate'),
  '/api/calc/gauge-stack': post(
    'Fewest gauge blocks for a length',
    'Exact fewest-block stack (each block at most once), blocks largest first; the last-digit method as a teaching answer; optional wear blocks on both ends, grade tolerance and temperature correction.',
    gaugeStackRequestSchema,
    responses.gaugeStack,
    'The box cannot make the target',
  ),
  '/api/calc/angle-blocks': post('Angle blocks: fewest blocks for an angle, or the angle of a combination', 'Blocks add with marks in line and subtract when reversed.', angleBlocksRequestSchema, responses.angleBlocks, 'No combination makes a positive angle'),
  '/api/calc/lathe-taper': post(
    'Lathe taper conversions and tail-stock offset',
    'Give one of taperPerFoot, taperPerInch, ratio ("1:20"), includedAngle, halfAngle, standard — or largeDiameter, smallDiameter and length. Warnings say when the tail-stock offset is more than a tail stock usually sets over, when the taper is too steep for the offset method, and when the cone is very flat.',
    latheTaperEngineSchema,
    responses.latheTaper,
    'The taper comes to a point within the given length',
  ),
  '/api/calc/over-pins': post(
    'Measurement over pins, rolls, discs and balls',
    'kind: dovetail, dovetail-angle, v-groove, taper-two-heights, taper-discs, taper-balls.',
    overPinsRequestSchema,
    responses.overPins,
    'The readings do not fit the geometry',
  ),
  '/api/calc/gauge-sets': list('Standard gauge-block sets with sources', 'sets'),
  '/api/calc/angle-block-sets': list('Angle-block sets with sources', 'sets'),
  '/api/calc/machine-tapers': list('Standard machine tapers with sources', 'tapers'),
};
