import { type TaperSceneInput, taperScene } from './taper-scene';

/**
 * A 3-4-5 set-up so every point is exact by hand (derived): tan α = 3/4 (α = 36.8699°,
 * sin α = 0.6, cos α = 0.8), T = 2, L = 2, d = L·tan α = 1.5, part 4 long, Ø0.5 cutter.
 * Tilted points (x·0.8 − y·0.6, x·0.6 + y·0.8): touch-off corner (4,2) → (2, 4); face ends
 * (2,2) → (0.4, 2.8) and (4,0.5) → (2.9, 2.8); depth to stop 4 − 2.8 = 1.2 = L·sin α.
 * Model bounds x −1.52…3.52, y −1.2…6.6 fit 640 wide with margins 64 (left) and 120 (right):
 * scale 128/3 (height-bound), view height 460.8, view x = 184.48 + (x + 1.52)·128/3 (centred in
 * 456), view y = 396.8 − (y + 1.2)·128/3.
 */
const INPUT: TaperSceneInput = {
  thickness: 2,
  taperLength: 2,
  removedAtEnd: 1.5,
  angleDeg: (Math.atan(0.75) * 180) / Math.PI,
  partLength: 4,
  cutterDiameter: 0.5,
  readings: [0.5, 1.0, 1.2],
  selectedPass: 2,
  labels: { depthToStop: '1.2000 in', faceLength: '2.5000 in', endThickness: '0.5000 in', angle: '36°52\'12"', cutter: 'Ø0.5 in cutter' },
};

describe('taperScene', () => {
  const scene = taperScene(INPUT, 640);

  it('should fit the set-up to scale in the view box', () => {
    expect(scene.viewBox).toBe('0 0 640 460.8');
  });

  it('should put the touch-off point on the highest corner', () => {
    expect(scene.touchOff).toEqual({ x: 334.67, y: 174.93 });
    expect(scene.touchOffLabel.text).toBe('Touch off');
  });

  it('should draw the stop level along the taper face, which the tilt makes level', () => {
    expect(scene.stopLevel).toBe('M266.4,226.13L373.07,226.13');
  });

  it('should dimension the depth to stop from the touch-off level to the stop level, right of the part', () => {
    // 1.2 model units × 128/3 = 51.2 view units; offset = (385.87 − 373.07) + 84.
    expect(scene.depthDim.line).toBe('M469.87,174.93L469.87,226.13');
    expect(scene.depthDim.label.text).toBe('1.2000 in');
    expect(scene.depthDim.label.rotate).toBe(-90);
  });

  it('should give the face length as an aligned dimension above the face', () => {
    // Offset = depth 51.2 + 30 = 81.2 above the face.
    expect(scene.faceDim.line).toBe('M266.4,144.93L373.07,144.93');
    expect(scene.faceDim.label.rotate).toBe(0);
  });

  it('should dimension the end thickness along the tilted end face', () => {
    // The end runs from (2.9, 2.8) down to (3.2, 2.4): views (373.07, 226.13) and (385.87, 243.2).
    expect(scene.endDim?.label.text).toBe('0.5000 in');
    // Text turns along (12.8, 17.07): atan(17.07 / 12.8) = 53.14° from the rounded view points
    // (53.13° = 90° − α exactly, off by the 0.01 rounding of the view coordinates).
    expect(scene.endDim?.label.rotate).toBe(53.14);
    // The text stands clear of the dimension line by more than the extension lines run past it (5),
    // so a short end dimension's text is not crossed by them.
    const [x1, y1, x2, y2] = (scene.endDim?.line.match(/-?\d+(\.\d+)?/g) ?? []).map(Number) as [number, number, number, number];
    const { x, y } = scene.endDim!.label;
    const off = Math.abs((x2 - x1) * (y1 - y) - (x1 - x) * (y2 - y1)) / Math.hypot(x2 - x1, y2 - y1);
    expect(off).toBeGreaterThanOrEqual(9 - 0.02);
  });

  it('should split the material at the shown pass and label that pass', () => {
    // Pass 2 reads 1.0 below touch-off: level y = 3.0 crosses the triangle at x = 0.6667 and 2.75.
    expect(scene.passLines.map((p) => p.selected)).toEqual([false, true, false]);
    expect(scene.passLines[1].d).toBe('M277.78,217.6L366.67,217.6');
    expect(scene.passLines[2].d).toBe('M266.4,226.13L373.07,226.13');
    expect(scene.passLabel).toEqual({ x: 277.78, y: 217.6, rotate: 0, text: 'Pass 2' });
    expect(scene.removed).not.toBe('');
    expect(scene.toRemoveHatch).not.toBe('');
  });

  it('should mark the tilt angle from the level at the block\'s low end', () => {
    // Origin (0,0) → (249.33, 345.6); radius 0.3·3.2·128/3 = 40.96.
    expect(scene.angleArc.arc.startsWith('M290.29,345.6A40.96,40.96,0,0,0,')).toBe(true);
    expect(scene.angleArc.label.text).toBe('36°52\'12"');
  });

  it('should show the whole cut as still to remove when no pass is chosen', () => {
    const whole = taperScene({ ...INPUT, selectedPass: 0 }, 640);
    expect(whole.removed).toBe('');
    expect(whole.passLabel).toBeNull();
    expect(whole.toRemove).toBe('M266.4,226.13L334.67,174.93L373.07,226.13Z');
  });

  it('should leave out the end thickness for a taper that runs out to a knife edge', () => {
    expect(taperScene({ ...INPUT, removedAtEnd: 2 }, 640).endDim).toBeNull();
  });

  it('should scale with the width it is given, with narrower margins on a phone', () => {
    // 320 wide: margins 36 and 92, height-bound scale (230.4 − 72) / 7.8 = 20.3077; the model is
    // centred in 320 − 128 = 192: x of the touch-off corner = 36 + (192 − 5.04·20.3077)/2 + 3.52·20.3077.
    const narrow = taperScene(INPUT, 320);
    expect(narrow.viewBox).toBe('0 0 320 230.4');
    expect(narrow.touchOff.x).toBe(152.31);
  });
});

