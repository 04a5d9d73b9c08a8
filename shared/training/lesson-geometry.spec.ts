import { arcPath, dovetailScene, latheTaperScene, pointsAttr, sineBarScene, stackBlocks, taperTriangle } from './lesson-geometry';

const dist = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);

describe('taperTriangle', () => {
  it('should make a level cut: the taper start and the cut end corner at one height', () => {
    for (const angle of [3, 7.5, 15, 30]) {
      const t = taperTriangle(angle);
      expect(t.corner.far.y).toBeCloseTo(t.corner.angle.y, 1);
      expect(t.cutY).toBe(t.corner.angle.y);
    }
  });

  it('should keep a right angle at the corner between the top face and the end', () => {
    const { angle, right, far } = taperTriangle(12).corner;
    const ux = right.x - angle.x;
    const uy = right.y - angle.y;
    const vx = far.x - right.x;
    const vy = far.y - right.y;
    expect(Math.abs(ux * vx + uy * vy) / (Math.hypot(ux, uy) * Math.hypot(vx, vy))).toBeLessThan(1e-3);
  });

  it('should have opposite / adjacent = tan of the angle (derived)', () => {
    const { angle, right, far } = taperTriangle(10).corner;
    expect(dist(right, far) / dist(angle, right)).toBeCloseTo(Math.tan((10 * Math.PI) / 180), 3);
  });

  it('should clamp the angle into the drawable range', () => {
    expect(taperTriangle(-5).part).toEqual(taperTriangle(0.5).part);
    expect(taperTriangle(89).part).toEqual(taperTriangle(40).part);
  });
});

describe('sineBarScene', () => {
  it('should raise the roll by L · sin θ and keep the roll centres L apart', () => {
    const s = sineBarScene(30, 320);
    expect(s.stackHeight).toBeCloseTo(160, 2);
    expect(dist(s.rolls[0], s.rolls[1])).toBeCloseTo(320, 1);
    expect(s.stack[2]!.y).toBeCloseTo(s.rolls[1].y + s.rollRadius, 1);
  });

  it('should lie flat at 0°', () => {
    const s = sineBarScene(0);
    expect(s.stackHeight).toBe(0);
    expect(s.rolls[0].y).toBe(s.rolls[1].y);
  });
});

describe('stackBlocks', () => {
  it('should stack blocks from the plate up without gaps, thin blocks kept readable', () => {
    const blocks = stackBlocks(['3.000', '0.650', '0.124', '0.1003'], 40);
    expect(blocks[0]!.y + blocks[0]!.height).toBe(280);
    for (let i = 1; i < blocks.length; i++) expect(blocks[i]!.y + blocks[i]!.height).toBeCloseTo(blocks[i - 1]!.y, 5);
    expect(blocks[0]!.height).toBe(120);
    expect(blocks[3]!.height).toBe(18);
    expect(stackBlocks([], 40)).toEqual([]);
  });
});

describe('latheTaperScene', () => {
  it('should narrow toward the small end and grow steeper with the taper per foot', () => {
    const a = latheTaperScene(0.5);
    const b = latheTaperScene(1.5);
    expect(a.outline[1]!.y).toBeGreaterThan(a.outline[0]!.y);
    expect(b.drawnHalfAngle).toBeGreaterThan(a.drawnHalfAngle);
    expect(latheTaperScene(0).drawnHalfAngle).toBe(0);
  });
});

describe('dovetailScene', () => {
  it('should put each pin tangent to the base and to the flank', () => {
    const s = dovetailScene(60, 40);
    const [left] = s.pins;
    expect(230 - left.y).toBeCloseTo(s.pinRadius, 5);
    const [a, , , d] = s.outline;
    // Distance from the left pin centre to the left flank line (a → d).
    const nx = d!.y - a!.y;
    const ny = a!.x - d!.x;
    const distance = Math.abs((left.x - a!.x) * nx + (left.y - a!.y) * ny) / Math.hypot(nx, ny);
    expect(distance).toBeCloseTo(s.pinRadius, 1);
  });

  it('should read wider over the pins than the sharp-corner width by D(1 + cot α/2) (Machinery\'s Handbook, derived)', () => {
    const s = dovetailScene(60, 40);
    const over = s.measure[1].x - s.measure[0].x;
    const width = s.width[1].x - s.width[0].x;
    expect(over - width).toBeCloseTo(40 * (1 + 1 / Math.tan(Math.PI / 6)), 1);
  });
});

describe('arcPath and pointsAttr', () => {
  it('should write SVG path and points text', () => {
    expect(arcPath({ x: 0, y: 0 }, 10, 0, 90)).toBe('M10,0 A10,10 0 0 0 0,-10');
    expect(pointsAttr([{ x: 1, y: 2 }, { x: 3, y: 4 }])).toBe('1,2 3,4');
  });
});
