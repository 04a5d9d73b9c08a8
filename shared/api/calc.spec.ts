import { Dec } from '../calc/decimal-math';
import { decimalValue, parseRequest, sineBarRequestSchema, taperRequestSchema } from './calc';

describe('calc request schemas', () => {
  it('should accept numbers and decimal text as exact decimals', () => {
    const r = decimalValue.safeParse('0.1000000000000000000001');
    expect(r.success && r.data.toString()).toBe('0.1000000000000000000001');
    const n = decimalValue.safeParse(0.1);
    expect(n.success && n.data.eq(new Dec('0.1'))).toBe(true);
  });

  it('should refuse text that is not a plain decimal', () => {
    for (const bad of ['1e5', '0x10', '1,5', 'abc', '', ' ', 'NaN', 'Infinity']) expect(decimalValue.safeParse(bad).success).toBe(false);
    expect(decimalValue.safeParse(Number.POSITIVE_INFINITY).success).toBe(false);
  });

  it('should say a required number left empty is empty, and show text that is not a number', () => {
    const empty = parseRequest('Sine bar', sineBarRequestSchema, { unit: 'in', barLength: '  ', angle: '10' });
    expect(empty.ok || empty.fields.barLength).toBe('is empty; type a number, e.g. 0.750');
    const wrong = parseRequest('Sine bar', sineBarRequestSchema, { unit: 'in', barLength: '5 in', angle: '10' });
    expect(wrong.ok || wrong.fields.barLength).toBe('must be a decimal number such as 0.750, got "5 in"');
  });

  it('should treat null and "" as not given for optional fields', () => {
    const r = parseRequest('Taper', taperRequestSchema, { unit: 'in', thickness: 1, angle: 5, taperLength: '', faceLength: null });
    expect(r.ok && [r.value.taperLength, r.value.faceLength]).toEqual([undefined, undefined]);
  });

  it('should report "is required" for missing fields and one message per field', () => {
    const r = parseRequest('Sine bar', sineBarRequestSchema, { angle: 'x' });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.kind).toBe('invalid');
      expect(r.fields.unit).toBe('is required');
      expect(r.fields.barLength).toBe('is required');
      expect(r.fields.angle).toMatch(/not an angle/);
      expect(r.error).toBe('Sine bar: unit is required');
    }
  });

  it('should report a non-object body on "body"', () => {
    const r = parseRequest('Taper', taperRequestSchema, 42);
    expect(r.ok || r.fields).toEqual({ body: 'must be a JSON object' });
  });
});
