import { Dec } from '../calc/decimal-math';
import { MACHINE_TAPERS, findMachineTaper } from './machine-tapers';

describe('Morse tapers', () => {
  // Machinery's Handbook "Morse Taper Shanks" (REFERENCE.md §4.2 for TPF, A and D); plug depth P
  // as the handbook's table gives it, listed by sizes.com "Morse taper shanks and sockets":
  // 2, 2-1/8, 2-9/16, 3-3/16, 4-1/16, 5-3/16, 7-1/4, 10 in.
  const plugDepths = ['2', '2.125', '2.5625', '3.1875', '4.0625', '5.1875', '7.25', '10'];

  it('should carry the published plug depth of every size, not one worked back from A and D', () => {
    expect(MACHINE_TAPERS.filter((t) => t.family === 'morse').map((t) => t.length)).toEqual(plugDepths);
  });

  it('should agree with A, D and the taper to the rounding of A and D (derived)', () => {
    for (let n = 0; n <= 7; n++) {
      const t = findMachineTaper(`morse-${n}`)!;
      // (A − D) · 12 / TPF: 5.18757 for No. 5 and 7.25006 for No. 6, within 0.0001 in of the published depth.
      const worked = new Dec(t.largeDiameter!).minus(t.smallDiameter!).mul(12).div(t.taperPerFoot);
      expect(worked.minus(t.length!).abs().lte('0.0001')).toBe(true);
    }
  });

  it('should keep the table figures of REFERENCE.md §4.2 for No. 5 and No. 6', () => {
    const [five, six] = [findMachineTaper('morse-5')!, findMachineTaper('morse-6')!];
    expect([five.taperPerFoot, five.largeDiameter, five.smallDiameter]).toEqual(['0.63151', '1.748', '1.475']);
    expect([six.taperPerFoot, six.largeDiameter, six.smallDiameter]).toEqual(['0.62565', '2.494', '2.116']);
  });
});

describe('what the page shows of each standard taper', () => {
  it('should state its basis in words, without internal notes or web addresses', () => {
    for (const t of MACHINE_TAPERS) {
      expect({ id: t.id, basis: t.basis }).toEqual({ id: t.id, basis: expect.not.stringMatching(/REFERENCE|\.com|\.org|tpub|from memory|unverified/i) });
      expect(t.basis.length).toBeGreaterThan(10);
    }
  });
});
