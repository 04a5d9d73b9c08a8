import { calculateGaugeStack } from '../../shared/calc/gauge-stack';
import { calculateLatheTaper } from '../../shared/calc/lathe-taper';
import { setupResults } from '../../shared/library/setup-results';
import { sketchFor } from './setup-sheet';
import { calculateAngleBlocks } from '../../shared/calc/angle-blocks';
import { calculateOverPins } from '../../shared/calc/over-pins';
import { angleBlocksSketch, angleSketch, dovetailAngleSketch, dovetailSketch, gaugeStackSketch, vGrooveSketch, latheTaperSketch, sineBarSketch, taperBallsSketch, taperDiscsSketch, taperSketch, taperTwoHeightsSketch, type Pt, type Sketch } from './sheet-drawing';

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
    it('should stand a sine plate on a stack L·sin α high and lay the part on the plate at α', () => {
      const sketch = taperSketch(0.75, 2.5, 7.5, '0.3263', { kind: 'sine-plate', plateLength: 5, stackLabel: '0.6526 in' });
      expect(sketch.title).toBe('Part on the sine plate over a 0.6526 in stack, taper face level; touch off on the high corner');
      const stack = sketch.shapes.find((sh) => sh.label === 'stack');
      expect(stack?.points[2]?.y).toBeCloseTo(5 * Math.sin((7.5 * Math.PI) / 180), 9);
      const [hinge, free] = sketch.shapes.filter((sh) => sh.kind === 'circle' && sh.style === 'tool');
      // The free roll rests on the stack, the hinge roll on the surface plate.
      expect((free?.points[0]?.y ?? 0) - (free?.r ?? 0)).toBeCloseTo(stack?.points[2]?.y ?? NaN, 9);
      expect((hinge?.points[0]?.y ?? 0) - (hinge?.r ?? 0)).toBeCloseTo(0, 9);
      // The part's bottom face lies on the plate's top face: both at α, the part above the plate.
      const plate = sketch.shapes.find((sh) => sh.label === 'sine plate')!.points;
      const part = sketch.shapes.find((sh) => sh.style === 'part')!.points;
      const slope = (a: Pt, b: Pt) => (b.y - a.y) / (b.x - a.x);
      expect(Math.atan(slope(part[0]!, part[1]!)) * (180 / Math.PI)).toBeCloseTo(7.5, 9);
      const onTop = (p: Pt) => plate[3]!.y + slope(plate[3]!, plate[2]!) * (p.x - plate[3]!.x);
      expect(part[0]!.y).toBeCloseTo(onTop(part[0]!), 9);
      expect(part[1]!.y).toBeCloseTo(onTop(part[1]!), 9);
      const dim = sketch.shapes.filter((sh) => sh.kind === 'dimension').find((sh) => sh.label?.startsWith('h '));
      expect((dim?.points[0]?.y ?? 0) - (dim?.points[1]?.y ?? 0)).toBeCloseTo(2.5 * Math.sin((7.5 * Math.PI) / 180), 9);
    });
    it('should put the part in a tilted vise above its body and base', () => {
      const sketch = taperSketch(0.75, 2.5, 7.5, '0.3263', { kind: 'tilted-vise' });
      expect(sketch.title).toBe('Part in the tilted vise, taper face level; touch off on the high corner');
      const body = sketch.shapes.find((sh) => sh.label === 'vise body, tilted')!.points;
      const base = sketch.shapes.find((sh) => sh.label === 'vise base')!.points;
      const part = sketch.shapes.find((sh) => sh.style === 'part')!.points;
      expect(Math.min(...body.map((p) => p.y))).toBeGreaterThan(Math.max(...base.map((p) => p.y)));
      // The part's bottom edge is the body's top edge.
      expect(part[0]!.y).toBeCloseTo((body[3]!.y + body[2]!.y) / 2 + (part[0]!.x - (body[3]!.x + body[2]!.x) / 2) * Math.tan((7.5 * Math.PI) / 180), 9);
      expect([sketch.box.minX, sketch.box.minY, sketch.box.maxX, sketch.box.maxY].every(Number.isFinite)).toBe(true);
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

  describe('gaugeStackSketch with wear blocks', () => {
    it('should keep the wringing order and label each block by its name', () => {
      const sketch = gaugeStackSketch(['0.050', '1.000', '0.100', '0.050'], '1.200 in', ['0.050 wear', '1.000', '0.100', '0.050 wear']);
      expect(sketch.shapes.filter((s) => s.style === 'block').map((s) => s.label)).toEqual(['0.050 wear', '1.000', '0.100', '0.050 wear']);
      expect(sketch.title).toMatch(/wear block at each end/);
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

  // Helpers for the two-reading and taper sketches of the pins-and-rolls area.
  const DEG = Math.PI / 180;
  /** Distance from p to the line through a and b. */
  const lineDistance = (p: Pt, a: Pt, b: Pt) => Math.abs((b.x - a.x) * (a.y - p.y) - (a.x - p.x) * (b.y - a.y)) / Math.hypot(b.x - a.x, b.y - a.y);
  /** Angle of the line a→b in degrees. */
  const heading = (a: Pt, b: Pt) => Math.atan2(b.y - a.y, b.x - a.x) / DEG;
  const dimensions = (sketch: Sketch) => sketch.shapes.filter((s) => s.kind === 'dimension');
  const dimensionLength = (sketch: Sketch, label: string) => {
    const dim = dimensions(sketch).find((s) => s.label === label)!;
    return Math.hypot(dim.points[1]!.x - dim.points[0]!.x, dim.points[1]!.y - dim.points[0]!.y);
  };
  /** Every coordinate and radius is a finite number and the box has room. */
  const expectDrawable = (sketch: Sketch | null) => {
    expect(sketch).not.toBeNull();
    const numbers = sketch!.shapes.flatMap((s) => [...s.points.flatMap((p) => [p.x, p.y]), ...(s.labelAt ? [s.labelAt.x, s.labelAt.y] : []), ...(s.r === undefined ? [] : [s.r])]);
    expect(numbers.every(Number.isFinite)).toBe(true);
    const { box } = sketch!;
    expect([box.minX, box.minY, box.maxX, box.maxY].every(Number.isFinite)).toBe(true);
    expect(box.maxX).toBeGreaterThan(box.minX);
    expect(box.maxY).toBeGreaterThan(box.minY);
  };
  const engineValue = (inputs: Record<string, unknown>) => {
    const engine = calculateOverPins(inputs);
    if (!engine.ok) throw new Error(engine.error);
    return engine.value;
  };
  const labels = (sketch: Sketch) => sketch.shapes.map((s) => s.label).filter((l): l is string => l !== undefined);

  describe('dovetailAngleSketch', () => {
    // REFERENCE.md §5.1: x = a + D·k (male), y = b − D·k (female), k = 1 + cot(α/2) = 2.7320508 for 60°;
    // inverse k = Δx/ΔD, α = 2·atan(1/(k − 1)) (toolmonger, §5.1). Placement of the rolls: derived.
    const k60 = 1 + 1 / Math.tan(30 * DEG);
    const names = { reading1: 'M1', reading2: 'M2', width: 'W', angle: 'A' };
    const rollsOf = (sketch: Sketch) => sketch.shapes.filter((s) => s.kind === 'circle');

    it('should seat both sizes of roll on the base and the flank of a male dovetail and span both readings', () => {
      const sketch = dovetailAngleSketch('male', 0.25, 2 + 0.25 * k60, 0.5, 2 + 0.5 * k60, names)!;
      const part = sketch.shapes.find((s) => s.style === 'part')!;
      const [corner, flankTop] = [part.points[1]!, part.points[2]!];
      expect(heading(corner, flankTop)).toBeCloseTo(60, 9);
      expect(corner.x).toBeCloseTo(1, 9);
      const rolls = rollsOf(sketch);
      expect(rolls.map((c) => c.r).sort()).toEqual([0.125, 0.125, 0.25, 0.25]);
      for (const roll of rolls.filter((c) => c.points[0]!.x > 0)) {
        expect(roll.points[0]!.y).toBeCloseTo(roll.r!, 12);
        expect(lineDistance(roll.points[0]!, corner, flankTop)).toBeCloseTo(roll.r!, 9);
      }
      expect(dimensionLength(sketch, 'M1')).toBeCloseTo(2 + 0.25 * k60, 9);
      expect(dimensionLength(sketch, 'M2')).toBeCloseTo(2 + 0.5 * k60, 9);
      expect(dimensionLength(sketch, 'W')).toBeCloseTo(2, 9);
      expect(sketch.title).toMatch(/Male dovetail/);
    });
    it('should do the same between the rolls of a female dovetail', () => {
      const sketch = dovetailAngleSketch('female', 0.5, 2.5 - 0.5 * k60, 0.25, 2.5 - 0.25 * k60, names)!;
      const part = sketch.shapes.find((s) => s.style === 'part')!;
      const [corner, flankTop] = [part.points[4]!, part.points[3]!];
      expect(180 - heading(corner, flankTop)).toBeCloseTo(60, 9);
      for (const roll of rollsOf(sketch).filter((c) => c.points[0]!.x > 0)) {
        expect(roll.points[0]!.y).toBeCloseTo(roll.r!, 12);
        expect(lineDistance(roll.points[0]!, corner, flankTop)).toBeCloseTo(roll.r!, 9);
      }
      expect(dimensionLength(sketch, 'M1')).toBeCloseTo(2.5 - 0.5 * k60, 9);
      expect(dimensionLength(sketch, 'M2')).toBeCloseTo(2.5 - 0.25 * k60, 9);
      expect(dimensionLength(sketch, 'W')).toBeCloseTo(2.5, 9);
      // The slot stays open at the top.
      expect(part.points[3]!.x).toBeGreaterThan(part.points[6]!.x);
    });
    it('should give no sketch when the readings make an angle of 90° or more', () => {
      // k = 2 gives cot(α/2) = 1, α = 90° (derived).
      expect(dovetailAngleSketch('male', 0.25, 2.5, 0.5, 3, names)).toBeNull();
      expect(dovetailAngleSketch('male', 0.25, 2.5, 0.5, 2.6, names)).toBeNull();
    });
    it('should stay finite for very small and very large angles and tiny rolls', () => {
      for (const deg of [0.5, 20, 89.5]) {
        const k = 1 + 1 / Math.tan((deg / 2) * DEG);
        for (const [d1, d2] of [[0.001, 0.002], [0.25, 0.5]]) {
          expectDrawable(dovetailAngleSketch('male', d1!, 1 + d1! * k, d2!, 1 + d2! * k, names));
          if (1 - d2! * k > 0) expectDrawable(dovetailAngleSketch('female', d1!, 1 - d1! * k, d2!, 1 - d2! * k, names));
        }
      }
    });
    it('should be what sketchFor draws for a dovetail-angle set-up, with the engine\'s angle and width', () => {
      // Readings for a = 2.000 in, α = 60° over 0.250 and 0.500 in rolls (REFERENCE.md §5.1 formula, derived).
      const inputs = { kind: 'dovetail-angle', unit: 'in', side: 'male', rollDiameter1: '0.250', measurement1: '2.6830', rollDiameter2: '0.500', measurement2: '3.3660' };
      const engine = engineValue(inputs);
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.title).toMatch(/two sizes of roll/);
      expect(labels(sketch)).toEqual(expect.arrayContaining([`α ${engine.dms['angleDeg']}`, `a ${engine.values['width']} in`, 'M1 2.6830 in over 0.250 rolls', 'M2 3.3660 in over 0.500 rolls']));
      const flank = sketch.shapes.find((s) => s.label === `α ${engine.dms['angleDeg']}`)!;
      expect(heading(flank.points[0]!, flank.points[1]!)).toBeCloseTo(Number(engine.values['angleDeg']), 3);
    });
  });

  describe('taperTwoHeightsSketch', () => {
    // REFERENCE.md §5.2: tan(α/2) = (M₂ − M₁)/(2·ΔH); the roll size cancels. Derived example:
    // M₁ 1.5000, M₂ 1.4500, ΔH 1.000 → tan(α/2) = −0.025 (narrowing upward).
    const names = { reading1: 'M1', reading2: 'M2', height: 'dH', halfAngle: 'half', included: 'inc' };
    const check = (m1: number, m2: number, dh: number) => {
      const sketch = taperTwoHeightsSketch(m1, m2, dh, names)!;
      const part = sketch.shapes.find((s) => s.style === 'part')!;
      const [foot, head] = [part.points[1]!, part.points[2]!];
      const rolls = sketch.shapes.filter((s) => s.kind === 'circle');
      return { sketch, part, foot, head, rolls };
    };

    it('should lean the side at the half angle with every roll touching it', () => {
      const { sketch, foot, head, rolls } = check(1.5, 1.45, 1);
      expect((head.x - foot.x) / (head.y - foot.y)).toBeCloseTo(-0.025, 12);
      expect(rolls).toHaveLength(4);
      for (const roll of rolls.filter((c) => c.points[0]!.x > 0)) expect(lineDistance(roll.points[0]!, foot, head)).toBeCloseTo(roll.r!, 12);
      expect(dimensionLength(sketch, 'M1')).toBeCloseTo(1.5, 12);
      expect(dimensionLength(sketch, 'M2')).toBeCloseTo(1.45, 12);
      expect(dimensionLength(sketch, 'dH')).toBeCloseTo(1, 12);
    });
    it('should rest the first rolls on their stacks, the stacks clear of the work, and raise the second pair by ΔH', () => {
      const { sketch, foot, rolls } = check(1.5, 1.45, 1);
      const stacks = sketch.shapes.filter((s) => s.style === 'block' && s.label !== 'surface plate');
      expect(stacks).toHaveLength(2);
      const [first, second] = [rolls.filter((c) => c.style === 'tool'), rolls.filter((c) => c.style === 'mark')];
      for (const roll of first) {
        const under = stacks.find((st) => st.points[0]!.x < roll.points[0]!.x && st.points[1]!.x > roll.points[0]!.x)!;
        expect(roll.points[0]!.y - roll.r!).toBeCloseTo(under.points[2]!.y, 12);
      }
      const right = stacks.find((st) => st.points[0]!.x > 0)!;
      expect(right.points[0]!.x).toBeGreaterThan(foot.x);
      expect(second[0]!.points[0]!.y - first[0]!.points[0]!.y).toBeCloseTo(1, 12);
      // Each raised roll stands on a dashed stack: the stack's top line lies under it, touching it.
      for (const roll of second) {
        const c = roll.points[0]!;
        const top = sketch.shapes.find((s) => s.kind === 'line' && s.points[0]!.y === s.points[1]!.y && s.points[0]!.x < c.x && s.points[1]!.x > c.x && s.points[0]!.y > 0);
        expect(top).toBeDefined();
        expect(c.y - roll.r!).toBeCloseTo(top!.points[0]!.y, 12);
      }
    });
    it('should put the half-angle label at the top corner of the side, above every roll, stack and reading line', () => {
      for (const [m1, m2, dh] of [[1.5, 1.45, 1], [0.745, 0.62, 1], [1, 1.2, 0.5]] as const) {
        const { sketch, head } = check(m1, m2, dh);
        const label = sketch.shapes.find((s) => s.label === 'half')!;
        expect(label.labelAt).toEqual(head);
        const others = sketch.shapes.filter((s) => s !== label && s.label !== 'inc' && s.label !== 'surface plate' && s.style !== 'part');
        const highest = Math.max(...others.flatMap((s) => s.points.map((p) => p.y + (s.r ?? 0))));
        expect(label.labelAt!.y).toBeGreaterThan(highest);
      }
    });
    it('should keep the work a proper shape for steep and slight tapers both ways, and stay finite', () => {
      for (const [m1, m2, dh] of [[1, 100, 0.001], [100, 1, 0.001], [1.5, 1.4999, 1000], [0.001, 0.002, 0.001], [2, 1, 1e-6]] as const) {
        const { sketch, part, foot, head, rolls } = check(m1, m2, dh);
        expectDrawable(sketch);
        expect(foot.x).toBeGreaterThan(0);
        expect(head.x).toBeGreaterThan(0);
        expect(part.points[0]!.x).toBeCloseTo(-foot.x, 12);
        for (const roll of rolls.filter((c) => c.points[0]!.x > 0)) expect(lineDistance(roll.points[0]!, foot, head) / roll.r!).toBeCloseTo(1, 6);
      }
    });
    it('should be what sketchFor draws for a two-height set-up, with the engine\'s half angle', () => {
      // REFERENCE.md §5.2 published example (hobby-machinist): .745 and .620 in, 1 in apart → 3°34'35" a side.
      const inputs = { kind: 'taper-two-heights', unit: 'in', measurement1: '0.745', measurement2: '0.620', heightDifference: '1' };
      const engine = engineValue(inputs);
      expect(engine.dms['halfAngleDeg']).toBe("3°34'35\"");
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.title).toMatch(/M2 with the rolls raised/);
      expect(labels(sketch)).toEqual(expect.arrayContaining([`α/2 ${engine.dms['halfAngleDeg']}`, `α ${engine.dms['includedAngleDeg']}, TPF ${engine.values['taperPerFoot']} in/ft`, 'M1 0.745 in', 'M2 0.620 in', 'ΔH 1 in']));
    });
  });

  describe('taperDiscsSketch', () => {
    // REFERENCE.md §5.2 (Machinery's Handbook 31 p. 701): K = (D − d)/(2C); about the axis each side
    // leans asin K; with one side square the sides meet at 2·asin K. Tangency of the straightedges: derived.
    const names = { large: 'D', small: 'd', centres: 'C', angle: 'A' };
    /** The inner (touching) line of a straightedge: its first two points. */
    const edges = (sketch: Sketch) => sketch.shapes.filter((s) => s.style === 'block').map((s) => [s.points[0]!, s.points[1]!] as const);
    const discs = (sketch: Sketch) => sketch.shapes.filter((s) => s.kind === 'circle');

    it('should touch both discs with both straightedges about the axis, each leaning asin K', () => {
      const sketch = taperDiscsSketch('axis', 1.5, 1, 5, names)!;
      const K = 0.25 / 5;
      expect(edges(sketch)).toHaveLength(2);
      for (const [a, b] of edges(sketch)) {
        for (const disc of discs(sketch)) expect(lineDistance(disc.points[0]!, a, b)).toBeCloseTo(disc.r!, 12);
        expect(Math.abs(Math.abs(heading(a, b)) - 90)).toBeCloseTo(Math.asin(K) / DEG, 9);
      }
      expect(dimensionLength(sketch, 'C')).toBeCloseTo(5, 12);
    });
    it('should touch both discs with the square side and the other straightedge, 2·asin K apart', () => {
      const sketch = taperDiscsSketch('side', 3, 2, 5, names)!;
      const [square, other] = edges(sketch);
      expect(square![0].x).toBe(0);
      expect(square![1].x).toBe(0);
      for (const [a, b] of [square!, other!]) for (const disc of discs(sketch)) expect(lineDistance(disc.points[0]!, a, b)).toBeCloseTo(disc.r!, 12);
      expect(heading(other![0], other![1]) - 90).toBeCloseTo((2 * Math.asin(0.1)) / DEG, 9);
      expect(dimensionLength(sketch, 'C')).toBeCloseTo(5, 12);
    });
    it('should give no sketch when the discs cannot both touch the straightedges', () => {
      expect(taperDiscsSketch('axis', 3, 1, 1, names)).toBeNull();
      expect(taperDiscsSketch('axis', 1, 1, 5, names)).toBeNull();
    });
    it('should stay finite for angles near 0° and 180° and tiny discs', () => {
      for (const [D, d, C] of [[1.5, 1, 1e6], [3, 1, 1.0000001], [0.002, 0.001, 0.01], [3, 1, 1]] as const) {
        for (const ref of ['axis', 'side'] as const) {
          const sketch = taperDiscsSketch(ref, D, d, C, names);
          if (C > (D - d) / 2) expectDrawable(sketch);
          else expect(sketch).toBeNull();
        }
      }
    });
    it('should be what sketchFor draws for a disc set-up, with the engine\'s centre distance and angle', () => {
      // REFERENCE.md §5.2: gauge to 3/4 in/ft with discs 1.25 and 1.5 in → C = 4.002 in (Machinery's Handbook, Jones).
      const inputs = { kind: 'taper-discs', unit: 'in', largeDisc: '1.5', smallDisc: '1.25', taperPerFoot: '0.75' };
      const engine = engineValue(inputs);
      expect(Number(engine.values['centreDistance'])).toBeCloseTo(4.002, 3);
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.title).toMatch(/about the axis/);
      expect(labels(sketch)).toEqual(expect.arrayContaining([`C ${engine.values['centreDistance']} in`, `α ${engine.dms['includedAngleDeg']}`, 'D 1.5 in', 'd 1.25 in']));
      expect(dimensionLength(sketch, `C ${engine.values['centreDistance']} in`)).toBeCloseTo(Number(engine.values['centreDistance']), 12);
    });
    it('should draw the square-side set-up with the engine\'s taper per foot', () => {
      // REFERENCE.md §5.2: taper square to one side, discs 2 and 3 in, C = 5 in → 2.4367 in/ft (Machinery's Handbook).
      const inputs = { kind: 'taper-discs', unit: 'in', largeDisc: '3', smallDisc: '2', centreDistance: '5', reference: 'side' };
      const engine = engineValue(inputs);
      expect(engine.values['taperPerFoot']).toMatch(/^2\.4367/);
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.title).toMatch(/one side square/);
      expect(labels(sketch)).toContain(`α ${engine.dms['includedAngleDeg']}, TPF ${engine.values['taperPerFoot']} in/ft`);
    });
  });

  describe('taperBallsSketch', () => {
    // REFERENCE.md §5.2 [DER]: sin(α/2) = (R − r)/s; balls Ø40 and Ø32, the large one 8 mm proud,
    // the small one's top 76 mm down → s = 80 mm, sin(α/2) = 4/80. Tangency to the bore: derived.
    const names = { large: 'D', small: 'd', largeDepth: 'h1', smallDepth: 'h2', centres: 's', halfAngle: 'half', included: 'inc' };

    it('should rest each ball on both walls of the bore at the depths given', () => {
      const sketch = taperBallsSketch(40, 32, -8, 76, names)!;
      const part = sketch.shapes.find((s) => s.style === 'part')!;
      const walls = [[part.points[1]!, part.points[2]!], [part.points[4]!, part.points[3]!]] as const;
      const [large, small] = sketch.shapes.filter((s) => s.kind === 'circle');
      for (const ball of [large!, small!]) for (const [a, b] of walls) expect(lineDistance(ball.points[0]!, a, b)).toBeCloseTo(ball.r!, 9);
      expect(90 - heading(walls[1][1], walls[1][0])).toBeCloseTo(Math.asin(4 / 80) / DEG, 9);
      expect(large!.points[0]!.y + 20).toBeCloseTo(8, 12);
      expect(small!.points[0]!.y + 16).toBeCloseTo(-76, 12);
      expect(dimensionLength(sketch, 's')).toBeCloseTo(80, 9);
      expect(dimensionLength(sketch, 'h1')).toBeCloseTo(8, 12);
      expect(dimensionLength(sketch, 'h2')).toBeCloseTo(76, 12);
    });
    it('should give no sketch when the balls do not fit a taper or the large one would touch above the face', () => {
      expect(taperBallsSketch(40, 32, 0, 0, names)).toBeNull();
      expect(taperBallsSketch(40, 32, -100, 76, names)).toBeNull();
    });
    it('should stay finite for steep and slight tapers and tiny balls', () => {
      // s just over R − r gives a half angle near 90°; a long s gives one near 0°.
      for (const [D, d, h1, h2] of [[40, 32, 0, 8.0001], [40, 32, 0, 1e6], [0.002, 0.001, 0.001, 0.1], [40, 32, 10, 30]] as const) expectDrawable(taperBallsSketch(D, d, h1, h2, names));
    });
    it('should be what sketchFor draws for a two-ball set-up, with the engine\'s centre distance and angles', () => {
      const inputs = { kind: 'taper-balls', unit: 'mm', largeBall: '40', smallBall: '32', largeBallDepth: '-8', smallBallDepth: '76' };
      const engine = engineValue(inputs);
      // REFERENCE.md §5.2: α = 5.732° (5°43'55").
      expect(engine.dms['includedAngleDeg']).toBe("5°43'55\"");
      const sketch = sketchFor('pins-rolls', inputs, setupResults('pins-rolls', inputs))!;
      expect(sketch.title).toMatch(/Internal taper/);
      expect(labels(sketch)).toEqual(expect.arrayContaining([`s ${engine.values['centreDistance']} mm`, `α/2 ${engine.dms['halfAngleDeg']}`, `α ${engine.dms['includedAngleDeg']}, TPF ${engine.values['taperPerFoot']} in/ft`, 'h1 -8 mm', 'h2 76 mm']));
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
    it('should name the wear blocks of a stack as the answer does, a wear block at each end, sizes from the blocks', () => {
      // 2.1 in between two 0.050 wear blocks of the 81-piece set (derived: 2.000 in left for the set's own blocks).
      const inputs = { unit: 'in', target: '2.1', set: 'inch-81', missing: '', wearBlocks: '0.050', grade: '', temperature: '' };
      const results = setupResults('gauge-blocks', inputs);
      if (!results.ok) throw new Error(results.error);
      const drawn = sketchFor('gauge-blocks', inputs, results)!.shapes.filter((s) => s.style === 'block');
      expect(drawn.map((s) => s.label)).toEqual(results.value['labels']);
      expect([drawn[0]?.label, drawn.at(-1)?.label]).toEqual(['0.050 wear', '0.050 wear']);
      // Drawn bottom first, each block as high as its size (or the least drawn height), from `blocks`.
      const heights = drawn.map((s) => (s.points[2]?.y ?? 0) - (s.points[0]?.y ?? 0));
      expect(heights[1]).toBeGreaterThan(heights[0]!);
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