describe('taperScene work-holding', () => {
  // The demo wedge: 0.75 in stock, 7°30′ over 2.5 in of a 4 in part, d = 2.5 · tan 7.5° = 0.32913 (derived).
  const DEMO: TaperSceneInput = {
    thickness: 0.75,
    taperLength: 2.5,
    removedAtEnd: 0.32913,
    angleDeg: 7.5,
    partLength: 4,
    cutterDiameter: 0.75,
    readings: [0.1, 0.2, 0.3, 0.3263],
    selectedPass: 2,
    labels: { depthToStop: '0.3263 in', faceLength: '2.5216 in', endThickness: '0.4209 in', angle: '7°30\'00"', cutter: 'Ø0.75 in cutter', cutterShort: 'Ø0.75 in' },
  };
  const MM: TaperSceneInput = {
    ...DEMO,
    labels: { depthToStop: '8.288 mm', faceLength: '64.049 mm', endThickness: '10.690 mm', angle: '7°30\'00"', cutter: 'Ø19.05 mm cutter', cutterShort: 'Ø19.05 mm' },
  };
  const sinePlate = { kind: 'sine-plate' as const, plateLength: 5, blocks: [{ size: 0.45, label: '0.450' }, { size: 0.102, label: '0.102' }, { size: 0.1006, label: '0.1006' }], stackLabel: '0.6526 in stack' };
  // A stack the chosen set cannot make: one outline of the height needed, said in its label.
  const unmakeable = { kind: 'sine-plate' as const, plateLength: 5, blocks: [{ size: 0.6526, label: '0.6526' }], stackLabel: '0.6526 in: not in set', unmakeable: true };
  const holdings = [
    { kind: 'angle-block' as const, blocks: ['5°', '+3°', "−30'"] },
    sinePlate,
    { kind: 'tilted-vise' as const },
    unmakeable,
  ];

  // Drawing widths of a 360–390 px phone (328–358), a tablet (520, 720) and a desktop (960).
  for (const h of holdings) {
    for (const width of [328, 358, 520, 720, 960]) {
      for (const [unit, input] of [['in', DEMO], ['mm', MM]] as const) {
        it(`should keep every label clear of the others and inside the view: ${h.kind}, ${width} wide, ${unit}`, () => {
          const scene = taperScene({ ...input, holding: h }, width);
          const boxes = scene.labelBoxes;
          expect(boxes.length).toBeGreaterThanOrEqual(7);
          for (let i = 0; i < boxes.length; i++) {
            expect(boxes[i].minX).toBeGreaterThanOrEqual(0);
            expect(boxes[i].maxX).toBeLessThanOrEqual(scene.width);
            expect(boxes[i].minY).toBeGreaterThanOrEqual(0);
            expect(boxes[i].maxY).toBeLessThanOrEqual(scene.height);
            for (let j = i + 1; j < boxes.length; j++) {
              const apart = boxes[i].maxX <= boxes[j].minX || boxes[j].maxX <= boxes[i].minX || boxes[i].maxY <= boxes[j].minY || boxes[j].maxY <= boxes[i].minY;
              expect({ i, j, apart }).toEqual({ i, j, apart: true });
            }
          }
        });
      }
    }
  }

  it('should split the angle block into the wrung blocks and name them', () => {
    const scene = taperScene({ ...DEMO, holding: holdings[0] }, 640);
    expect(scene.fixtureLines.match(/M/g)?.length).toBe(2);
    expect(scene.names.map((n) => n.text)).toEqual(['Ø0.75 in cutter', "angle blocks 5° +3° −30'", 'vise']);
    expect(scene.fixture.map((f) => f.kind)).toEqual(['vise-jaw', 'vise-base', 'block']);
  });

  it('should stand the sine plate on its hinge roll and on the stack, the rolls L apart at the taper angle', () => {
    const scene = taperScene({ ...DEMO, holding: sinePlate }, 640);
    const [hinge, free] = scene.rolls;
    // Roll radius is 0.07 L, which gives the scale back.
    const scale = hinge.r / (0.07 * 5);
    expect(Math.hypot(free.cx - hinge.cx, free.cy - hinge.cy)).toBeCloseTo(5 * scale, 0);
    // H = L · sin α = 5 · sin 7.5° = 0.65263 (REFERENCE.md §2.1, derived).
    expect((hinge.cy - free.cy) / scale).toBeCloseTo(0.65263, 2);
    const gauges = scene.fixture.filter((f) => f.kind.startsWith('gauge'));
    expect(gauges.length).toBe(3);
    const topOfStack = Math.min(...[...gauges[2].d.matchAll(/,(-?[\d.]+)/g)].map((m) => Number(m[1])));
    expect(topOfStack).toBeCloseTo(free.cy + free.r, 0);
    expect(scene.names.map((n) => n.text)).toEqual(expect.arrayContaining(['hinge roll', '0.6526 in stack', 'sine plate']));
  });

  it('should draw a stack the set cannot make as one dashed outline of the height needed, not as blocks', () => {
    const scene = taperScene({ ...DEMO, holding: unmakeable }, 640);
    expect(scene.fixture.filter((f) => f.kind.startsWith('gauge')).map((f) => f.kind)).toEqual(['gauge missing']);
    expect(scene.names.map((n) => n.text)).toContain('0.6526 in: not in set');
  });

  it('should tilt the vise body over its base with a marked scale and an index at the setting', () => {
    const scene = taperScene({ ...DEMO, holding: { kind: 'tilted-vise' } }, 640);
    expect(scene.fixture.map((f) => f.kind)).toEqual(['vise-base', 'vise-jaw', 'vise-body', 'scale']);
    // Marks every 5° from 0° to 7.5° + 12° = 19.5°: 0, 5, 10, 15, then the index line.
    expect(scene.fixtureLines.match(/M/g)?.length).toBe(5);
    expect(scene.rolls.length).toBe(1);
    expect(scene.names.map((n) => n.text)).toContain('tilting vise');
  });
});
