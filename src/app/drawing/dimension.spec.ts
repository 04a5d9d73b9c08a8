import { angleArc, dimensionLine, polarPoint, uprightAngle } from './dimension';

// Expected coordinates below are worked by hand from the construction in dimension.ts (derived).
describe('dimension geometry', () => {
  describe('dimensionLine', () => {
    it('should draw a horizontal dimension above its feature with arrows inside', () => {
      const d = dimensionLine({ x: 0, y: 100 }, { x: 100, y: 100 }, 20, '1.0000');
      expect(d.extensionLines).toBe('M0,97L0,75M100,97L100,75');
      expect(d.line).toBe('M0,80L100,80');
      expect(d.arrows).toBe('M0,80L10,83L10,77ZM100,80L90,77L90,83Z');
      expect(d.label).toEqual({ x: 50, y: 75, rotate: 0, text: '1.0000' });
      expect(d.arrowsOutside).toBe(false);
    });

    it('should turn a vertical label to read upwards and keep it off the feature side', () => {
      const d = dimensionLine({ x: 0, y: 0 }, { x: 0, y: 100 }, 20, '0.750');
      expect(d.line).toBe('M20,0L20,100');
      expect(d.label).toEqual({ x: 35, y: 50, rotate: -90, text: '0.750' });
    });

    it('should put the arrows outside a short dimension and run the line past them', () => {
      const d = dimensionLine({ x: 0, y: 0 }, { x: 20, y: 0 }, -15, 'x');
      expect(d.arrowsOutside).toBe(true);
      expect(d.line).toBe('M-20,15L40,15');
      expect(d.arrows).toBe('M0,15L-10,12L-10,18ZM20,15L30,18L30,12Z');
    });

    it('should leave out extension lines for a dimension drawn on the feature', () => {
      expect(dimensionLine({ x: 0, y: 0 }, { x: 50, y: 0 }, 0, 'x').extensionLines).toBe('');
    });

    it('should align with a sloped feature (an aligned dimension)', () => {
      // a→b runs at -30° on screen (up and to the right); offset 10 goes up-left of it.
      const a = { x: 0, y: 0 };
      const b = { x: 100 * Math.cos(Math.PI / 6), y: -50 };
      const d = dimensionLine(a, b, 10, 'F');
      expect(d.label.rotate).toBe(-30);
      // a2 = a + 10·(sin30°·-1, -cos30°) = (-5, -8.66).
      expect(d.line.startsWith('M-5,-8.66L')).toBe(true);
    });

    it('should refuse two equal points', () => {
      expect(() => dimensionLine({ x: 1, y: 1 }, { x: 1, y: 1 }, 5, 'x')).toThrow('must differ');
    });
  });

  describe('uprightAngle', () => {
    it('should keep text upright for every direction', () => {
      expect(uprightAngle({ x: 1, y: 0 })).toBe(0);
      expect(uprightAngle({ x: -1, y: 0 })).toBe(0);
      expect(uprightAngle({ x: 0, y: 1 })).toBe(-90);
      expect(uprightAngle({ x: 0, y: -1 })).toBe(-90);
      expect(uprightAngle({ x: -1, y: -1 })).toBe(45);
    });
  });

  describe('polarPoint', () => {
    it('should measure angles counter-clockwise as seen on screen', () => {
      const p = polarPoint({ x: 10, y: 10 }, 5, 90);
      expect(p.x).toBeCloseTo(10, 12);
      expect(p.y).toBeCloseTo(5, 12);
    });
  });

  describe('angleArc', () => {
    it('should draw a quarter arc with arrows pointing outwards along it and the label at 45°', () => {
      const g = angleArc({ x: 100, y: 100 }, 50, 0, 90, '90°');
      expect(g.arc).toBe('M150,100A50,50,0,0,0,100,50');
      expect(g.arrows).toBe('M150,100L153,90L147,90ZM100,50L110,53L110,47Z');
      // The text '90°' is about 3·0.62·14 = 26.04 wide and 14 high. At 69 out along 45° its centre
      // is 48.79 from the centre each way and its nearest corner (35.77, 41.79) is 55.01 away, the
      // first whole step clear of radius 50 + gap 5 (at 68: 54.0).
      expect(g.label).toEqual({ x: 148.79, y: 51.21, rotate: 0, text: '90°' });
    });

    it('should put a small angle\'s text beyond its arc, not across the arc and its arrows', () => {
      const g = angleArc({ x: 0, y: 0 }, 60, 0, 3, '3°00\'00"');
      // 8 characters: about 69.4 wide. On the bisector (1.5°) the box must start past 60 + 5.
      const left = g.label.x - (8 * 0.62 * 14) / 2;
      expect(left).toBeGreaterThanOrEqual(65 - 0.5);
      expect(left).toBeLessThan(67);
      expect(g.label.y).toBeCloseTo(-Math.tan((1.5 * Math.PI) / 180) * g.label.x, 1);
    });

    it('should accept the ends in either order', () => {
      expect(angleArc({ x: 0, y: 0 }, 40, 30, 10, 'a').arc).toBe(angleArc({ x: 0, y: 0 }, 40, 10, 30, 'a').arc);
    });

    it('should refuse a radius of 0', () => expect(() => angleArc({ x: 0, y: 0 }, 0, 0, 10, 'a')).toThrow('radius'));
  });
});
