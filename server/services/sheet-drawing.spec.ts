import { calculateGaugeStack } from '../../shared/calc/gauge-stack';
import { calculateLatheTaper } from '../../shared/calc/lathe-taper';
import { setupResults } from '../../shared/library/setup-results';
import { sketchFor } from './setup-sheet';
import { calculateAngleBlocks } from '../../shared/calc/angle-blocks';
import { angleBlocksSketch, angleSketch, dovetailSketch, gaugeStackSketch, vGrooveSketch, latheTaperSketch, sineBarSketch, taperSketch } from './sheet-drawing';

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

  describe('gaugeStackSketch', () => {
    const blocks = ['0.1002', '3.000', '0.126', '0.750'];
    const sketch = gaugeStackSketch(blocks, '3.9762 in');
    const drawn = sketch.shapes.filter((s) => s.style === 'block');

    it('should stack every block once, largest at the bottom, each on the one below', () => {
      expect(drawn.map((s) => s.label)).toEqual(['3.000', '0.750', '0.126', '0.1002']);
      expect(drawn[0]?.points[0]?.y).toBe(0);
      for (let i = 1; i < drawn.length; i += 1) expect(drawn[i]?.points[0]?.y).toBeCloseTo(drawn[i - 1]?.points[2]?.y ?? NaN, 12);
    });
    it('should draw no block lower than its size and put the total beside the whole stack', () => {
      drawn.forEach((s) => expect((s.points[2]?.y ?? 0) - (s.points[0]?.y ?? 0)).toBeGreaterThanOrEqual(Number(s.label) - 1e-12));
      const total = sketch.shapes.find((s) => s.kind === 'dimension');
      expect(total?.label).toBe('3.9762 in');
      expect(total?.points[1]?.y).toBeCloseTo(drawn[drawn.length - 1]?.points[2]?.y ?? NaN, 12);
      expect(sketch.title).toMatch(/not to scale/);
    });
  });

  describe('latheTaperSketch', () => {
    // The taper side rises at the half angle (derived: tan(α/2) = (D − d) / 2L).
    const slope = (sketch: ReturnType<typeof latheTaperSketch>) => {
      const [a, b] = sketch.shapes.find((s) => s.style === 'part')!.points;
      return (b!.y - a!.y) / (b!.x - a!.x);
    };
    it('should draw a 10° half angle as it is and label the length', () => {
      const sketch = latheTaperSketch(10, "10°00'00\"", 1.5, 2, 'L 2.0000 in');
      expect(slope(sketch)).toBeCloseTo(Math.tan(10 * Math.PI / 180), 12);
      expect(sketch.title).not.toMatch(/exaggerated/);
      expect(sketch.shapes.find((s) => s.kind === 'dimension')?.label).toBe('L 2.0000 in');
    });
    it('should exaggerate a slight taper to 6° a side and say so', () => {
      const sketch = latheTaperSketch(1.4377, "1°26'16\"", null, null);
      expect(slope(sketch)).toBeCloseTo(Math.tan(6 * Math.PI / 180), 12);
      expect(sketch.title).toMatch(/exaggerated/);
      expect(sketch.shapes.find((s) => s.kind === 'dimension')?.label).toBe('taper length');
    });
  });

  describe('angleBlocksSketch', () => {
    const deg = (a: { x: number; y: number }, b: { x: number; y: number }) => (Math.atan2(b.y - a.y, b.x - a.x) * 180) / Math.PI;
    it('should tilt each block\'s top face by its angle, the other way when it is turned round', () => {
      const sketch = angleBlocksSketch([{ angleDeg: 41, label: '41°', reversed: false }, { angleDeg: 27, label: '27°', reversed: true }], '14°');
      const [first, second] = sketch.shapes.filter((s) => s.style === 'block');
      expect(deg(first!.points[3]!, first!.points[2]!) - deg(first!.points[0]!, first!.points[1]!)).toBeCloseTo(41, 9);
      expect(deg(second!.points[3]!, second!.points[2]!) - deg(second!.points[0]!, second!.points[1]!)).toBeCloseTo(-27, 9);
      // Each block sits on the one below: its bottom face starts where the lower block's top face starts.
      expect(second!.points[0]).toEqual(first!.points[3]);
      expect(second!.label).toBe('27° turned round');
    });
    it('should end the top face at the angle the engine combined (REFERENCE.md §6 rule: in line adds, reversed subtracts; here 41° − 27° + 27′ + 3′ = 14°30′, derived)', () => {
      const engine = calculateAngleBlocks({ angle: "14°30'", set: 'angle-13-npl' });
      if (!engine.ok) throw new Error(engine.error);
      const sketch = sketchFor('angle-blocks', { angle: "14°30'", set: 'angle-13-npl' }, setupResults('angle-blocks', { angle: "14°30'", set: 'angle-13-npl' }))!;
      const top = sketch.shapes.find((s) => s.label?.startsWith('top face'))!;
      expect(deg(top.points[0]!, top.points[1]!)).toBeCloseTo(Number(engine.value.achievedAngleDeg), 9);
      expect(top.label).toBe(`top face at ${engine.value.achievedAngleDms}`);
      expect(sketch.shapes.filter((s) => s.style === 'block')).toHaveLength(engine.value.count);
    });
  });

  describe('dovetailSketch', () => {
    // REFERENCE.md §5.1 (Machinery's Handbook, measuring dovetail slides): male x = a + D(1 + cot(α/2)),
    // female y = b − D(1 + cot(α/2)); for 60° the constant is 2.7320508.
    const k60 = 2.7320508;
    const span = (sketch: ReturnType<typeof dovetailSketch>) => {
      const dim = sketch.shapes.find((s) => s.kind === 'dimension')!;
      return dim.points[1]!.x - dim.points[0]!.x;
    };
    /** Distance from a point to the line through a and b. */
    const distance = (p: { x: number; y: number }, a: { x: number; y: number }, b: { x: number; y: number }) =>
      Math.abs((b.x - a.x) * (a.y - p.y) - (a.x - p.x) * (b.y - a.y)) / Math.hypot(b.x - a.x, b.y - a.y);

    it('should span the reading over the rolls of a male dovetail, each roll touching base and flank', () => {
      const sketch = dovetailSketch('male', 2, 60, 0.25, 0.5, '2.6830 in');
      expect(span(sketch)).toBeCloseTo(2 + 0.25 * k60, 6);
      const roll = sketch.shapes.filter((s) => s.kind === 'circle')[1]!;
      const part = sketch.shapes.find((s) => s.style === 'part')!;
      expect(roll.points[0]!.y).toBeCloseTo(0.125, 12);
      expect(distance(roll.points[0]!, part.points[1]!, part.points[2]!)).toBeCloseTo(0.125, 12);
      expect(sketch.shapes.find((s) => s.kind === 'dimension')?.label).toBe('M 2.6830 in');
    });
    it('should span the reading between the rolls of a female dovetail', () => {
      const sketch = dovetailSketch('female', 2, 60, 0.25, 0.5, '1.3170 in');
      expect(span(sketch)).toBeCloseTo(2 - 0.25 * k60, 6);
      const roll = sketch.shapes.filter((s) => s.kind === 'circle')[1]!;
      const part = sketch.shapes.find((s) => s.style === 'part')!;
      // The right flank of the slot runs from (W/2, 0) up to the top edge.
      expect(distance(roll.points[0]!, part.points[4]!, part.points[3]!)).toBeCloseTo(0.125, 12);
    });
    it('should be what sketchFor draws for a dovetail set-up, with the engine\'s reading', () => {
      const inputs = { kind: 'dovetail', unit: 'in', side: 'male', angle: '60', rollDiameter: '0.250', width: '2.000', depth: '0.5' };
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.title).toMatch(/Male dovetail/);
      expect(sketch.shapes.find((s) => s.kind === 'dimension')?.label).toBe('M 2.6830 in');
    });
  });

  describe('vGrooveSketch', () => {
    // Derived: the pin touches both flanks, centre r / sin(θ/2) above the apex, apex (W/2)·cot(θ/2)
    // below the surface; for W 1, θ 90°, D 0.5 the top stands 0.25·√2 + 0.25 − 0.5 = 0.1036 proud.
    it('should seat the pin on both flanks and dimension its top over the surface', () => {
      const sketch = vGrooveSketch(1, 90, 0.5, '0.1036 in');
      const pin = sketch.shapes.find((s) => s.kind === 'circle')!;
      const groove = sketch.shapes.find((s) => s.style === 'part')!;
      const [right, apex] = [groove.points[3]!, groove.points[4]!];
      const distance = Math.abs((apex.x - right.x) * (right.y - pin.points[0]!.y) - (right.x - pin.points[0]!.x) * (apex.y - right.y)) / Math.hypot(apex.x - right.x, apex.y - right.y);
      expect(distance).toBeCloseTo(0.25, 12);
      const dim = sketch.shapes.find((s) => s.kind === 'dimension')!;
      expect(dim.points[1]!.y - dim.points[0]!.y).toBeCloseTo(0.25 * Math.SQRT2 + 0.25 - 0.5, 12);
      expect(dim.label).toBe('h 0.1036 in');
    });
    it('should be what sketchFor draws for a V-groove set-up, with the engine\'s height', () => {
      const inputs = { kind: 'v-groove', unit: 'in', includedAngle: '90', pinDiameter: '0.500', grooveWidth: '1.000' };
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.shapes.find((s) => s.kind === 'dimension')?.label).toBe('h 0.1036 in');
    });
  });

  describe('sketchFor', () => {
    it('should sketch a gauge-block set-up as the stack the engine chose', () => {
      const inputs = { target: '3.9762', set: 'inch-81' };
      const engine = calculateGaugeStack(inputs);
      if (!engine.ok) throw new Error(engine.error);
      const sketch = sketchFor('gauge-blocks', inputs, setupResults('gauge-blocks', inputs));
      expect(sketch?.shapes.filter((s) => s.style === 'block').map((s) => s.label).sort()).toEqual([...engine.value.blocks].sort());
    });
    it('should label the taper length as the engine printed it, with its unit', () => {
      // Derived: (1.0 − 0.9) / 0.05019583 in per inch = 1.9922 in (MT3 taper per inch from REFERENCE.md §4.2).
      const inputs = { unit: 'in', taperPerFoot: '0.60235', largeDiameter: '1.0', smallDiameter: '0.9' };
      const sketch = sketchFor('lathe-taper', inputs, setupResults('lathe-taper', inputs))!;
      expect(sketch.shapes.find((s) => s.kind === 'dimension')?.label).toBe('L 1.9922 in');
    });
    it('should sketch a lathe-taper set-up at the engine\'s half angle', () => {
      // REFERENCE.md §4.2 (Morse tapers, Machinery's Handbook data): MT3 is 0.60235 in/ft, half angle 1°26'16".
      const inputs = { unit: 'in', taperPerFoot: '0.60235', workLength: '6', largeDiameter: '1.0' };
      const engine = calculateLatheTaper(inputs);
      if (!engine.ok) throw new Error(engine.error);
      const sketch = sketchFor('lathe-taper', inputs, setupResults('lathe-taper', inputs));
      expect(engine.value.halfAngleDms).toBe("1°26'16\"");
      expect(sketch?.shapes.find((s) => s.style === 'cut')?.label).toBe(`compound at ${engine.value.halfAngleDms}`);
    });
  });

  describe('angleSketch', () => {
    it('should clamp extreme angles so the triangle stays drawable', () => {
      const { box } = angleSketch(89.9, '89.9°');
      expect(Number.isFinite(box.maxY)).toBe(true);
    });
  });
});
