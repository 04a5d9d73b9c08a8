import fc from 'fast-check';
import { calculateOverPins, type OverPinsResult } from './over-pins';
import type { CalcResult } from './step';

function value(r: CalcResult<OverPinsResult>): OverPinsResult {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}
const pins = (input: Record<string, unknown>) => value(calculateOverPins(input)).values;

describe('calculateOverPins', () => {
  describe("dovetails (Machinery's Handbook \"Measuring dovetail slides\", REFERENCE.md §5.1, values derived)", () => {
    it.each([
      [60, 0.5, 2, '3.3660'],
      [60, 0.375, 1.25, '2.2745'],
      [45, 0.25, 1.5, '2.3536'],
    ])('male %s°, roll %s in, a = %s in → x = %s in', (angle, roll, a, x) => {
      expect(pins({ kind: 'dovetail', unit: 'in', side: 'male', angle, rollDiameter: roll, width: a }).measurement).toBe(x);
    });
    it('should give 71.856 mm over 8 mm rolls on a 50 mm male 60° dovetail', () => {
      expect(pins({ kind: 'dovetail', unit: 'mm', side: 'male', angle: 60, rollDiameter: 8, width: 50 }).measurement).toBe('71.856');
    });
    it('should give y = 1.1340 in between 0.500 in rolls for a 2.500 in female 60° dovetail, and back', () => {
      expect(pins({ kind: 'dovetail', unit: 'in', side: 'female', angle: 60, rollDiameter: 0.5, width: 2.5 }).measurement).toBe('1.1340');
      expect(pins({ kind: 'dovetail', unit: 'in', side: 'female', angle: 60, rollDiameter: 0.5, measurement: '1.13397' }).width).toBe('2.5000');
    });
    it('should round an exact half up: the 0.375 in roll on a 60° flank touches 0.28125 → 0.2813 in up (0.1875 · (1 + cos 60°), derived)', () => {
      // cos 60° comes out 0.4999…9 at the working precision; the half must still round up, as 0.99985 → 0.9999 does.
      const r = value(calculateOverPins({ kind: 'dovetail', unit: 'in', side: 'male', angle: 60, rollDiameter: 0.375, width: 1.25, depth: 0.375 }));
      expect(r.values.contactHeight).toBe('0.2813');
      expect(r.exact.contactHeight).toBe('0.28125');
      // 3 mm roll: 1.5 · 1.5 = 2.25 mm exactly; 0.0375 in roll: 0.028125 → 0.0281 (below a half at 4 places, derived).
      expect(pins({ kind: 'dovetail', unit: 'mm', side: 'male', angle: 60, rollDiameter: 3, width: 50, depth: 10 }).contactHeight).toBe('2.250');
      expect(pins({ kind: 'dovetail', unit: 'in', side: 'male', angle: 60, rollDiameter: '0.0375', width: 1, depth: 0.375 }).contactHeight).toBe('0.0281');
    });
    it('should give c = 0.2165 in for h = 0.375 in at 60°', () => {
      expect(pins({ kind: 'dovetail', unit: 'in', side: 'male', angle: 60, rollDiameter: 0.25, width: 2, depth: 0.375 }).flankRun).toBe('0.2165');
    });
    it('should warn about a dovetail angle far from the usual ones, naming the angle from the vertical (common practice)', () => {
      const warn = (angle: number) => value(calculateOverPins({ kind: 'dovetail', unit: 'in', side: 'male', angle, rollDiameter: 0.25, width: 2 })).warnings;
      for (const usual of [45, 55, 60]) expect(warn(usual)).toEqual([]);
      expect(warn(20)).toEqual([expect.stringMatching(/^A dovetail angle of 20°00'00" between the flank and the base is unusual.+would make it 70°00'00"\)\.$/)]);
      expect(warn(80)).toHaveLength(1);
    });
    it('should find the angle and width from two roll sizes (toolmonger inverse, derived)', () => {
      // a = 1.5, α = 60°: x₁ = 1.5 + 0.25·2.7320508 = 2.1830127, x₂ = 1.5 + 0.5·2.7320508 = 2.8660254.
      const v = pins({ kind: 'dovetail-angle', unit: 'in', side: 'male', rollDiameter1: 0.25, measurement1: '2.1830127', rollDiameter2: 0.5, measurement2: '2.8660254' });
      expect(v.angleDeg).toBe('60.0000');
      expect(v.width).toBe('1.5000');
    });
  });

  describe('readings no dovetail can give', () => {
    const fields = (input: Record<string, unknown>) => {
      const r = calculateOverPins(input);
      if (r.ok) throw new Error('expected a refusal');
      return r.fields;
    };
    const twoRolls = { kind: 'dovetail-angle', unit: 'in', side: 'male', rollDiameter1: '0.375', measurement1: '2.2745', rollDiameter2: '0.500' };

    it('should refuse a second reading that makes the corner width negative, naming the readings to check', () => {
      // Derived from REFERENCE.md §5.1 (x = a + D·k): k = (9.000 − 2.2745) / (0.500 − 0.375) = 53.804,
      // a = x₁ − D₁·k = 2.2745 − 0.375 × 53.804 = −17.9020 in: no dovetail has a negative width.
      const f = fields({ ...twoRolls, measurement2: '9.000' });
      expect(f.measurement2).toBe(
        'with x₁ 2.2745 gives a corner width of -17.9020 in (it must be more than 0): check x₂ and x₁, and that each reading goes with its roll',
      );
    });

    it('should refuse readings that give an angle outside 10°–80°, and call a female dovetail\'s readings y', () => {
      // Derived: for α = 8°, k = 1 + cot 4° = 15.3007; with D₁ 0.25 and x₁ 5 the width 5 − 0.25k = 1.1748 is fine,
      // and x₂ = 5 + 0.25k = 8.8252: the angle alone gives the slip away.
      const f = fields({ kind: 'dovetail-angle', unit: 'in', side: 'male', rollDiameter1: '0.25', measurement1: '5', rollDiameter2: '0.5', measurement2: '8.8252' });
      expect(f.measurement2).toMatch(/^with x₁ 5\.0000 gives a dovetail angle of 8°00'0\d", outside 10°–80° .+check x₂ and x₁/);
      // Female 60°: y₂ = y₁ − ΔD·k; y₁ − y₂ below ΔD gives k ≤ 1 (derived).
      const g = fields({ kind: 'dovetail-angle', unit: 'in', side: 'female', rollDiameter1: '0.25', measurement1: '1', rollDiameter2: '0.5', measurement2: '0.9' });
      expect(g.measurement2).toMatch(/^does not fit a dovetail with y₁/);
    });

    it('should still find a 60° dovetail from the demo readings (REFERENCE.md §5.1, derived)', () => {
      const v = pins({ ...twoRolls, measurement2: '2.6160' });
      expect(v.width).toBe('1.2500');
      expect(v.angleDeg.startsWith('60.00')).toBe(true);
    });

    it('should refuse a dovetail angle outside 10°–80°, saying " is seconds when it was typed (common practice range)', () => {
      const dovetail = (angle: unknown) => ({ kind: 'dovetail', unit: 'in', side: 'male', angle, rollDiameter: '0.375', width: '1.250' });
      expect(fields(dovetail('0.25"')).angle).toBe(
        'must be from 10° to 80° for a dovetail, got 0°00\'00.25" (in an angle " marks seconds of arc, not inches): dovetails are usually 45°, 55° or 60° from the base (common practice)',
      );
      expect(fields(dovetail('9.99')).angle).toMatch(/^must be from 10° to 80° for a dovetail, got 9°59'24":/);
      expect(fields(dovetail('80.01')).angle).toMatch(/got 80°00'36"/);
      expect(fields(dovetail('89')).angle).toMatch(/must be from 10° to 80°/);
      // The ends of the range are answered, with the warning that they are unusual.
      expect(value(calculateOverPins(dovetail('10'))).warnings).toHaveLength(1);
      expect(value(calculateOverPins(dovetail('80'))).warnings).toHaveLength(1);
    });

    it('should name fields in words, never by their request names', () => {
      const messages = [
        fields({ ...twoRolls, rollDiameter2: '0.375', measurement2: '2.6' }).rollDiameter2,
        fields({ kind: 'taper-discs', unit: 'in', largeDisc: 0.4, smallDisc: 0.5, centreDistance: 3 }).largeDisc,
        fields({ kind: 'taper-discs', unit: 'in', largeDisc: 1, smallDisc: 0.5 }).centreDistance,
        fields({ kind: 'taper-balls', unit: 'in', largeBall: 0.5, smallBall: 1, largeBallDepth: 0, smallBallDepth: 2 }).largeBall,
        fields({ kind: 'dovetail', unit: 'in', side: 'male', angle: 60, rollDiameter: 0.375 }).width,
        fields({ kind: 'v-groove', unit: 'in', includedAngle: 90, pinDiameter: 0.5 }).grooveWidth,
      ];
      expect(messages).toEqual([
        'must differ from the first roll diameter D₁',
        'must be larger than the small disc d',
        'give exactly one of the centre distance, the taper per foot and the angle',
        'must be larger than the small ball',
        'give exactly one of the corner width and the reading over (or between) the rolls',
        'give exactly one of the groove width and the pin height over the surface',
      ]);
      for (const m of messages) expect(m).not.toMatch(/[a-z][A-Z]|measurement\d/);
    });
  });

  describe('tapers (REFERENCE.md §5.2)', () => {
    it('should read 3°34\'35" half angle, TPF 1.500 from .745 and .620 one inch apart (hobby-machinist, extension derived)', () => {
      const r = value(calculateOverPins({ kind: 'taper-two-heights', unit: 'in', measurement1: '.745', measurement2: '.620', heightDifference: 1 }));
      expect(r.dms.halfAngleDeg).toBe('3°34\'35"');
      expect(r.values.includedAngleDeg).toBe('7.1527');
      expect(r.values.taperPerFoot).toBe('1.50000');
    });
    it('should read equal readings as parallel sides: 0° and no taper per foot, with a note (atan 0 = 0, derived)', () => {
      const r = value(calculateOverPins({ kind: 'taper-two-heights', unit: 'in', measurement1: '1.2500', measurement2: '1.25', heightDifference: 2 }));
      expect([r.values.includedAngleDeg, r.dms.includedAngleDeg, r.values.halfAngleDeg, r.values.taperPerFoot]).toEqual(['0.0000', '0°00\'00"', '0.0000', '0.00000']);
      expect(r.warnings).toEqual(['The readings are equal: the sides are parallel (no taper).']);
    });
    it('should read a Jarno taper from rolls at 1.5000 and 1.4500 one inch apart (derived)', () => {
      expect(pins({ kind: 'taper-two-heights', unit: 'in', measurement1: 1.5, measurement2: 1.45, heightDifference: 1 }).taperPerFoot).toBe('0.60000');
    });
    it("should give 1.2015 in/ft for discs 1 and 1.5 in at C = 5 in (Machinery's Handbook 31 p. 701)", () => {
      expect(pins({ kind: 'taper-discs', unit: 'in', largeDisc: 1.5, smallDisc: 1, centreDistance: 5 }).taperPerFoot).toBe('1.20150');
    });
    it("should give C = 4.002 in for 3/4 in/ft with discs 1.25 and 1.5 in (Machinery's Handbook; Jones)", () => {
      expect(pins({ kind: 'taper-discs', unit: 'in', largeDisc: 1.5, smallDisc: 1.25, taperPerFoot: 0.75 }).centreDistance).toBe('4.0020');
    });
    it("should give C = 5.759 in for 20° with discs 1 and 3 in (Machinery's Handbook; Jones)", () => {
      expect(pins({ kind: 'taper-discs', unit: 'in', largeDisc: 3, smallDisc: 1, includedAngle: 20 }).centreDistance).toBe('5.7588');
    });
    it("should give 2.4367 in/ft with one side square, discs 2 and 3 in at C = 5 in (Machinery's Handbook)", () => {
      expect(pins({ kind: 'taper-discs', unit: 'in', largeDisc: 3, smallDisc: 2, centreDistance: 5, reference: 'side' }).taperPerFoot).toBe('2.43670');
    });
    it('should give 5°43\'55" from balls Ø40 and Ø32 (byjus problem, answer derived)', () => {
      const r = value(calculateOverPins({ kind: 'taper-balls', unit: 'mm', largeBall: 40, smallBall: 32, largeBallDepth: -8, smallBallDepth: 76 }));
      expect(r.values.centreDistance).toBe('80.000');
      expect(r.dms.includedAngleDeg).toBe('5°43\'55"');
    });
  });

  describe('V-groove', () => {
    it('should put a 0.5 in pin 0.1036 in proud of a 90° groove 1 in wide, and back (derived)', () => {
      expect(pins({ kind: 'v-groove', unit: 'in', includedAngle: 90, pinDiameter: 0.5, grooveWidth: 1 }).measurement).toBe('0.1036');
      expect(pins({ kind: 'v-groove', unit: 'in', includedAngle: 90, pinDiameter: 0.5, measurement: '0.10355339' }).grooveWidth).toBe('1.0000');
    });
    it('should warn when the pin is too big for the groove', () => {
      const r = value(calculateOverPins({ kind: 'v-groove', unit: 'in', includedAngle: 90, pinDiameter: 2, grooveWidth: 1 }));
      expect(r.warnings.join(' ')).toMatch(/too large/);
    });
  });

  describe('invalid input', () => {
    it('should name the field', () => {
      const r = calculateOverPins({ kind: 'dovetail', unit: 'in', side: 'male', angle: 60, rollDiameter: -1, width: 2 });
      expect(r.ok || r.fields.rollDiameter).toBe('must be greater than 0');
      const k = calculateOverPins({ kind: 'spline' });
      expect(k.ok || Object.keys(k.fields)).toEqual(['kind']);
    });
    it('should never throw (property)', () => {
      fc.assert(fc.property(fc.anything(), (x) => void expect(typeof calculateOverPins(x).ok).toBe('boolean')));
      fc.assert(
        fc.property(fc.constantFrom('dovetail', 'dovetail-angle', 'v-groove', 'taper-two-heights', 'taper-discs', 'taper-balls'), fc.dictionary(fc.constantFrom('unit', 'side', 'angle', 'rollDiameter', 'width', 'measurement', 'largeDisc', 'smallDisc', 'centreDistance', 'measurement1', 'measurement2', 'heightDifference'), fc.oneof(fc.double(), fc.constantFrom('in', 'mm', 'male', '0', '-1'))), (kind, rest) => {
          expect(JSON.stringify(calculateOverPins({ ...rest, kind }))).not.toMatch(/NaN|Infinity/);
        }),
      );
    });
  });
});
