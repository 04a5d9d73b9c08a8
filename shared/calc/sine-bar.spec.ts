import fc from 'fast-check';
import { Dec } from './decimal-math';
import { resolveBox, type GaugeBox } from './gauge-stack';
import { calculateCompoundSinePlate, calculateSineBar, calculateSineTable, compoundStackBlocks, type SineBarResult } from './sine-bar';
import type { CalcResult } from './step';

function value<T>(r: CalcResult<T>): T {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}
const bar = (input: Record<string, unknown>): SineBarResult => value(calculateSineBar(input));

describe('calculateSineBar', () => {
  describe('published stack heights (REFERENCE.md §2.2)', () => {
    it('should match US Army TC 9-524 App. C: 5 in bar, 23°41\' → 2.0084 in', () => {
      expect(bar({ unit: 'in', barLength: 5, angle: "23°41'" }).stackHeight).toBe('2.0084');
    });
    it('should match Walsh, Handbook of Machining and Metalworking Calculations ch. 4: 5 in, 34°25\' → 2.826 in', () => {
      expect(new Dec(bar({ unit: 'in', barLength: 5, angle: '34 25' }).stackHeight).toDecimalPlaces(3).toString()).toBe('2.826');
    });
    it("should match Machinery's Handbook 31 p. 695: 5 in, 12° → 1.03956 in and 9° → 0.78217 in", () => {
      expect(new Dec(bar({ unit: 'in', barLength: 5, angle: 12 }).exact.stackHeight).toDecimalPlaces(5).toString()).toBe('1.03956');
      expect(new Dec(bar({ unit: 'in', barLength: 5, angle: 9 }).exact.stackHeight).toDecimalPlaces(5).toString()).toBe('0.78217');
    });
    it("should match Machinery's Handbook 31 p. 695: 5 in, 28°38'1\" (6-1/8 in/ft) → 2.396 in", () => {
      expect(new Dec(bar({ unit: 'in', barLength: 5, angle: '28°38\'1"' }).stackHeight).toDecimalPlaces(3).toString()).toBe('2.396');
    });
    it('should match the "Jo Block Stacks" course text: 5 in, 60° → 4.3301 in', () => {
      expect(bar({ unit: 'in', barLength: 5, angle: 60 }).stackHeight).toBe('4.3301');
    });
    it('should round 13° on a 5 in bar to 1.1248 (reference.com prints the truncated 1.124; REFERENCE.md §2.2 #9)', () => {
      expect(bar({ unit: 'in', barLength: 5, angle: 13 }).stackHeight).toBe('1.1248');
    });
  });

  describe('published reverse examples (REFERENCE.md §2.2)', () => {
    it('should match Sparber, "The Theory and Practice of Using a Sine Bar": 5 in, H = 1 → 11.537°; H = 1.040 → 12.005°', () => {
      expect(new Dec(bar({ unit: 'in', barLength: 5, stackHeight: 1 }).angleDeg).toDecimalPlaces(3).toString()).toBe('11.537');
      expect(new Dec(bar({ unit: 'in', barLength: 5, stackHeight: '1.040' }).angleDeg).toDecimalPlaces(3).toString()).toBe('12.005');
    });
    it("should match Machinery's Handbook 31 p. 695: 5 in, H = 2.5939 → 31°15' (exact 31°15'01.6\")", () => {
      expect(bar({ unit: 'in', barLength: 5, stackHeight: '2.5939' }).achievedAngleDms).toBe('31°15\'01.6"');
    });
    it('should give 28.414° for a 60 mm bar on 28.55 mm (askfilo problem, answer derived)', () => {
      expect(new Dec(bar({ unit: 'mm', barLength: 60, stackHeight: '28.55' }).angleDeg).toDecimalPlaces(3).toString()).toBe('28.414');
    });
  });

  describe('derived table H = L·sin θ (REFERENCE.md §2.3)', () => {
    it.each([
      [2.5, 'in', 45, '1.7678'],
      [10, 'in', 15, '2.5882'],
      [100, 'mm', 20, '34.202'],
      [200, 'mm', 5, '17.431'],
      [200, 'mm', 60, '173.205'],
    ])('should give %s %s at %s° → %s (derived)', (L, unit, angle, H) => {
      expect(bar({ unit, barLength: L, angle }).stackHeight).toBe(H);
    });
    it('should give the reverse checks 10 in / 1.7365 → 10.0001° and 100 mm / 25.000 → 14.4775° (derived)', () => {
      expect(bar({ unit: 'in', barLength: 10, stackHeight: '1.7365' }).angleDeg).toBe('10.0001');
      expect(bar({ unit: 'mm', barLength: 100, stackHeight: 25 }).angleDeg).toBe('14.4775');
    });
  });

  describe('error and sensitivity', () => {
    it('should report the angle the rounded stack makes and its error in arc-seconds (derived)', () => {
      const r = bar({ unit: 'in', barLength: 5, angle: "23°41'" });
      // asin(2.0084 / 5) = 23.683245…° → −0.32″ (derived).
      expect(r.achievedAngleDeg).toBe('23.6832');
      expect(r.errorArcSec).toBe('-0.32');
    });
    it('should give the published sensitivity: +0.0001 in on a 5 in bar → 0.00132° at 30° and 0.00229° at 60° (homeshopmachinist thread, REFERENCE.md §2.4)', () => {
      expect(new Dec(bar({ unit: 'in', barLength: 5, angle: 30 }).sensitivityArcSec).div(3600).toDecimalPlaces(5).toString()).toBe('0.00132');
      expect(new Dec(bar({ unit: 'in', barLength: 5, angle: 60 }).sensitivityArcSec).div(3600).toDecimalPlaces(5).toString()).toBe('0.00229');
    });
    it('should say in the work that the sensitivity is taken at the angle the stack makes (derived)', () => {
      // 89° on a 5 in bar: H = 5 · sin 89° = 4.99924 → 4.9992 in; θ′ = asin(4.9992 / 5) = 88.97505° (88°58'30");
      // Δθ = 0.0001 / (5 · cos 88.97505°) rad = 230.62″ there (at the wanted 89° it would be 236.37″) — python3, derived.
      const steep = bar({ unit: 'in', barLength: 5, angle: 89 });
      const sens = steep.steps.find((st) => st.label === 'Sensitivity')!;
      expect([sens.formula, sens.substituted, sens.value]).toEqual(['Δθ = ΔH / (L · cos θ′)', 'Δθ = 0.0001 / (5.0000 · cos 88°58\'30")', '230.62']);
      expect(steep.steps.find((st) => st.label === 'Angle the stack makes')?.formula).toBe('θ′ = asin(H / L)');
      expect(steep.sensitivityArcSec).toBe('230.62');
      // From a typed stack the angle is θ itself, so the work says θ.
      const typed = bar({ unit: 'in', barLength: 5, stackHeight: '2.5' }).steps.find((st) => st.label === 'Sensitivity')!;
      expect([typed.formula, typed.substituted]).toEqual(['Δθ = ΔH / (L · cos θ)', 'Δθ = 0.0001 / (5.0000 · cos 30°00\'00")']);
    });
    it('should advise the complement above 45°', () => {
      expect(bar({ unit: 'in', barLength: 5, angle: 60 }).warnings.join(' ')).toMatch(/complement, 30°00'00"/);
      expect(bar({ unit: 'in', barLength: 5, angle: 30 }).warnings).toEqual([]);
    });
    it('should round to the set\'s 0.0005 mm step for metric-112', () => {
      const r = bar({ unit: 'mm', barLength: 100, angle: 10, set: 'metric-112' });
      expect(r.resolution).toBe('0.0005');
      expect(r.stackHeight).toBe('17.365');
    });
  });

  describe('angles smaller than one step of the stack', () => {
    const tiny = (r: { warnings: string[] }) => r.warnings.filter((w) => /smaller than one step/.test(w));
    it('should warn, naming the step in arc-seconds, when the bar lies flat (derived)', () => {
      // 2.5 in bar: 2.5 · sin 0.001° = 0.0000436 in → 0.0000; one 0.0001 in step makes asin(0.0001 / 2.5) = 8.25″ (python3, derived).
      const flat = bar({ unit: 'in', barLength: 2.5, angle: 0.001, set: 'inch-81' });
      expect([flat.stackHeight, flat.errorArcSec, flat.blocks]).toEqual(['0.0000', '-3.60', []]);
      expect(tiny(flat)).toEqual([
        'The angle asked for (0°00\'03.6") is smaller than one step of the stack: 0.0001 in on this 2.5000 in bar makes 8.25″, so the bar lies flat or on the smallest stack (0.0001 in) and the angle made is out by up to half that step.',
      ]);
    });
    it('should warn when the stack rounds up to its smallest step (derived)', () => {
      // 5 in bar: 5 · sin 0.001° = 0.0000873 in → 0.0001 in, which makes asin(0.0001 / 5) = 4.13″ (python3, derived): +0.53″.
      const one = bar({ unit: 'in', barLength: 5, angle: 0.001 });
      expect([one.stackHeight, one.errorArcSec]).toEqual(['0.0001', '0.53']);
      expect(tiny(one)).toHaveLength(1);
      expect(tiny(one)[0]).toContain('0.0001 in on this 5.0000 in bar makes 4.13″');
      // 100 mm bar, metric-112 (0.0005 mm step): asin(0.0005 / 100) = 1.03″ (derived).
      expect(tiny(bar({ unit: 'mm', barLength: 100, angle: '0°0\'1"', set: 'metric-112' }))[0]).toContain('0.0005 mm on this 100.000 mm bar makes 1.03″');
    });
    it('should not warn for a level bar, an angle of a step or more, or a typed stack', () => {
      expect(tiny(bar({ unit: 'in', barLength: 5, angle: 0 }))).toEqual([]);
      expect(tiny(bar({ unit: 'in', barLength: 5, angle: 0.01 }))).toEqual([]);
      expect(tiny(bar({ unit: 'in', barLength: 5, stackHeight: '0.0001' }))).toEqual([]);
    });
    it('should name the axis of a compound plate', () => {
      const r = value(calculateCompoundSinePlate({ unit: 'in', lengthA: 2.5, angleA: 10, angleB: 0.001 }));
      expect(tiny(r)).toHaveLength(1);
      expect(tiny(r)[0]).toMatch(/^Angle B \(0°00'03\.6"\) is smaller than one step of stack B: 0\.0001 in on this 2\.5000 in plate makes 8\.25″, so the plate lies flat/);
    });
  });

  describe('blocks for the stack', () => {
    it('should list the fewest inch-81 blocks for the TC 9-524 example (REFERENCE.md §3.5 G6: 4 blocks, derived)', () => {
      const r = bar({ unit: 'in', barLength: 5, angle: "23°41'", set: 'inch-81' });
      expect(r.blockCount).toBe(4);
      expect((r.blocks as string[]).reduce((a, b) => a.plus(b), new Dec(0)).toString()).toBe('2.0084');
      // The work counts the blocks; it does not write their sum as "= 4".
      const count = r.steps.find((st) => st.label === 'Fewest blocks')!;
      expect([count.substituted, count.value, count.unit]).toEqual([`n = count of (${(r.blocks as string[]).join(' + ')})`, '4', 'blocks']);
    });

    it('should say what to do with a stack the set cannot make: change the angle only when an angle was asked', () => {
      // 5 in · sin 0.01° = 0.00087 in → 0.0009 in (derived); the 81-piece set's thinnest block is 0.050 in.
      const forAngle = bar({ unit: 'in', barLength: 5, angle: 0.01, set: 'inch-81' });
      expect(forAngle.warnings).toContain('The box cannot make a 0.0009 in stack; raise both rolls on equal stacks and build the difference, or change the angle slightly.');
      const forStack = bar({ unit: 'in', barLength: 5, stackHeight: '0.0009', set: 'inch-81' });
      expect(forStack.warnings).toContain('The box cannot make a 0.0009 in stack; raise both rolls on equal stacks and build the difference.');
    });

    it('should question a typed stack finer than the gauge-block step', () => {
      // Inch gauge blocks step by 0.0001 in (REFERENCE.md §3.2): 0.00001 in cannot be built from them.
      expect(bar({ unit: 'in', barLength: 5, stackHeight: '0.00001' }).warnings).toContain('A 0.00001 in stack is finer than the gauge-block step (0.0001 in): check the stack as built.');
      expect(bar({ unit: 'in', barLength: 5, stackHeight: '1.2519' }).warnings).toEqual([]);
    });
  });

  it('should show the unrounded stack in the work to three places past the resolution, not thirty digits', () => {
    const r = bar({ unit: 'in', barLength: 5, angle: 14.5 });
    const unrounded = r.steps.find((st) => st.label === 'Stack height');
    // 5 · sin 14.5° = 1.2519000… (Math.sin, a reference library); the resolution 0.0001 in → 7 places.
    expect(unrounded?.value).toBe((5 * Math.sin((14.5 * Math.PI) / 180)).toFixed(7));
    expect(r.exact.stackHeight.length).toBeGreaterThan(20);
  });

  describe('unusual bar lengths (common practice: sine bars and plates of 2.5, 5 or 10 in, 100, 200 or 250 mm)', () => {
    const lengthWarning = (r: { warnings: string[] }) => r.warnings.filter((w) => /between the roll centres is unusual/.test(w));
    it.each([
      ['in', 2.5], ['in', 5], ['in', 10], ['mm', 100], ['mm', 200], ['mm', 250],
    ])('should take a %s bar of %s without a length warning', (unit, length) => {
      expect(lengthWarning(bar({ unit, barLength: length, angle: 10 }))).toEqual([]);
    });
    it.each([
      ['in', 125, '125.0000 in'], ['in', 0.5, '0.5000 in'], ['mm', 5, '5.000 mm'], ['mm', 1000, '1000.000 mm'],
    ])('should still answer a %s bar of %s but warn to check the unit and the length', (unit, length, shown) => {
      const warnings = lengthWarning(bar({ unit, barLength: length, angle: 10 }));
      expect(warnings).toHaveLength(1);
      expect(warnings[0]).toContain(`A bar with ${shown} between the roll centres`);
      expect(warnings[0]).toContain('Check the unit and the length.');
    });
    it('should name the plate of a compound sine plate whose length is unusual', () => {
      const same = value(calculateCompoundSinePlate({ unit: 'in', lengthA: 5, angleA: 10, angleB: 10 }));
      expect(same.warnings).toEqual([]);
      const upper = value(calculateCompoundSinePlate({ unit: 'in', lengthA: 5, lengthB: 127, angleA: 10, angleB: 10 }));
      expect(upper.warnings).toHaveLength(1);
      expect(upper.warnings[0]).toMatch(/^An upper plate with 127\.0000 in between the roll centres is unusual/);
    });
  });

  describe('invalid and impossible input', () => {
    it('should refuse a stack taller than the bar with 422-kind "impossible"', () => {
      const r = calculateSineBar({ unit: 'in', barLength: 5, stackHeight: 6 });
      expect(r.ok || r.kind).toBe('impossible');
      expect(r.ok || r.fields.stackHeight).toMatch(/taller than the bar/);
    });
    it('should refuse both or neither of angle and stackHeight, and angles of 90° or more', () => {
      expect(calculateSineBar({ unit: 'in', barLength: 5 }).ok).toBe(false);
      expect(calculateSineBar({ unit: 'in', barLength: 5, angle: 10, stackHeight: 1 }).ok).toBe(false);
      const r = calculateSineBar({ unit: 'in', barLength: 5, angle: 90 });
      expect(r.ok || r.kind).toBe('invalid');
    });
    it('should refuse a set in the other unit', () => {
      const r = calculateSineBar({ unit: 'in', barLength: 5, angle: 10, set: 'metric-112' });
      expect(r.ok || r.fields.set).toMatch(/in mm but the unit is in/);
    });
    it('should never throw (property)', () => {
      fc.assert(fc.property(fc.anything(), (x) => void expect(typeof calculateSineBar(x).ok).toBe('boolean')));
    });
  });

  describe('angle → stack → angle (property)', () => {
    it('should come back within one resolution step\'s worth of angle', () => {
      fc.assert(
        fc.property(fc.integer({ min: 1, max: 80 * 3600 }), fc.constantFrom(2.5, 5, 10), (seconds, L) => {
          const angle = new Dec(seconds).div(3600);
          const there = bar({ unit: 'in', barLength: L, angle: angle.toString() });
          const back = bar({ unit: 'in', barLength: L, stackHeight: there.stackHeight });
          const diff = new Dec(back.exact.angleDeg).minus(angle).abs().mul(3600);
          expect(diff.lte(new Dec(there.sensitivityArcSec).plus('0.01'))).toBe(true);
        }),
        { numRuns: 100 },
      );
    });
  });
});

describe('calculateSineTable', () => {
  it('should give 3601 rows for 0°–60° every 1′ with stacks that sum to the row height', () => {
    const t = value(calculateSineTable({ unit: 'in', barLength: 5, from: 0, to: 60, step: "0°1'", set: 'inch-81' }));
    expect(t.rows).toHaveLength(3601);
    expect(t.rows[3600].stackHeight).toBe('4.3301');
    for (const row of t.rows) {
      if (row.blocks) expect(row.blocks.reduce((a, b) => a.plus(b), new Dec(0)).eq(row.stackHeight)).toBe(true);
    }
  }, 30_000);

  it('should refuse a reversed range and too many rows', () => {
    expect(calculateSineTable({ unit: 'in', barLength: 5, from: 10, to: 5, step: 1 }).ok).toBe(false);
    const r = calculateSineTable({ unit: 'in', barLength: 5, from: 0, to: 60, step: '0.001' });
    expect(r.ok || r.fields.step).toMatch(/rows/);
  });
});

describe('calculateCompoundSinePlate', () => {
  it('should give each axis its own stack and the resultant tilt cos φ = cos θA·cos θB (derived)', () => {
    const r = value(calculateCompoundSinePlate({ unit: 'in', lengthA: 5, angleA: 30, angleB: 30 }));
    expect([r.axisA.stackHeight, r.axisB.stackHeight]).toEqual(['2.5000', '2.5000']);
    // acos(0.75) = 41.4096° (derived).
    expect(r.resultantTiltDeg).toBe('41.4096');
  });

  it('should turn two stacks into two angles', () => {
    const r = value(calculateCompoundSinePlate({ unit: 'in', lengthA: 5, stackA: '2.5', stackB: 1 }));
    expect(r.axisA.angleDeg).toBe('30.0000');
    expect(r.axisB.angleDeg).toBe('11.5370');
  });

  it('should name the axis in each steep-angle warning, so 60° on both axes gives two different ones', () => {
    const r = value(calculateCompoundSinePlate({ unit: 'in', lengthA: 5, angleA: 60, angleB: 60 }));
    expect(r.warnings).toHaveLength(2);
    expect(r.warnings[0]).toMatch(/^Angle A is above 45°.*complement of angle A, 30°00'00"/);
    expect(r.warnings[1]).toMatch(/^Angle B is above 45°.*complement of angle B, 30°00'00"/);
    expect(value(calculateCompoundSinePlate({ unit: 'in', lengthA: 5, angleA: 10, angleB: 60 })).warnings).toEqual([expect.stringMatching(/^Angle B is above 45°/)]);
  });
});

describe('compoundStackBlocks: both stacks from one box at once', () => {
  const box = (choice: Parameters<typeof resolveBox>[1]): GaugeBox => value(resolveBox('test', choice));
  const custom = (...sizes: string[]) => box({ blocks: sizes.map((s) => new Dec(s)), unit: 'in' });
  const sum = (blocks: readonly string[]) => blocks.reduce((t, b) => t.plus(b), new Dec(0)).toString();
  /** Every block used at most as often as the box holds it. */
  const fitsBox = (b: GaugeBox, used: readonly string[]) => {
    const left = b.pieces.map((p) => p.toString());
    return used.every((u) => {
      const at = left.findIndex((p) => new Dec(p).eq(u));
      if (at < 0) return false;
      left.splice(at, 1);
      return true;
    });
  };

  it('should build stack B from what stack A leaves in the 81-piece set (14°30\' on both axes)', () => {
    // 5 · sin 14.5° = 1.2519 in on each axis (derived); the set holds one block of each size.
    const inch81 = box({ set: 'inch-81' });
    const r = compoundStackBlocks(inch81, '1.2519', '1.2519', 'in');
    expect(r.warnings).toEqual([]);
    expect([sum(r.blocksA!), sum(r.blocksB!)]).toEqual(['1.2519', '1.2519']);
    expect(fitsBox(inch81, [...r.blocksA!, ...r.blocksB!])).toBe(true);
  });

  it('should build stack A from what stack B leaves when the other order fails', () => {
    // A 1.25 = 1 + 0.25 takes the only 1.000 that B needs; B first leaves 0.5 + 0.4 + 0.35 = 1.25 for A (by hand).
    const r = compoundStackBlocks(custom('1', '0.25', '0.5', '0.4', '0.35'), '1.25', '1', 'in');
    expect(r).toEqual({ blocksA: ['0.500', '0.400', '0.350'], blocksB: ['1.000'], warnings: [] });
  });

  it('should say plainly when the box can make each stack but not both at once, listing no shared block', () => {
    // Only the 0.1009 block gives the last digit 9 once 0.1001–0.1008 are missing; two stacks of 1.2519 need it twice (by hand).
    const missing = ['0.1001', '0.1002', '0.1003', '0.1004', '0.1005', '0.1006', '0.1007', '0.1008'].map((s) => new Dec(s));
    const r = compoundStackBlocks(box({ set: 'inch-81', missing }), '1.2519', '1.2519', 'in');
    expect(r.blocksA).toEqual(['1.000', '0.101', '0.1009', '0.050']);
    expect(r.blocksB).toBeNull();
    expect(r.warnings).toEqual([
      'The box cannot make both stacks at once: with stack A (1.2519 in) built from 1.000 + 0.101 + 0.1009 + 0.050, the blocks left cannot make stack B (1.2519 in), and building stack B first does not help either. Take the blocks for one of the stacks from a second set.',
    ]);
    expect(compoundStackBlocks(custom('1', '0.25', '0.5'), '1.25', '1.25', 'in').warnings[0]).toMatch(/^The box cannot make both stacks at once/);
  });

  it('should name a stack the box cannot make even alone, and need no block for a zero stack', () => {
    expect(compoundStackBlocks(custom('1', '0.25', '0.5'), '1.25', '0.3', 'in')).toEqual({ blocksA: ['1.000', '0.250'], blocksB: null, warnings: ['The box cannot make stack B (0.3 in).'] });
    expect(compoundStackBlocks(custom('1'), '0', '1', 'in')).toEqual({ blocksA: [], blocksB: ['1.000'], warnings: [] });
    expect(compoundStackBlocks(null, '0.5', '0', 'in')).toEqual({ blocksA: null, blocksB: [], warnings: ['The box cannot make stack A (0.5 in).'] });
  });
});
