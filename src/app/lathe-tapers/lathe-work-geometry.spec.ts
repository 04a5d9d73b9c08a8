import { latheWorkGeometry } from './lathe-work-geometry';

// Coordinates are worked by hand from the construction in the file's doc comment (derived):
// a 2 → 1 taper over 4 has a half angle atan(0.5 / 4) = atan(0.125) = 7.125016°,
// sin = 0.124034735, cos = 0.992277877.
describe('latheWorkGeometry', () => {
  describe('compound rest method', () => {
    const shape = latheWorkGeometry({ largeDiameter: 2, smallDiameter: 1, taperLength: 4, workLength: 6, method: 'compound' });

    it('should draw the bar at the large diameter with the taper at the tail-stock end', () => {
      expect(shape.work).toEqual([
        { x: 0, y: -1 }, { x: 2, y: -1 }, { x: 6, y: -0.5 }, { x: 6, y: 0.5 }, { x: 2, y: 1 }, { x: 0, y: 1 },
      ]);
      expect(shape.cutEdge).toEqual([{ x: 2, y: 1 }, { x: 6, y: 0.5 }]);
      expect(shape.workAxis).toEqual(shape.latheAxis.map((p) => ({ x: Math.max(0, Math.min(6, p.x)), y: 0 })));
    });

    it('should put the 60° centres’ points at both ends of the work', () => {
      // Cone 0.6 long (k = min(0.45·D, 0.1·L)), half height 0.6·tan 30° = 0.34641.
      expect(shape.headCentre).toEqual([
        { x: 0, y: 0 }, { x: -0.6, y: -0.34641 }, { x: -1.56, y: -0.34641 }, { x: -1.56, y: 0.34641 }, { x: -0.6, y: 0.34641 },
      ]);
      expect(shape.tailCentre[0]).toEqual({ x: 6, y: 0 });
      expect(shape.tailCentre[2]).toEqual({ x: 7.56, y: -0.34641 });
    });

    it('should span the half angle from the lathe axis to the cut edge at the large end', () => {
      expect(shape.arcDeg).toBe(7.125016);
      expect(shape.angle).toEqual({ vertex: { x: 2, y: 1 }, radius: 3, fromDeg: 0, toDeg: 7.125016 });
    });

    it('should shade the stock the taper takes off on both sides', () => {
      expect(shape.removed).toEqual([
        [{ x: 2, y: -1 }, { x: 6, y: -1 }, { x: 6, y: -0.5 }],
        [{ x: 2, y: 1 }, { x: 6, y: 1 }, { x: 6, y: 0.5 }],
      ]);
    });

    it('should lay the compound slide and the feed along the cut edge', () => {
      expect(shape.compound).toHaveLength(4);
      const [a, b] = shape.feed;
      // Parallel to the cut edge: slope −0.5 / 4.
      expect((b.y - a.y) / (b.x - a.x)).toBeCloseTo(-0.125, 5);
      expect(b.x).toBeGreaterThan(a.x);
    });

    it('should dimension both diameters, the taper length and the work length, but no offset', () => {
      expect(shape.dimensions.map((d) => d.key)).toEqual(['large', 'small', 'taper', 'work']);
      const large = shape.dimensions[0];
      expect([large.from, large.to]).toEqual([{ x: 1, y: 1 }, { x: 1, y: -1 }]);
      // The taper length above the work, projected onto the large diameter's line, gap max(0.35·D, 0.05·L) = 0.7.
      const taper = shape.dimensions[2];
      expect([taper.from, taper.to, taper.offset]).toEqual([{ x: 2, y: -1 }, { x: 6, y: -1 }, 0.7]);
      // The work length below the tool (min(0.5·D, 0.35·l) = 1), slide and feed: 1 + 1·1.9 + 2·0.7 + 0.7 = 5.
      const work = shape.dimensions[3];
      expect([work.from, work.to]).toEqual([{ x: 6, y: 0 }, { x: 0, y: 0 }]);
      expect(work.offset).toBeCloseTo(5, 9);
    });

    it('should hold the work and the dimension lines inside the bounds', () => {
      const [x, y, w, h] = shape.bounds;
      expect(x).toBeLessThanOrEqual(-1.56);
      expect(x + w).toBeGreaterThanOrEqual(7.56);
      expect(y).toBeLessThanOrEqual(-1);
      // The work-length line is 5 below the axis.
      expect(y + h).toBeGreaterThanOrEqual(5);
    });
  });

  describe('tail-stock offset method', () => {
    // Shaft 8 long, taper 3 long from 1.250 to 1.000: offset 8 × 0.25 / (2 × 3) = 1/3
    // (REFERENCE.md §4.1, sciemce example [PUB-2], formula from the US Navy manual "Using the Compound Rest" [PUB]).
    const shape = latheWorkGeometry({ largeDiameter: 1.25, smallDiameter: 1, taperLength: 3, workLength: 8, method: 'offset' });
    const tail = shape.workAxis[1];

    it('should set the tail-stock centre over by the offset, keeping the length between centres', () => {
      expect(tail.y).toBeCloseTo(1 / 3, 6);
      expect(tail.x).toBeCloseTo(Math.sqrt(64 - 1 / 9), 6);
      expect(Math.hypot(tail.x, tail.y)).toBeCloseTo(8, 5);
    });

    it('should dimension the offset from the lathe axis to the set-over centre', () => {
      const offset = shape.dimensions.find((d) => d.key === 'offset');
      expect(offset?.from.y).toBe(0);
      expect(offset?.to.y).toBeCloseTo(1 / 3, 6);
    });

    it('should turn the work so the cut edge runs nearly parallel to the lathe axis', () => {
      const [a, b] = shape.cutEdge;
      // Exactly parallel would need sin ψ = tan(α/2); the offset rule uses tan(α/2) ≈ sin: the slope stays below 1e-4.
      expect(Math.abs((b.y - a.y) / (b.x - a.x))).toBeLessThan(1e-4);
      expect(shape.compound).toEqual([]);
    });

    it('should span the tilt of the work at the headstock centre', () => {
      expect(shape.arcDeg).toBeCloseTo((Math.asin(1 / 24) * 180) / Math.PI, 5);
      expect(shape.angle.vertex).toEqual({ x: 0, y: 0 });
      expect(shape.angle.toDeg).toBe(0);
      expect(shape.angle.fromDeg).toBeCloseTo(-shape.arcDeg, 6);
    });

    it('should take a given offset rather than its own', () => {
      const given = latheWorkGeometry({ largeDiameter: 1.25, smallDiameter: 1, taperLength: 3, workLength: 8, method: 'offset', offset: 0.5 });
      expect(given.workAxis[1].y).toBe(0.5);
    });
  });

  describe('half-typed input', () => {
    it('should draw a cylinder when the small diameter exceeds the large one', () => {
      const shape = latheWorkGeometry({ largeDiameter: 1, smallDiameter: 3, taperLength: 2, method: 'compound' });
      expect(shape.work.map((p) => p.y)).toEqual([-0.5, -0.5, -0.5, 0.5, 0.5, 0.5]);
      expect(shape.removed).toEqual([]);
      expect(shape.arcDeg).toBe(0);
    });

    it('should make the work at least as long as the taper', () => {
      const shape = latheWorkGeometry({ largeDiameter: 1, smallDiameter: 0.5, taperLength: 4, workLength: 2, method: 'compound' });
      expect(shape.cutEdge[0].x).toBe(0);
    });
  });
});

