import { boundsOf, fitView, round2 } from './view-fit';

// Expected values worked by hand from the fitting rule in view-fit.ts (derived).
describe('view fitting', () => {
  describe('fitView', () => {
    it('should fit a wide model to the width and size the height to it', () => {
      const fit = fitView({ minX: 0, minY: 0, maxX: 4, maxY: 1 }, { width: 500, maxHeight: 300, margin: 50 });
      expect(fit.scale).toBe(100);
      expect(fit.viewBox).toBe('0 0 500 200');
      expect(fit.toView({ x: 0, y: 0 })).toEqual({ x: 50, y: 150 });
      expect(fit.toView({ x: 4, y: 1 })).toEqual({ x: 450, y: 50 });
    });

    it('should fit a tall model to the height and centre it across', () => {
      const fit = fitView({ minX: 0, minY: 0, maxX: 1, maxY: 4 }, { width: 500, maxHeight: 300, margin: 50 });
      expect(fit.scale).toBe(50);
      expect(fit.height).toBe(300);
      expect(fit.toView({ x: 0, y: 0 })).toEqual({ x: 225, y: 250 });
      expect(fit.toView({ x: 1, y: 4 })).toEqual({ x: 275, y: 50 });
    });

    it('should keep a flat model at least minHeight tall, centred', () => {
      const fit = fitView({ minX: 0, minY: 0, maxX: 10, maxY: 0 }, { width: 300, maxHeight: 300, minHeight: 120, margin: 50 });
      expect(fit.scale).toBe(20);
      expect(fit.height).toBe(120);
      expect(fit.toView({ x: 0, y: 0 })).toEqual({ x: 50, y: 60 });
    });

    it('should keep a wider right margin when asked', () => {
      // Inner width 500 − 50 − 150 = 300 → scale 75; the model starts at the left margin.
      const fit = fitView({ minX: 0, minY: 0, maxX: 4, maxY: 1 }, { width: 500, maxHeight: 300, margin: 50, marginRight: 150 });
      expect(fit.scale).toBe(75);
      expect(fit.toView({ x: 0, y: 0 })).toEqual({ x: 50, y: 125 });
      expect(fit.toView({ x: 4, y: 1 })).toEqual({ x: 350, y: 50 });
    });

    it('should use scale 1 for a single point', () => {
      const fit = fitView({ minX: 2, minY: 2, maxX: 2, maxY: 2 }, { width: 500, maxHeight: 300, margin: 50 });
      expect(fit.scale).toBe(1);
      expect(fit.toView({ x: 2, y: 2 })).toEqual({ x: 250, y: 50 });
    });

    it('should refuse a box too small for its margins', () => {
      expect(() => fitView({ minX: 0, minY: 0, maxX: 1, maxY: 1 }, { width: 80, maxHeight: 300, margin: 50 })).toThrow('twice the margin');
    });
  });

  describe('boundsOf', () => {
    it('should enclose every point', () => {
      expect(boundsOf([{ x: 1, y: -2 }, { x: -3, y: 4 }, { x: 0, y: 0 }])).toEqual({ minX: -3, minY: -2, maxX: 1, maxY: 4 });
    });
    it('should refuse no points', () => expect(() => boundsOf([])).toThrow('at least one'));
  });

  describe('round2', () => {
    it('should round to hundredths without a negative zero', () => {
      expect(round2(1.005 + 1e-9)).toBe(1.01);
      expect(Object.is(round2(-0.001), 0)).toBe(true);
    });
  });
});
