import { angleStackGeometry } from './angle-stack-geometry';

// Expected coordinates are worked by hand from the construction in the file's doc comment:
// sin 30° = 0.5, cos 30° = 0.8660254, sin 45° = cos 45° = 0.70710678 (plain trigonometry, derived).
describe('angleStackGeometry', () => {
  const OPTS = { length: 100, thinEnd: 10 };

  describe('one block added', () => {
    const shape = angleStackGeometry([{ angleDeg: 30, reversed: false, label: '30°' }], OPTS);

    it('should lay the bottom face on the plate and turn the top face up by the angle', () => {
      expect(shape.blocks[0].outline).toEqual([
        { x: 0, y: 0 },
        { x: 100, y: 0 },
        { x: 86.60254, y: -60 },
        { x: 0, y: -10 },
      ]);
      expect(shape.blocks[0].topDeg).toBe(30);
      expect(shape.totalDeg).toBe(30);
    });

    it('should put the angle arc at the top face’s high end, above the face', () => {
      expect(shape.vertex).toEqual({ x: 86.60254, y: -60 });
      expect(shape.arcRadius).toBe(55);
      // The level line runs left from the vertex, 55 × 1.35 = 74.25 long; the face runs back down-left.
      expect(shape.levelEnd).toEqual({ x: 12.35254, y: -60 });
      expect([shape.arcFromDeg, shape.arcToDeg]).toEqual([180, 210]);
    });

    it('should point the direction mark toward the thick end', () => {
      const [back, tip] = shape.blocks[0].mark;
      expect(tip.x).toBeGreaterThan(back.x);
      expect(tip).toEqual({ x: 16, y: -5 });
    });
  });

  describe('a reversed block on an added one', () => {
    const shape = angleStackGeometry(
      [
        { angleDeg: 45, reversed: false, label: '45°' },
        { angleDeg: 15, reversed: true, label: '15°' },
      ],
      OPTS,
    );

    it('should subtract the reversed block: 45° − 15° = 30°', () => {
      expect(shape.totalDeg).toBe(30);
      expect(shape.blocks.map((b) => b.topDeg)).toEqual([45, 30]);
    });

    it('should wring the second block on the first one’s top face, thick end at the left', () => {
      const [first, second] = shape.blocks;
      expect(first.outline[2]).toEqual({ x: 70.710678, y: -80.710678 });
      // Bottom face from (0, −10) along 45°; thin end 10 high at the right: b1 + 10·(−sin 45°, −cos 45°).
      expect(second.outline[0]).toEqual({ x: 0, y: -10 });
      expect(second.outline[1]).toEqual({ x: 70.710678, y: -80.710678 });
      expect(second.outline[2]).toEqual({ x: 63.63961, y: -87.781746 });
      // Top face runs 100 back along 30°: x − 86.60254, y + 50.
      expect(second.outline[3]).toEqual({ x: -22.96293, y: -37.781746 });
      // The top face rises to the right: the vertex is its right end.
      expect(shape.vertex).toEqual(second.outline[2]);
    });

    it('should point a reversed block’s mark the other way', () => {
      const [back, tip] = shape.blocks[1].mark;
      expect(tip.x).toBeLessThan(back.x);
      expect(shape.blocks[1].reversed).toBe(true);
    });

    it('should hold every corner inside the bounds', () => {
      const [x, y, w, h] = shape.bounds;
      for (const p of shape.blocks.flatMap((b) => b.outline)) {
        expect(p.x).toBeGreaterThanOrEqual(x);
        expect(p.x).toBeLessThanOrEqual(x + w);
        expect(p.y).toBeGreaterThanOrEqual(y);
        expect(p.y).toBeLessThanOrEqual(y + h);
      }
    });
  });

  it('should mark a combination that leans the other way from the face’s left end', () => {
    const shape = angleStackGeometry([{ angleDeg: 10, reversed: true, label: '10°' }], OPTS);
    expect(shape.totalDeg).toBe(-10);
    expect(shape.vertex).toEqual(shape.blocks[0].outline[3]);
    expect([shape.arcFromDeg, shape.arcToDeg]).toEqual([0, -10]);
    expect(shape.levelEnd.x).toBeGreaterThan(shape.vertex.x);
  });

  describe('edge cases', () => {
    it('should give a flat 0° stack and no arc for no blocks', () => {
      const shape = angleStackGeometry([], OPTS);
      expect(shape.blocks).toEqual([]);
      expect(shape.totalDeg).toBe(0);
      expect([shape.arcFromDeg, shape.arcToDeg]).toEqual([180, 180]);
      expect(shape.plate).toEqual([{ x: -15, y: 0 }, { x: 115, y: 0 }]);
    });

    it('should clamp a block beyond 90° to 90° so the wedge stays a wedge', () => {
      const shape = angleStackGeometry([{ angleDeg: 120, reversed: false, label: '120°' }], OPTS);
      expect(shape.totalDeg).toBe(90);
      expect(shape.blocks[0].outline[2]).toEqual({ x: 0, y: -110 });
    });

    it('should end where it began when a block is added and reversed again', () => {
      const shape = angleStackGeometry(
        [
          { angleDeg: 9, reversed: false, label: '9°' },
          { angleDeg: 9, reversed: true, label: '9°' },
        ],
        OPTS,
      );
      expect(shape.totalDeg).toBe(0);
      // The second block's top face is level again.
      const [, , t1, t0] = shape.blocks[1].outline;
      expect(t1.y).toBe(t0.y);
    });
  });
});

