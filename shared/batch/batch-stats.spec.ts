import type { SetupCheck } from '../api/setup';
import { checkBand, checkDecimals, checkStats, decimalsIn, inBand, partVerdict } from './batch-stats';

// Tolerance bands and statistics are plain arithmetic (derived); the readings are invented.
const END: SetupCheck = { key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' };
const FACE: SetupCheck = { key: 'face-length', label: 'Face length', unit: 'in', nominal: '1.2608', plus: '0.005', minus: '0' };

describe('batch-stats', () => {
  describe('decimalsIn', () => {
    it('should count the written decimals', () => {
      expect(decimalsIn('0.5850')).toBe(4);
      expect(decimalsIn('12')).toBe(0);
      expect(decimalsIn('-1.5')).toBe(1);
    });
  });

  describe('checkBand / inBand', () => {
    it('should build the band from nominal, plus and minus', () => {
      const band = checkBand(END);
      expect(band.low.toString()).toBe('0.5844');
      expect(band.high.toString()).toBe('0.5864');
    });
    it('should include both limits and exclude values just outside', () => {
      expect(inBand(END, '0.5844')).toBe(true);
      expect(inBand(END, '0.5864')).toBe(true);
      expect(inBand(END, '0.58439')).toBe(false);
      expect(inBand(END, '0.58641')).toBe(false);
      expect(inBand(FACE, '1.2607')).toBe(false); // minus 0: nothing under nominal
    });
  });

  describe('partVerdict', () => {
    it('should pass a part with every value in band', () => {
      expect(partVerdict([END, FACE], { 'end-thickness': '0.5856', 'face-length': '1.2610' })).toEqual({ pass: true, outOfBand: [], missing: [] });
    });
    it('should name the checks out of band and the missing ones', () => {
      expect(partVerdict([END, FACE], { 'end-thickness': '0.5870' })).toEqual({ pass: false, outOfBand: ['end-thickness'], missing: ['face-length'] });
    });
  });

  describe('checkStats', () => {
    // Hand computation (derived):
    //   every figure to 4 + 1 = 5 decimals (the check is written to 4)
    //   readings 0.5856, 0.5850, 0.5862, 0.5841 → sum 2.3409, mean 0.585225 → 0.58523 (half up)
    //   min 0.5841, max 0.5862, range 0.0021
    //   from first (0.5856): 0, −0.0006, +0.0006, −0.0015 → spread 0.0015
    //   squares about the mean: 1.40625e-7 + 5.0625e-8 + 9.50625e-7 + 1.265625e-6 = 2.4075e-6;
    //   / (4 − 1) = 8.025e-7; √ = 0.000895823… → 0.00090
    //   band 0.5844–0.5864: part 4 (0.5841) fails.
    const parts = [
      { partNo: 3, values: { 'end-thickness': '0.5862' } },
      { partNo: 1, values: { 'end-thickness': '0.5856' } },
      { partNo: 2, values: { 'end-thickness': '0.5850' } },
      { partNo: 4, values: { 'end-thickness': '0.5841' } },
    ];

    it('should compute mean, range, spread from the first part and standard deviation', () => {
      const [stats] = checkStats([END], parts);
      expect(stats).toMatchObject({
        n: 4, mean: '0.58523', min: '0.58410', max: '0.58620', range: '0.00210', spreadFromFirst: '0.00150', stdDev: '0.00090',
        low: '0.5844', high: '0.5864', passCount: 3, failCount: 1, decimals: 5,
      });
    });

    it('should list each part\'s deviation in part order', () => {
      const [stats] = checkStats([END], parts);
      expect(stats?.deviations.map((d) => [d.partNo, d.fromFirst, d.fromNominal, d.pass])).toEqual([
        [1, '0.00000', '0.00020', true],
        [2, '-0.00060', '-0.00040', true],
        [3, '0.00060', '0.00080', true],
        [4, '-0.00150', '-0.00130', false],
      ]);
    });

    it('should give nulls for a check with no readings and no standard deviation for one part', () => {
      const [face] = checkStats([FACE], parts);
      expect(face).toMatchObject({ n: 0, mean: null, range: null, spreadFromFirst: null, stdDev: null });
      const [one] = checkStats([END], parts.slice(1, 2));
      expect(one).toMatchObject({ n: 1, mean: '0.58560', range: '0.00000', spreadFromFirst: '0.00000', stdDev: null });
    });

    it('should never produce float noise for readings that binary floats cannot hold', () => {
      const [stats] = checkStats([{ ...END, nominal: '0.3', plus: '0.1', minus: '0.1' }], [
        { partNo: 1, values: { 'end-thickness': '0.1' } },
        { partNo: 2, values: { 'end-thickness': '0.2' } },
      ]);
      expect(stats).toMatchObject({ mean: '0.15', range: '0.10', low: '0.2', high: '0.4', passCount: 1 });
    });

    it('should keep the band at the check\'s decimals and every figure at one resolution, whatever a reading\'s decimals', () => {
      expect(checkDecimals(END)).toBe(4);
      expect(checkDecimals(FACE)).toBe(4);
      // 0.5854 and 0.58541 (5 decimals): mean 0.585405 → 0.58541 (half up); range 0.00001;
      // s = |0.58541 − 0.5854| / √2 = 0.0000070710… → 0.00001 (derived).
      const [stats] = checkStats([END], [{ partNo: 1, values: { 'end-thickness': '0.5854' } }, { partNo: 2, values: { 'end-thickness': '0.58541' } }]);
      expect(stats).toMatchObject({ low: '0.5844', high: '0.5864', decimals: 5, mean: '0.58541', min: '0.58540', max: '0.58541', range: '0.00001', spreadFromFirst: '0.00001', stdDev: '0.00001' });
      // A 6-decimal reading does not widen the figures either.
      const [six] = checkStats([END], [{ partNo: 1, values: { 'end-thickness': '0.585412' } }]);
      expect(six).toMatchObject({ low: '0.5844', high: '0.5864', mean: '0.58541', range: '0.00000' });
    });
  });
});
