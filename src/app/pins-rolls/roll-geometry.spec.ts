import { dovetailGeometry, vGrooveGeometry } from './roll-geometry';

describe('dovetailGeometry', () => {
  describe('male, 60°, 0.375 rolls, a = 1.250', () => {
    // Machinery's Handbook "Measuring dovetail slides": x = a + D·(1 + cot(α/2)) = 2.2745
    // (REFERENCE.md §5.1 check values [DER]).
    const shape = dovetailGeometry({ side: 'male', angleDeg: 60, rollDiameter: 0.375, width: 1.25 });
    const over = shape.dimensions.find((d) => d.key === 'measurement');

    it('should put the measurement line over the rolls’ outer sides, 2.2745 apart', () => {
      expect(over).toBeDefined();
      expect((over?.to.x ?? 0) - (over?.from.x ?? 0)).toBeCloseTo(2.2745, 4);
      expect(over?.from.x).toBe(-1.13726);
    });

    it('should sit each roll on the base, (D/2)·cot 30° out from the corner', () => {
      // 0.625 + 0.1875 × 1.7320508 = 0.9497595 (derived).
      expect(shape.rolls.map((r) => r.centre)).toEqual([{ x: -0.94976, y: -0.1875 }, { x: 0.94976, y: -0.1875 }]);
      expect(shape.rolls[1].radius).toBe(0.1875);
      expect(shape.rolls[1].contacts[0]).toEqual({ x: 0.94976, y: 0 });
    });

    it('should touch the flank where the radius meets it square', () => {
      const roll = shape.rolls[1];
      const [, onFlank] = roll.contacts;
      expect(Math.hypot(onFlank.x - roll.centre.x, onFlank.y - roll.centre.y)).toBeCloseTo(0.1875, 5);
      // On the flank from (0.625, 0) rising at 60°: (x − 0.625)·tan 60° = −y.
      expect((onFlank.x - 0.625) * Math.tan(Math.PI / 3)).toBeCloseTo(-onFlank.y, 5);
    });

    it('should draw the tongue widening upward to its default depth 1.6·D', () => {
      // h = 0.6, flank run 0.6·cot 60° = 0.34641.
      expect(shape.part.slice(3, 7)).toEqual([{ x: 0.625, y: 0 }, { x: 0.97141, y: -0.6 }, { x: -0.97141, y: -0.6 }, { x: -0.625, y: 0 }]);
      const depth = shape.dimensions.find((d) => d.key === 'depth');
      expect([depth?.from.y, depth?.to.y]).toEqual([0, -0.6]);
    });

    it('should mark α at the top-left corner, between the flank (−60°) and the top face (0°)', () => {
      expect(shape.angle).toEqual({ vertex: { x: -0.97141, y: -0.6 }, radius: 0.33, fromDeg: -60, toDeg: 0 });
    });

    it('should hold the measurement line inside the bounds', () => {
      const [, y] = shape.bounds;
      // The line is offset h − r + gap above the rolls' centre line: at −(0.6 + 0.3375).
      expect(y).toBeLessThanOrEqual(-0.9375);
    });
  });

  describe('female, 60°, 0.500 rolls, b = 2.500', () => {
    // y = b − D·(1 + cot(α/2)) = 1.1340 (REFERENCE.md §5.1 check values [DER]).
    const shape = dovetailGeometry({ side: 'female', angleDeg: 60, rollDiameter: 0.5, width: 2.5 });

    it('should put the measurement line between the rolls’ inner sides, 1.1340 apart', () => {
      const between = shape.dimensions.find((d) => d.key === 'measurement');
      expect((between?.to.x ?? 0) - (between?.from.x ?? 0)).toBeCloseTo(1.134, 4);
      expect(between?.offset).toBe(0);
    });

    it('should sit the rolls in the groove’s bottom corners', () => {
      // 1.25 − 0.25 × 1.7320508 = 0.8169873.
      expect(shape.rolls[1].centre).toEqual({ x: 0.816987, y: -0.25 });
    });

    it('should draw the groove narrowing upward', () => {
      // Default h = 0.8 (1.6·D), flank run 0.8·cot 60° = 0.46188.
      expect(shape.part.slice(3, 7)).toEqual([{ x: 0.78812, y: -0.8 }, { x: 1.25, y: 0 }, { x: -1.25, y: 0 }, { x: -0.78812, y: -0.8 }]);
      expect(shape.angle).toEqual({ vertex: { x: -0.78812, y: -0.8 }, radius: 0.44, fromDeg: 180, toDeg: 240 });
    });
  });

  it('should deepen the dovetail so a large roll still touches the flank below the top', () => {
    const shape = dovetailGeometry({ side: 'male', angleDeg: 60, rollDiameter: 1, width: 2, depth: 0.2 });
    const depth = shape.dimensions.find((d) => d.key === 'depth');
    // Contact height (D/2)·cot 30°·sin 60° = 0.75, × 1.15 = 0.8625.
    expect(depth?.to.y).toBeCloseTo(-0.8625, 6);
  });
});

describe('vGrooveGeometry', () => {
  describe('90° V, 0.500 pin, 1.000 wide', () => {
    // m = r / sin(β/2) + r − (w/2)·cot(β/2) = 0.353553 + 0.25 − 0.5 = 0.103553 (derived).
    const shape = vGrooveGeometry({ includedAngleDeg: 90, pinDiameter: 0.5, grooveWidth: 1 });

    it('should put the V’s point 0.5 below the surface', () => {
      expect(shape.part.slice(1, 4)).toEqual([{ x: -0.5, y: 0 }, { x: 0, y: 0.5 }, { x: 0.5, y: 0 }]);
    });

    it('should stand the pin’s top 0.103553 above the surface', () => {
      const m = shape.dimensions.find((d) => d.key === 'measurement');
      expect(m?.from.y).toBe(0);
      expect(m?.to.y).toBe(-0.103553);
      expect(shape.rolls[0].centre).toEqual({ x: 0, y: 0.146447 });
    });

    it('should touch both flanks', () => {
      for (const c of shape.rolls[0].contacts) {
        // Flanks: |x| + y = 0.5.
        expect(Math.abs(c.x) + c.y).toBeCloseTo(0.5, 5);
      }
    });
  });

  it('should give a pin top below the surface for a 60° V with a small pin', () => {
    // Point 0.866025 deep, centre 0.5 above it: top 0.116025 below the surface.
    const shape = vGrooveGeometry({ includedAngleDeg: 60, pinDiameter: 0.5, grooveWidth: 1 });
    const m = shape.dimensions.find((d) => d.key === 'measurement');
    expect(m?.to.y).toBe(0.116025);
  });

  it('should mark β below the V’s point, between the flanks’ extensions at 225° and 315°', () => {
    const shape = vGrooveGeometry({ includedAngleDeg: 90, pinDiameter: 0.5, grooveWidth: 1 });
    // Radius min(0.5·0.45, 1·0.3) = 0.225.
    expect(shape.angle).toEqual({ vertex: { x: 0, y: 0.5 }, radius: 0.225, fromDeg: 225, toDeg: 315 });
  });
});
