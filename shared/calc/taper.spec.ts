import fc from 'fast-check';
import { Dec, cosDeg, sinDeg, tanDeg } from './decimal-math';
import type { CalcResult } from './step';
import { calculateTaper, type TaperResult } from './taper';

function value(r: CalcResult<TaperResult>): TaperResult {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}

describe('calculateTaper', () => {
  describe('published geometry checks (REFERENCE.md §1, right-triangle geometry, derived)', () => {
    it('should plan L = 3.000 in, T = 0.750 in, α = 5°', () => {
      // REFERENCE.md §1 [DER]: d = 0.2625; t = 0.4875; h = 0.2615; s = 3.0115.
      const r = value(calculateTaper({ unit: 'in', thickness: '0.750', angle: 5, taperLength: '3.000' }));
      expect(r.removedAtEnd).toBe('0.2625');
      expect(r.endThickness).toBe('0.4875');
      expect(r.depthToStop).toBe('0.2615');
      expect(r.faceLength).toBe('3.0115');
      expect(r.angleDms).toBe('5°00\'00"');
    });

    it('should plan L = 75 mm, α = 7°', () => {
      // REFERENCE.md §1 [DER]: d = 9.209 mm; h = 9.140 mm; s = 75.563 mm.
      const r = value(calculateTaper({ unit: 'mm', thickness: 20, angle: '7°', taperLength: 75 }));
      expect([r.removedAtEnd, r.depthToStop, r.faceLength]).toEqual(['9.209', '9.140', '75.563']);
    });

    it('should find the angle for T = 1.000 → t = 0.750 over 4.000 in', () => {
      // REFERENCE.md §1 [DER]: θ = 3.5763° (3°34'35"); s = 4.0078 in.
      const r = value(calculateTaper({ unit: 'in', thickness: 1, endThickness: '0.750', taperLength: 4 }));
      expect(r.angleDeg).toBe('3.5763');
      expect(r.angleDms).toBe('3°34\'35"');
      expect(r.faceLength).toBe('4.0078');
    });

    it('should solve from every pair of the four quantities to the same part (derived)', () => {
      const base = value(calculateTaper({ unit: 'in', thickness: 1, angle: '7°30\'', taperLength: 2 }));
      const e = base.exact;
      const pairs = [
        { angle: '7°30\'', endThickness: e.endThickness },
        { angle: '7°30\'', faceLength: e.faceLength },
        { taperLength: 2, endThickness: e.endThickness },
        { taperLength: 2, faceLength: e.faceLength },
        { endThickness: e.endThickness, faceLength: e.faceLength },
        { angle: '7.5', removedAtEnd: e.removedAtEnd },
      ];
      for (const pair of pairs) {
        const r = value(calculateTaper({ unit: 'in', thickness: 1, ...pair }));
        expect([r.angleDeg, r.taperLength, r.endThickness, r.faceLength, r.depthToStop]).toEqual([base.angleDeg, base.taperLength, base.endThickness, base.faceLength, base.depthToStop]);
      }
    });
  });

  describe('passes and warnings', () => {
    it('should list passes with the DRO reading after each, the last one partial', () => {
      const r = value(calculateTaper({ unit: 'in', thickness: 0.75, angle: 5, taperLength: 3, depthPerPass: 0.1 }));
      expect(r.passes).toEqual([
        { pass: 1, cut: '0.1000', reading: '0.1000' },
        { pass: 2, cut: '0.1000', reading: '0.2000' },
        { pass: 3, cut: '0.0615', reading: '0.2615' },
      ]);
    });

    it('should warn when the depth to stop is beyond the flute length', () => {
      const r = value(calculateTaper({ unit: 'in', thickness: 0.75, angle: 5, taperLength: 3, fluteLength: 0.25 }));
      expect(r.warnings.join(' ')).toMatch(/flute length/);
    });

    it('should warn of a knife edge when the taper runs out exactly at the bottom edge', () => {
      const r = value(calculateTaper({ unit: 'in', thickness: 0.5, removedAtEnd: 0.5, taperLength: 4 }));
      expect(r.endThickness).toBe('0.0000');
      expect(r.warnings.join(' ')).toMatch(/knife edge/);
    });

    it('should warn of a knife edge whenever the end thickness reads zero at the unit\'s resolution (derived)', () => {
      // t = T − L·tan α: 1 − 1·tan 45° = 0 exactly; 10 − 5.7735·tan 60° = 0.0000047 mm → 0.000 mm;
      // 1 − 0.99996·tan 45° = 0.00004 in → 0.0000 in (derived).
      const cases = [
        { unit: 'in', thickness: 1, angle: 45, taperLength: 1 },
        { unit: 'mm', thickness: 10, angle: 60, taperLength: 5.7735 },
        { unit: 'in', thickness: 1, angle: 45, taperLength: 0.99996 },
      ];
      for (const input of cases) {
        const r = value(calculateTaper(input));
        expect({ input, end: Number(r.endThickness), knifeEdge: r.warnings.some((w) => /it leaves a knife edge/.test(w)) }).toEqual({ input, end: 0, knifeEdge: true });
      }
      // Exactly zero (as typed, or 45° over a length equal to the thickness) keeps the exact wording.
      expect(value(calculateTaper(cases[0])).warnings).toContain('The taper runs out exactly at the bottom edge of the end: it leaves a knife edge.');
      expect(value(calculateTaper(cases[2])).warnings).toContain('The taper runs out at the bottom edge of the end, to within 0.0001 in: it leaves a knife edge.');
      // 0.0001 in left (1 − 0.9999·tan 45°, derived) is still a part, not a knife edge.
      expect(value(calculateTaper({ unit: 'in', thickness: 1, angle: 45, taperLength: 0.9999 })).warnings.join(' ')).not.toMatch(/knife edge/);
    });

    it('should warn when the taper is too small to cut at the unit\'s resolution, with no pass of 0.0000', () => {
      // 1 in · tan 0.001° = 0.0000175 in and 1 in · sin 0.001° = 0.0000175 in: both read 0.0000 (derived).
      const r = value(calculateTaper({ unit: 'in', thickness: 1, angle: 0.001, taperLength: 1, depthPerPass: 0.05 }));
      expect([r.removedAtEnd, r.depthToStop]).toEqual(['0.0000', '0.0000']);
      expect(r.warnings).toContain('The taper is too small to cut at 0.0001 in: it takes 0.0000 in off the end and the depth to stop reads 0.0000 in, so there is nothing to remove. Check the angle and the lengths.');
      expect(r.passes).toEqual([]);
      // 1 in · sin 0.01° = 0.000175 in reads 0.0002 in: small, but something to cut (derived).
      expect(value(calculateTaper({ unit: 'in', thickness: 1, angle: 0.01, taperLength: 1 })).warnings.join(' ')).not.toMatch(/too small/);
    });

    it('should count the passes on the depth to stop as read, so no last pass cuts 0.0000', () => {
      // h = 2.5 · sin 7.5° = 0.326317 in, read 0.3263 (derived): two passes of 0.16315 reach it; a third
      // would cut the 0.000017 in left over, shown as 0.0000.
      const r = value(calculateTaper({ unit: 'in', thickness: 0.75, angle: "7°30'", taperLength: 2.5, depthPerPass: 0.16315 }));
      expect(r.passes.map((p) => p.reading)).toEqual(['0.1632', '0.3263']);
      expect(r.passes.map((p) => p.cut)).not.toContain('0.0000');
    });

    it('should add the cutter diameter to the table travel', () => {
      const r = value(calculateTaper({ unit: 'in', thickness: 0.75, angle: 5, taperLength: 3, cutterDiameter: 0.5 }));
      expect(r.tableTravel).toBe('3.5115');
    });
  });

  describe('chamfer', () => {
    it('should work from two legs without a thickness (45° by 0.1 in, derived)', () => {
      const r = value(calculateTaper({ unit: 'in', shape: 'chamfer', taperLength: 0.1, removedAtEnd: 0.1 }));
      expect([r.angleDeg, r.faceLength, r.depthToStop, r.endThickness]).toEqual(['45.0000', '0.1414', '0.0707', null]);
    });
  });

  describe('impossible and invalid input', () => {
    it('should refuse a taper that needs more than the stock, saying where it runs out', () => {
      const r = calculateTaper({ unit: 'in', thickness: 0.5, angle: 30, taperLength: 3 });
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.kind).toBe('impossible');
      // Runs out T / tan α = 0.5 / tan 30° = 0.8660 in from the taper start (derived).
      expect(r.fields.taperLength).toMatch(/runs out through the bottom face 0\.8660 in from where the taper starts/);
    });

    it('should show the two thicknesses to the place where they differ when they round alike', () => {
      // d = 2.5 · tan 7°30′ = 0.329131 in against 0.32911 in of stock (derived): both read 0.3291 at 4 places.
      const r = calculateTaper({ unit: 'in', thickness: '0.32911', angle: "7°30'", taperLength: '2.5' });
      expect(r.ok || r.fields.taperLength).toMatch(/^needs 0\.32913 in off the end but the stock is 0\.32911 in thick/);
      // 1.00004 · tan 45° = 1.00004 in against 1 in of stock (derived): the stock at the resolution,
      // the cut to the place where they differ — 1.0000, not 1.00000.
      const past = calculateTaper({ unit: 'in', thickness: 1, angle: 45, taperLength: '1.00004' });
      expect(past.ok || past.fields.taperLength).toMatch(/^needs 1\.00004 in off the end but the stock is 1\.0000 in thick/);
      // An end thickness of 1.00007 on 1.00006 stock: both read 1.0001 at 4 places.
      const end = calculateTaper({ unit: 'in', thickness: '1.00006', endThickness: '1.00007', taperLength: 2 });
      expect(end.ok || end.fields.endThickness).toBe('must be less than the thickness 1.00006 in');
      const face = calculateTaper({ unit: 'in', thickness: 2, taperLength: '1.00007', faceLength: '1.00006' });
      expect(face.ok || face.fields.faceLength).toBe('must be longer than the taper length 1.00007 in');
      expect(calculateTaper({ unit: 'in', thickness: 2, taperLength: '1.5', faceLength: '1.2' })).toMatchObject({ fields: { faceLength: 'must be longer than the taper length 1.5000 in' } });
      const plain = calculateTaper({ unit: 'in', thickness: 0.5, angle: 30, taperLength: 3 });
      // 3 · tan 30° = 1.7321 in (derived).
      expect(plain.ok || plain.fields.taperLength).toMatch(/^needs 1\.7321 in off the end but the stock is 0\.5000 in thick/);
    });

    it('should name the field for each kind of bad input', () => {
      const cases: [unknown, string][] = [
        [{ unit: 'in', thickness: 0, angle: 5, taperLength: 3 }, 'thickness'],
        [{ unit: 'in', thickness: -1, angle: 5, taperLength: 3 }, 'thickness'],
        [{ unit: 'in', thickness: 'abc', angle: 5, taperLength: 3 }, 'thickness'],
        [{ unit: 'in', thickness: 1, angle: 90, taperLength: 3 }, 'angle'],
        [{ unit: 'in', thickness: 1, angle: '7°75\'', taperLength: 3 }, 'angle'],
        [{ unit: 'ft', thickness: 1, angle: 5, taperLength: 3 }, 'unit'],
        [{ unit: 'in', angle: 5, taperLength: 3 }, 'thickness'],
        [{ unit: 'in', thickness: 1, endThickness: 1.2, taperLength: 3 }, 'endThickness'],
        [{ unit: 'in', thickness: 1, taperLength: 3, faceLength: 2 }, 'faceLength'],
        [{ unit: 'in', thickness: 1, angle: 5, taperLength: 3, depthPerPass: 0.00001 }, 'depthPerPass'],
      ];
      for (const [input, field] of cases) {
        const r = calculateTaper(input);
        expect(r.ok).toBe(false);
        if (!r.ok) expect(Object.keys(r.fields)).toContain(field);
      }
    });

    it('should ask for exactly two of the defining quantities', () => {
      const r = calculateTaper({ unit: 'in', thickness: 1, angle: 5 });
      expect(!r.ok && r.error).toMatch(/exactly two of angle, taperLength, endThickness, faceLength/);
    });

    it('should return an error value, never throw, for any input (property)', () => {
      fc.assert(fc.property(fc.anything(), (x) => void expect(typeof calculateTaper(x).ok).toBe('boolean')));
      fc.assert(
        fc.property(
          fc.record({ unit: fc.constantFrom('in', 'mm', 'x'), thickness: fc.oneof(fc.double(), fc.string()), angle: fc.oneof(fc.double(), fc.string()), taperLength: fc.oneof(fc.double(), fc.constant(null)) }, { requiredKeys: [] }),
          (x) => {
            const r = calculateTaper(x);
            expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity/);
          },
        ),
      );
    });
  });

  describe('identities (property, derived)', () => {
    it('should satisfy t = T − L·tan α, F = L / cos α, h = L·sin α for random valid input', () => {
      fc.assert(
        fc.property(
          fc.integer({ min: 1, max: 8900 }),
          fc.integer({ min: 1, max: 100_000 }),
          fc.integer({ min: 1, max: 100_000 }),
          (alphaHundredths, lengthThousandths, extraThousandths) => {
            const alpha = new Dec(alphaHundredths).div(100);
            const L = new Dec(lengthThousandths).div(1000);
            const d = L.mul(tanDeg(alpha));
            const T = d.plus(new Dec(extraThousandths).div(1000));
            const r = calculateTaper({ unit: 'in', thickness: T.toString(), angle: alpha.toString(), taperLength: L.toString() });
            if (!r.ok) throw new Error(r.error);
            const ex = r.value.exact;
            const tol = '1e-24';
            expect(new Dec(ex.endThickness as string).minus(T.minus(L.mul(tanDeg(alpha)))).abs().lt(tol)).toBe(true);
            expect(new Dec(ex.faceLength).minus(L.div(cosDeg(alpha))).abs().lt(tol)).toBe(true);
            expect(new Dec(ex.depthToStop).minus(L.mul(sinDeg(alpha))).abs().lt(tol)).toBe(true);
          },
        ),
        { numRuns: 150 },
      );
    });
  });
});
