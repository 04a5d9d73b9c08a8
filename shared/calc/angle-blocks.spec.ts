import fc from 'fast-check';
import { calculateAngleBlocks, nearestAngleCombination, type AngleBlocksResult } from './angle-blocks';
import type { CalcResult } from './step';

function value(r: CalcResult<AngleBlocksResult>): AngleBlocksResult {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}

/** Fewest signed blocks for an exact target by trying all 3ⁿ assignments. */
function bruteForce(blocks: number[], target: number): number | null {
  let best: number | null = null;
  for (let code = 0; code < 3 ** blocks.length; code++) {
    let rest = code;
    let sum = 0;
    let count = 0;
    for (const b of blocks) {
      const d = rest % 3;
      rest = (rest - d) / 3;
      if (d === 1) sum += b;
      if (d === 2) sum -= b;
      if (d) count++;
    }
    if (sum === target && (best === null || count < best)) best = count;
  }
  return best;
}

describe('calculateAngleBlocks', () => {
  it("should make 17°35' with the 13-piece set in fewer than the 6 blocks of REFERENCE.md §6 (derived)", () => {
    const r = value(calculateAngleBlocks({ set: 'angle-13-npl', angle: "17°35'" }));
    expect(r.exact).toBe(true);
    expect(r.achievedAngleDms).toBe('17°35\'00"');
    expect(r.count).toBeLessThanOrEqual(6);
    expect(r.count).toBe(5);
  });

  it("should make 17°35' with the 16-piece set in at most 5 blocks (REFERENCE.md §6, derived)", () => {
    const r = value(calculateAngleBlocks({ set: 'angle-16', angle: "17°35'" }));
    expect(r.count).toBeLessThanOrEqual(5);
    expect(r.achievedAngleDms).toBe('17°35\'00"');
  });

  it('should make 2° as 3° − 1° or 5° − 3° with 2 blocks (REFERENCE.md §6, derived)', () => {
    for (const set of ['angle-13-npl', 'angle-16']) {
      const r = value(calculateAngleBlocks({ set, angle: 2 }));
      expect(r.count).toBe(2);
      expect(r.blocks.some((b) => b.direction === 'reverse')).toBe(true);
    }
  });

  it('should reach the published 81°40\'57" top of the 13-piece range with all 13 blocks (NPL, REFERENCE.md §6)', () => {
    const r = value(calculateAngleBlocks({ set: 'angle-13-npl', angle: '81°40\'57"' }));
    expect([r.count, r.exact]).toEqual([13, true]);
  });

  it('should refuse an angle beyond the 81°40\'57" the 13 blocks make together, naming that top (NPL, REFERENCE.md §6)', () => {
    const r = calculateAngleBlocks({ set: 'angle-13-npl', angle: '81°41\'' });
    expect(r.ok || r.kind).toBe('impossible');
    expect(r.ok || r.fields.angle).toMatch(/^is beyond the set: all its blocks added together make 81°40'57"\./);
    expect(calculateAngleBlocks({ set: 'angle-13-npl', angle: 200 }).ok).toBe(false);
  });

  it('should call an angle with seconds exact when the blocks make it, without a warning', () => {
    // The 16-piece set's 1″, 3″, 5″, 20″, 30″ blocks make any whole second to 59″ (15″ = 20″ − 5″,
    // 12″ = 20″ − 5″ − 3″, 44″ = 30″ + 20″ − 5″ − 1″; derived), so these are all exact; typed
    // seconds are not exact in decimal degrees (15″ = 0.0041666…°) and must not count as a miss.
    for (const angle of ['7°30\'15"', '17°35\'12"', '12°20\'44"', '5°5\'5"', '0°00\'30"']) {
      const r = value(calculateAngleBlocks({ set: 'angle-16', angle }));
      expect({ angle, exact: r.exact, error: r.errorArcSec, warnings: r.warnings }).toEqual({ angle, exact: true, error: '0.00', warnings: [] });
    }
  });

  it('should make an angle equal to all the blocks together', () => {
    // 1° + 27′ + 3″ + 3″ = 1°27′06″ = 5226″ (derived), typed with seconds.
    const r = value(calculateAngleBlocks({ blocks: ['1°', "27'", '3"', '3"'], angle: '1°27\'6"' }));
    expect([r.count, r.exact]).toEqual([4, true]);
  });

  it('should say a block is used more often than the set has it, or is not in the set at all', () => {
    // The 16-piece set has one 15° block and no 27° block (REFERENCE.md §6).
    const twice = calculateAngleBlocks({ set: 'angle-16', combination: [{ angle: '15°' }, { angle: '15°' }] });
    expect(twice.ok || twice.fields['combination.1.angle']).toBe(`15°00'00" is used more often than the set has it (1 block)`);
    const missing = calculateAngleBlocks({ set: 'angle-16', combination: [{ angle: '27°' }] });
    expect(missing.ok || missing.fields['combination.0.angle']).toBe(`27°00'00" is not in the set, or is marked missing or damaged`);
  });

  it('should give the nearest reachable angle and its error when exact is impossible', () => {
    const r = value(calculateAngleBlocks({ set: 'angle-13-npl', angle: '10°00\'01"' }));
    expect(r.exact).toBe(false);
    expect(r.errorArcSec).toBe('-1.00');
  });

  it('should total a given combination, reversed blocks subtracting (lab sheet rule, REFERENCE.md §6)', () => {
    const r = value(calculateAngleBlocks({ set: 'angle-13-npl', combination: [{ angle: 27 }, { angle: 9, reversed: true }, { angle: 1, reversed: true }, { angle: "27'" }, { angle: "9'" }, { angle: "1'", reversed: true }] }));
    expect(r.achievedAngleDms).toBe('17°35\'00"');
  });

  it('should say reversed blocks that equal the added ones cancel to 0°, and keep "outweigh" for more', () => {
    // 45° − 30° − 15° = 0° from the 16-piece set; 1° − 1° from two custom 1° blocks (lab sheet rule, REFERENCE.md §6).
    for (const input of [
      { set: 'angle-16', combination: [{ angle: '45°' }, { angle: '30°', reversed: true }, { angle: '15°', reversed: true }] },
      { blocks: ['1°', '1°'], combination: [{ angle: '1°' }, { angle: '1°', reversed: true }] },
    ]) {
      const r = value(calculateAngleBlocks(input));
      expect(r.achievedAngleDms).toBe('0°00\'00"');
      expect(r.warnings).toEqual(['The reversed blocks cancel the added ones: the combination makes 0°, a level face.']);
    }
    // 30° − 45° = −15°: the reversed block does outweigh the added one.
    const over = value(calculateAngleBlocks({ set: 'angle-16', combination: [{ angle: '30°' }, { angle: '45°', reversed: true }] }));
    expect(over.warnings).toEqual(['The reversed blocks outweigh the added ones: the combination leans the other way.']);
  });

  it('should give block angles in decimal degrees to 6 places, so each whole arc-second reads apart', () => {
    // Angle blocks come in whole seconds: 1″ = 1/3600° = 0.000278°, 3″ = 0.000833° (derived). At
    // 0.0001° they would read 0.0003° and 0.0008° (1.08″ and 2.88″): the 6 places are deliberate.
    const r = value(calculateAngleBlocks({ set: 'angle-16', combination: [{ angle: '3"' }, { angle: '1"', reversed: true }] }));
    expect(r.blocks.map((b) => b.angleDeg)).toEqual(['0.000833', '0.000278']);
    expect(r.achievedAngleDeg).toBe('0.000556');
  });

  it('should match an exhaustive search on random small sets (property)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: 400 }), { minLength: 1, maxLength: 7 }), fc.integer({ min: 1, max: 900 }), (blocks, target) => {
        const best = bruteForce(blocks, target);
        const found = nearestAngleCombination(blocks, target);
        const sum = found.reduce((a, b) => a + b, 0);
        if (best === null) expect(sum).not.toBe(target);
        else {
          expect(sum).toBe(target);
          expect(found.length).toBe(best);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('should refuse unknown sets, blocks not in the set, and missing angles', () => {
    expect(calculateAngleBlocks({ set: 'x', angle: 1 }).ok).toBe(false);
    expect(calculateAngleBlocks({ set: 'angle-16' }).ok).toBe(false);
    const r = calculateAngleBlocks({ set: 'angle-13-npl', combination: [{ angle: 2 }] });
    expect(r.ok || r.fields['combination.0.angle']).toMatch(/is not in the set, or is marked missing or damaged/);
    fc.assert(fc.property(fc.anything(), (x) => void expect(typeof calculateAngleBlocks(x).ok).toBe('boolean')));
  });
});
