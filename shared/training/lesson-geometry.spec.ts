import { angleFromPointer, arcPath, dovetailScene, latheTaperScene, pointsAttr, sineBarScene, snapAngle, stackBlocks, taperTriangle, toViewPoint } from './lesson-geometry';

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
    // The 3.000 block gives up what the thin ones gain: still the tallest by far.
    expect(blocks[0]!.height).toBeGreaterThan(90);
    expect(blocks[3]!.height).toBe(18);
    expect(stackBlocks([], 40)).toEqual([]);
  });

  it('should stand two stacks of one length equally high, however many thin blocks each has', () => {
    // Two stacks of 3.2119 in (3.000 + 0.111 + 0.1009 and 2.000 + 1.000 + 0.111 + 0.1009): one height, the true one.
    const height = (sizes: string[]) => 280 - stackBlocks(sizes, 40)[sizes.length - 1]!.y;
    expect(height(['3.000', '0.111', '0.1009'])).toBeCloseTo(3.2119 * 40, 1);
    expect(height(['2.000', '1.000', '0.111', '0.1009'])).toBeCloseTo(3.2119 * 40, 1);
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

  it('should keep growing steeper up to 3 in/ft, saying how much steeper than true it is drawn', () => {
    // True half angle = atan(TPF / 24) (Machinery's Handbook, tapers): 1 in/ft 2.3859°, 3 in/ft 7.1250°.
    const scenes = [0.5, 1, 1.5, 2, 2.5, 3].map((tpf) => latheTaperScene(tpf));
    for (let i = 1; i < scenes.length; i++) expect(scenes[i]!.drawnHalfAngle).toBeGreaterThan(scenes[i - 1]!.drawnHalfAngle);
    for (const [tpf, s] of [[0.5, scenes[0]!], [3, scenes[5]!]] as const) {
      const trueHalf = (Math.atan(tpf / 24) * 180) / Math.PI;
      expect(s.exaggeration).toBeGreaterThan(1);
      // The factor said is the drawn angle over the true one, to a tenth.
      expect(Math.abs(s.drawnHalfAngle / trueHalf - s.exaggeration)).toBeLessThanOrEqual(0.06);
    }
    expect(scenes[0]!.exaggeration).toBeGreaterThan(3.5);
    expect(scenes[5]!.exaggeration).toBeLessThan(2);
  });

  it('should draw the α/2 arc at the large end between the top line and the flank', () => {
    const s = latheTaperScene(2);
    const [, , x, y] = /^M([\d.-]+),([\d.-]+) A[\d.]+,[\d.]+ 0 0 1 ([\d.-]+),([\d.-]+)$/.exec(s.arc)!.slice(1).map(Number) as [number, number, number, number];
    const start = /^M([\d.-]+),([\d.-]+)/.exec(s.arc)!.slice(1).map(Number) as [number, number];
    // It starts on the top line (right of the corner) and ends on the flank, below the top line.
    expect(start[1]).toBeCloseTo(s.outline[0]!.y, 5);
    expect(start[0]).toBeGreaterThan(s.outline[0]!.x);
    const slope = (s.outline[1]!.y - s.outline[0]!.y) / (s.outline[1]!.x - s.outline[0]!.x);
    expect(y - s.outline[0]!.y).toBeCloseTo(slope * (x - s.outline[0]!.x), 1);
    expect(y).toBeGreaterThan(s.outline[0]!.y);
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

  it('should keep the dovetail and its pins inside the view over the whole slider range (40–70°)', () => {
    for (let a = 40; a <= 70; a += 1) {
      const s = dovetailScene(a);
      for (const p of [...s.outline, ...s.measure]) {
        expect(p.x).toBeGreaterThanOrEqual(0);
        expect(p.x).toBeLessThanOrEqual(480);
        expect(p.y).toBeGreaterThanOrEqual(0);
        expect(p.y).toBeLessThanOrEqual(300);
      }
      for (const c of s.pins) {
        expect(c.x - s.pinRadius).toBeGreaterThanOrEqual(0);
        expect(c.x + s.pinRadius).toBeLessThanOrEqual(480);
      }
    }
  });

  it('should draw the α arc from the base line round to the flank, clear of the pin (derived: the pin centre is r / sin(α/2) from the corner)', () => {
    for (const a of [40, 55, 70]) {
      const s = dovetailScene(a);
      const corner = s.outline[1]!;
      const m = /^M([-\d.e]+),([-\d.e]+) A([-\d.e]+),[-\d.e]+ 0 0 0 ([-\d.e]+),([-\d.e]+)$/.exec(s.arc);
      expect(m).not.toBeNull();
      const [sx, sy, radius, ex, ey] = m!.slice(1).map(Number) as [number, number, number, number, number];
      // Starts on the base line to the right of the corner (where the pin sits) …
      // (the path's numbers are rounded to 0.01 view units)
      expect(sy).toBeCloseTo(corner.y, 2);
      expect(sx - corner.x).toBeCloseTo(radius, 1);
      // … and ends on the flank: the direction from the corner to the flank's top corner.
      const top = s.outline[2]!;
      const flank = Math.atan2(corner.y - top.y, top.x - corner.x);
      expect(Math.atan2(corner.y - ey, ex - corner.x)).toBeCloseTo(flank, 3);
      expect(flank).toBeCloseTo((a * Math.PI) / 180, 3);
      // The arc stays between the corner and the pin.
      const pin = s.pins[1];
      expect(radius).toBeLessThan(Math.hypot(pin.x - corner.x, pin.y - corner.y) - s.pinRadius);
    }
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

describe('angle grips', () => {
  const TAPER = { min: 1, max: 30, step: 0.5 };
  const SINE = { min: 0, max: 60, step: 0.5 };
  const DOVETAIL = { min: 40, max: 70, step: 1 };
  /** A point `r` view units from `v` at `deg` counter-clockwise on screen (y grows downward). */
  const at = (v: { x: number; y: number }, deg: number, r = 120) => ({ x: v.x + r * Math.cos((deg * Math.PI) / 180), y: v.y - r * Math.sin((deg * Math.PI) / 180) });

  it('should keep each grip vertex put while the angle changes', () => {
    expect(taperTriangle(5).grip.vertex).toEqual(taperTriangle(25).grip.vertex);
    expect(sineBarScene(5).grip.vertex).toEqual(sineBarScene(50).grip.vertex);
    expect(dovetailScene(40).grip.vertex).toEqual(dovetailScene(70).grip.vertex);
  });

  it('should put the handles on the moving arms: the top face end, the raised roll, the flank', () => {
    const t = taperTriangle(12);
    expect(t.grip.handle).toEqual(t.corner.right);
    const s = sineBarScene(20);
    expect(s.grip.handle).toEqual(s.rolls[1]);
    const d = dovetailScene(55);
    const [, corner, top] = d.outline;
    expect(d.grip.vertex).toEqual(corner);
    // On the flank: the handle, the flank's corner and its top end are in line.
    const cross = (d.grip.handle.x - corner!.x) * (top!.y - corner!.y) - (d.grip.handle.y - corner!.y) * (top!.x - corner!.x);
    expect(Math.abs(cross) / dist(corner!, top!)).toBeLessThan(0.05);
  });

  it('should keep every handle inside the view box over the slider range', () => {
    for (const g of [taperTriangle(1).grip, taperTriangle(30).grip, sineBarScene(0).grip, sineBarScene(60).grip, dovetailScene(40).grip, dovetailScene(70).grip]) {
      expect(g.handle.x).toBeGreaterThanOrEqual(18);
      expect(g.handle.x).toBeLessThanOrEqual(480 - 18);
      expect(g.handle.y).toBeGreaterThanOrEqual(18);
      expect(g.handle.y).toBeLessThanOrEqual(300 - 18);
    }
  });

  describe('angleFromPointer', () => {
    it("should map each handle's own position back to the value it was drawn for", () => {
      for (const v of [1, 7.5, 18, 30]) expect(angleFromPointer(taperTriangle(v).grip.handle, taperTriangle(v).grip, 99, TAPER)).toBe(v);
      for (const v of [0, 14.5, 45, 60]) expect(angleFromPointer(sineBarScene(v).grip.handle, sineBarScene(v).grip, 99, SINE)).toBe(v);
      for (const v of [40, 55, 60, 70]) expect(angleFromPointer(dovetailScene(v).grip.handle, dovetailScene(v).grip, 99, DOVETAIL)).toBe(v);
    });

    it('should read 30° and 45° from points at those angles about the vertex (derived: direction = atan2)', () => {
      const g = sineBarScene(10).grip;
      expect(angleFromPointer(at(g.vertex, 30), g, 10, SINE)).toBe(30);
      expect(angleFromPointer(at(g.vertex, 45, 17), g, 10, SINE)).toBe(45);
      // Up is a smaller y in SVG: 100 right and 100 up is (x + 100, y − 100), at 45°.
      expect(angleFromPointer({ x: g.vertex.x + 100, y: g.vertex.y - 100 }, g, 10, SINE)).toBe(45);
      const d = dovetailScene(60).grip;
      expect(angleFromPointer(at(d.vertex, 45), d, 60, DOVETAIL)).toBe(45);
    });

    it('should take off the handle offset on the taper, where the handle is not on the level arm', () => {
      const g = taperTriangle(7.5).grip;
      expect(g.offsetDeg).toBeCloseTo((Math.atan2(70, 300) * 180) / Math.PI, 6);
      expect(angleFromPointer(at(g.vertex, 20 + g.offsetDeg), g, 7.5, TAPER)).toBe(20);
    });

    it('should clamp below the minimum and above the maximum, the nearer end winning past either', () => {
      const g = sineBarScene(10).grip;
      expect(angleFromPointer(at(g.vertex, -20), g, 10, SINE)).toBe(0);
      expect(angleFromPointer(at(g.vertex, 80), g, 10, SINE)).toBe(60);
      expect(angleFromPointer(at(g.vertex, 200), g, 10, SINE)).toBe(60);
      expect(angleFromPointer(at(g.vertex, 250), g, 10, SINE)).toBe(0);
      const d = dovetailScene(60).grip;
      expect(angleFromPointer(at(d.vertex, 10), d, 60, DOVETAIL)).toBe(40);
      expect(angleFromPointer(at(d.vertex, 120), d, 60, DOVETAIL)).toBe(70);
    });

    it('should round to the step', () => {
      const g = sineBarScene(10).grip;
      expect(angleFromPointer(at(g.vertex, 14.3), g, 10, SINE)).toBe(14.5);
      expect(angleFromPointer(at(g.vertex, 14.2), g, 10, SINE)).toBe(14);
      const d = dovetailScene(60).grip;
      expect(angleFromPointer(at(d.vertex, 52.6), d, 60, DOVETAIL)).toBe(53);
    });

    it('should keep the current value for a pointer on the vertex or with no position', () => {
      const g = sineBarScene(10).grip;
      expect(angleFromPointer({ ...g.vertex }, g, 14.5, SINE)).toBe(14.5);
      expect(angleFromPointer({ x: Number.NaN, y: 3 }, g, 14.5, SINE)).toBe(14.5);
    });
  });

  describe('snapAngle', () => {
    it('should round to the nearest step from the minimum and stay in range', () => {
      expect(snapAngle(7.74, TAPER)).toBe(7.5);
      expect(snapAngle(7.75, TAPER)).toBe(8);
      expect(snapAngle(0.2, TAPER)).toBe(1);
      expect(snapAngle(31, TAPER)).toBe(30);
      expect(snapAngle(0.1 + 0.2, { min: 0, max: 1, step: 0.1 })).toBe(0.3);
      expect(snapAngle(Number.NaN, TAPER)).toBe(1);
    });
  });

  describe('toViewPoint', () => {
    it('should apply the inverse screen matrix (scale 2, shifted by 10, 20)', () => {
      expect(toViewPoint({ a: 0.5, b: 0, c: 0, d: 0.5, e: -5, f: -10 }, 110, 220)).toEqual({ x: 50, y: 100 });
    });
  });
});
