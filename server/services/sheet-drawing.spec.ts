import { angleSketch, sineBarSketch, taperSketch } from './sheet-drawing';

// Plain trigonometry of the sketch (derived): h = L·sin α and H = L·sin θ, REFERENCE.md §1 and §2.1.
describe('sheet-drawing', () => {
  describe('taperSketch', () => {
    it('should put the cut exactly L·sin α below the touch-off corner', () => {
      const sketch = taperSketch(0.75, 1.25, 7.5, '0.1632');
      const dim = sketch.shapes.find((s) => s.kind === 'dimension');
      const drop = (dim?.points[0]?.y ?? 0) - (dim?.points[1]?.y ?? 0);
      expect(drop).toBeCloseTo(1.25 * Math.sin(7.5 * Math.PI / 180), 9);
      expect(dim?.label).toBe('h 0.1632');
    });
    it('should make the removed region a triangle whose top edge is the level cut', () => {
      const removed = taperSketch(20, 40, 5, '3.486').shapes.find((s) => s.style === 'removed');
      expect(removed?.points).toHaveLength(3);
      expect(removed?.points[0]?.y).toBeCloseTo(removed?.points[2]?.y ?? NaN, 9);
    });
    it('should give a finite bounding box', () => {
      const { box } = taperSketch(0.75, 1.25, 7.5, 'x');
      expect([box.minX, box.minY, box.maxX, box.maxY].every(Number.isFinite)).toBe(true);
      expect(box.maxY).toBeGreaterThan(box.minY);
    });
  });

  describe('sineBarSketch', () => {
    it('should make the stack L·sin θ high', () => {
      const stack = sineBarSketch(5, 14.5, '1.2519').shapes.find((s) => s.label === 'stack');
      expect(stack?.points[2]?.y).toBeCloseTo(5 * Math.sin(14.5 * Math.PI / 180), 9);
    });
  });

  describe('angleSketch', () => {
    it('should clamp extreme angles so the triangle stays drawable', () => {
      const { box } = angleSketch(89.9, '89.9°');
      expect(Number.isFinite(box.maxY)).toBe(true);
    });
  });
});
