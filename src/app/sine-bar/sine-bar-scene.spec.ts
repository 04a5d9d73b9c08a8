import { type SineBarSceneInput, sineBarScene } from './sine-bar-scene';

/** Numbers out of an "M x,y" path start. */
function start(d: string): { x: number; y: number } {
  const m = /^M(-?[\d.]+),(-?[\d.]+)/.exec(d);
  if (!m) throw new Error(`no start in ${d}`);
  return { x: Number(m[1]), y: Number(m[2]) };
}

/** Every "x,y" pair of a polygon path. */
function corners(d: string): { x: number; y: number }[] {
  return [...d.matchAll(/(-?[\d.]+),(-?[\d.]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
}

// A 5 in bar at 30°: H = L·sin θ = 2.5 in (REFERENCE.md §2, derived), built as 2.000 + 0.500.
const INPUT: SineBarSceneInput = {
  barLength: 5,
  angleDeg: 30,
  stackHeight: 2.5,
  blocks: [{ size: 2, label: '2.000' }, { size: 0.5, label: '0.500' }],
  labels: { barLength: '5.0000 in', stackHeight: '2.5000 in', angle: '30°00\'00"' },
};

describe('sineBarScene', () => {
  const scene = sineBarScene(INPUT, 640);
  const [low, high] = scene.rolls;
  // The bar runs 5 + 2·0.6 = 6.2 in and rises 0.8 in thick: its outline gives the scale back.
  const scale = low.r / 0.4;

  it('should set the roll centres L apart along the bar at θ', () => {
    expect(high.cx - low.cx).toBeCloseTo(5 * Math.cos(Math.PI / 6) * scale, 1);
    expect(low.cy - high.cy).toBeCloseTo(2.5 * scale, 1);
  });

  it('should rest the low roll on the plate and the high roll on the top block', () => {
    const plateTop = corners(scene.plate)[3].y;
    expect(low.cy + low.r).toBeCloseTo(plateTop, 1);
    const topBlock = corners(scene.blocks[1].d);
    expect(high.cy + high.r).toBeCloseTo(topBlock[2].y, 1);
  });

  it('should draw each block to scale, bottom first, under the high roll', () => {
    const bottom = corners(scene.blocks[0].d);
    const top = corners(scene.blocks[1].d);
    expect(bottom[0].y - bottom[2].y).toBeCloseTo(2 * scale, 1);
    expect(top[0].y - top[2].y).toBeCloseTo(0.5 * scale, 1);
    expect((bottom[0].x + bottom[1].x) / 2).toBeCloseTo(high.cx, 1);
    expect(scene.blocks.map((b) => b.label)).toEqual(['2.000', '0.500']);
  });

  it('should keep the block labels at least one line apart, top block highest', () => {
    const thin = sineBarScene({ ...INPUT, blocks: [{ size: 2.4, label: '2.400' }, { size: 0.05, label: '0.050' }, { size: 0.05, label: '0.050' }] }, 640);
    const ys = thin.blocks.map((b) => b.labelY);
    expect(ys[1] - ys[2]).toBeGreaterThanOrEqual(16);
    expect(ys[0] - ys[1]).toBeGreaterThanOrEqual(16);
  });

  it('should keep the top block label clear of the stack height\'s top extension line', () => {
    const thin = sineBarScene({ ...INPUT, blocks: [{ size: 2.45, label: '2.450' }, { size: 0.05, label: '0.050' }] }, 640);
    const topLine = corners(thin.heightDim?.extensionLines ?? '').map((p) => p.y);
    const top = Math.min(...topLine);
    // 13-unit figures drawn 4 below their point reach 0.7·13 − 4 = 5.1 above it.
    expect(thin.blocks[1].labelY - 5.1).toBeGreaterThan(top);
  });

  it('should close four labels up a little to keep them between the stack\'s top and bottom lines', () => {
    // 1.2519 in = 1.000 + 0.101 + 0.1009 + 0.050 at 14.5°: a short stack for four labels.
    // At 548 units wide (the page beside its form) the stack is about 56 units tall.
    const four = sineBarScene({ ...INPUT, angleDeg: 14.4775, stackHeight: 1.2519, blocks: [1, 0.101, 0.1009, 0.05].map((size) => ({ size, label: String(size) })) }, 548);
    const lines = corners(four.heightDim?.extensionLines ?? '').map((p) => p.y);
    const ys = four.blocks.map((b) => b.labelY);
    // Figures 13 units high with the baseline 4 below the point reach 5.1 above it and 4 below it.
    expect(Math.min(...ys) - 5.1).toBeGreaterThan(Math.min(...lines));
    expect(Math.max(...ys) + 4).toBeLessThan(Math.max(...lines));
    for (let i = 1; i < ys.length; i += 1) expect(ys[i - 1] - ys[i]).toBeGreaterThanOrEqual(13 - 0.01);
  });

  it('should dimension L along the bar and H beside the stack', () => {
    expect(scene.lengthDim.label).toMatchObject({ text: '5.0000 in', rotate: -30 });
    expect(scene.heightDim?.label).toMatchObject({ text: '2.5000 in', rotate: -90 });
    const hLine = corners(scene.heightDim?.line ?? '');
    expect(hLine[1].y - hLine[0].y).toBeCloseTo(2.5 * scale, 1);
  });

  it('should mark θ from the level at the low roll', () => {
    expect(start(scene.angleArc.arc).y).toBeCloseTo(low.cy, 2);
    expect(scene.angleArc.label.text).toBe('30°00\'00"');
  });

  it('should draw one plain stack when no blocks are given', () => {
    const plain = sineBarScene({ ...INPUT, blocks: [] }, 640);
    expect(plain.blocks.map((b) => b.label)).toEqual(['2.5000 in']);
  });

  it('should leave the stack out at 0°', () => {
    const flat = sineBarScene({ ...INPUT, angleDeg: 0, stackHeight: 0, blocks: [] }, 640);
    expect(flat.blocks).toEqual([]);
    expect(flat.heightDim).toBeNull();
  });
});
