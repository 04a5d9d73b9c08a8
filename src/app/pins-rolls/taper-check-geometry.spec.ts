import { ballsGeometry, discsGeometry, dovetailAngleGeometry, twoHeightsGeometry } from './taper-check-geometry';

const dist = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);

describe('dovetailAngleGeometry', () => {
  // Male 60°, a = 1.250, rolls 0.375 and 0.500: x₁ = 2.2745, x₂ = 1.25 + 0.5 × 2.7320508 = 2.6160
  // (Machinery's Handbook "Measuring dovetail slides", REFERENCE.md §5.1; derived).
  const shape = dovetailAngleGeometry({ side: 'male', angleDeg: 60, rollDiameter1: 0.375, rollDiameter2: 0.5, width: 1.25 });

  it('should draw both pairs of rolls, the second dashed, in the same corners', () => {
    expect(shape.rolls).toHaveLength(4);
    expect(shape.rolls.filter((r) => r.second)).toHaveLength(2);
    // 0.625 + 0.25 × cot 30° = 1.058013.
    expect(shape.rolls[3].centre).toEqual({ x: 1.058013, y: -0.25 });
  });

  it('should give the two readings, the second stacked one row further out', () => {
    const x1 = shape.dimensions.find((d) => d.key === 'measurement');
    const x2 = shape.dimensions.find((d) => d.key === 'measurement2');
    expect((x1?.to.x ?? 0) - (x1?.from.x ?? 0)).toBeCloseTo(2.2745, 4);
    expect((x2?.to.x ?? 0) - (x2?.from.x ?? 0)).toBeCloseTo(2.616025, 5);
    expect(x2?.tier).toBe(1);
    // Both lines at the same level before stacking: −(h + gap) with h = 1.6 × 0.5 = 0.8, gap 0.4.
    expect((x1?.from.y ?? 0) - (x1?.offset ?? 0)).toBeCloseTo(-1.2, 6);
    expect((x2?.from.y ?? 0) - (x2?.offset ?? 0)).toBeCloseTo(-1.2, 6);
  });
});

describe('twoHeightsGeometry', () => {
  // M₁ 1.250, M₂ 1.150, ΔH 2: tan(α/2) = 0.1 / 4 = 0.025 (common practice/derived).
  const shape = twoHeightsGeometry({ measurement1: 1.25, measurement2: 1.15, heightDifference: 2 });
  const r = 1.15 * 0.08;

  it('should put each pair of rolls its reading apart over their outer sides', () => {
    const [l1, r1, l2, r2] = shape.rolls;
    expect(r1.centre.x - l1.centre.x + 2 * r).toBeCloseTo(1.25, 6);
    expect(r2.centre.x - l2.centre.x + 2 * r).toBeCloseTo(1.15, 6);
    expect(l2.centre.y - l1.centre.y).toBeCloseTo(-2, 6);
    expect([l1.second, l2.second]).toEqual([undefined, true]);
  });

  it('should make every roll touch the tapered side', () => {
    for (const roll of shape.rolls) {
      const [, onSide] = roll.contacts;
      expect(dist(onSide, roll.centre)).toBeCloseTo(r, 5);
    }
    // The right side narrows upward at atan 0.025 from the vertical.
    const [, bottomRight, topRight] = shape.part;
    expect((bottomRight.x - topRight.x) / (bottomRight.y - topRight.y)).toBeCloseTo(0.025, 6);
  });

  it('should mark the half angle at the top corner between the side and the vertical', () => {
    // atan 0.025 = 1.432096°; the side runs up at 90° + 1.43° on the paper.
    expect(shape.angle.fromDeg).toBe(90);
    expect(shape.angle.toDeg).toBeCloseTo(91.432096, 5);
    expect(shape.dimensions.map((d) => d.key)).toEqual(['measurement', 'measurement2', 'height']);
  });
});

describe('discsGeometry', () => {
  it('should set straightedges tangent to both discs about the axis', () => {
    // D 1, d 0.5, C 3: sin(α/2) = 0.25 / 3 (Machinery's Handbook 31 p. 701).
    const shape = discsGeometry({ largeDisc: 1, smallDisc: 0.5, centreDistance: 3, reference: 'axis' });
    expect(shape.rolls.map((c) => c.centre)).toEqual([{ x: 0, y: 0 }, { x: 0, y: -3 }]);
    const [a, b] = shape.sides?.[0] ?? [{ x: 0, y: 0 }, { x: 0, y: 1 }];
    const distToLine = (p: { x: number; y: number }) => Math.abs((b.x - a.x) * (a.y - p.y) - (a.x - p.x) * (b.y - a.y)) / dist(a, b);
    expect(distToLine(shape.rolls[0].centre)).toBeCloseTo(0.5, 5);
    expect(distToLine(shape.rolls[1].centre)).toBeCloseTo(0.25, 5);
    expect(shape.angle.toDeg - shape.angle.fromDeg).toBeCloseTo((Math.asin(0.25 / 3) * 180) / Math.PI, 4);
  });

  it('should keep one straightedge square and turn the other by twice the half angle', () => {
    const shape = discsGeometry({ largeDisc: 1, smallDisc: 0.5, centreDistance: 3, reference: 'side' });
    const [a, b] = shape.sides?.[0] ?? [{ x: 0, y: 0 }, { x: 0, y: 1 }];
    const square = shape.sides?.[1] ?? [];
    expect(square.map((p) => p.x)).toEqual([0, 0]);
    const distToLine = (p: { x: number; y: number }) => Math.abs((b.x - a.x) * (a.y - p.y) - (a.x - p.x) * (b.y - a.y)) / dist(a, b);
    expect(distToLine(shape.rolls[0].centre)).toBeCloseTo(0.5, 5);
    expect(distToLine(shape.rolls[1].centre)).toBeCloseTo(0.25, 5);
    expect(shape.rolls[0].centre.x).toBe(0.5);
    expect(shape.angle.toDeg - 90).toBeCloseTo((2 * Math.asin(0.25 / 3) * 180) / Math.PI, 4);
  });
});

describe('ballsGeometry', () => {
  // Large 1.000 at 0.250, small 0.500 at 2.000: s = 1.5, sin(α/2) = 0.25 / 1.5 (derived).
  const half = (Math.asin(0.25 / 1.5) * 180) / Math.PI;
  const shape = ballsGeometry({ largeBall: 1, smallBall: 0.5, largeBallDepth: 0.25, smallBallDepth: 2, halfAngleDeg: half });

  it('should rest both balls on the bore, centres 1.5 apart', () => {
    const [large, small] = shape.rolls;
    expect(large.centre).toEqual({ x: 0, y: 0.75 });
    expect(small.centre).toEqual({ x: 0, y: 2.25 });
    // The bore's right wall runs from the face edge (part[4]) down to the floor (part[3]).
    const a = shape.part[4];
    const b = shape.part[3];
    const distToLine = (p: { x: number; y: number }) => Math.abs((b.x - a.x) * (a.y - p.y) - (a.x - p.x) * (b.y - a.y)) / dist(a, b);
    expect(distToLine(large.centre)).toBeCloseTo(0.5, 5);
    expect(distToLine(small.centre)).toBeCloseTo(0.25, 5);
  });

  it('should dimension each ball top from the face, one each side', () => {
    const depths = shape.dimensions.filter((d) => d.key === 'largeDepth' || d.key === 'smallDepth');
    expect(depths.map((d) => [d.to.y, Math.sign(d.offset)])).toEqual([[0.25, -1], [2, 1]]);
    expect(shape.angle.fromDeg).toBeCloseTo(90 - half, 5);
  });
});
