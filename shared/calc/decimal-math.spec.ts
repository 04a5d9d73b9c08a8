import DecimalBase from 'decimal.js';
import fc from 'fast-check';
import { Dec, PI, acosDeg, asinDeg, asinRad, atanDeg, cosDeg, exactText, fixedText, sinCosRad, sinDeg, tanDeg } from './decimal-math';

// Reference values from decimal.js's own series at 60 digits (derived).
const REF = DecimalBase.clone({ precision: 60 });
const closeTo = (actual: InstanceType<typeof Dec>, expected: DecimalBase, tol = '1e-35') =>
  expect(new REF(actual.toString()).minus(expected).abs().lte(tol)).toBe(true);

describe('decimal-math', () => {
  describe('sinCosRad', () => {
    it('should match a 60-digit series to 35 digits over several turns', () => {
      for (const x of ['0', '1e-30', '0.001', '0.3', '1', '1.5707963267948966', '2', '3.14159', '-4', '10', '-0.0087', '6.283185307179586']) {
        const { sin, cos } = sinCosRad(new Dec(x));
        closeTo(sin, REF.sin(x));
        closeTo(cos, REF.cos(x));
      }
    });

    it('should match the series for random angles (property)', () => {
      fc.assert(
        fc.property(fc.double({ min: -20, max: 20, noNaN: true }), (x) => {
          const { sin, cos } = sinCosRad(new Dec(x));
          closeTo(sin, REF.sin(x));
          closeTo(cos, REF.cos(x));
        }),
        { numRuns: 200 },
      );
    });
  });

  describe('degree functions', () => {
    it('should give exact values at the special angles (derived)', () => {
      expect(sinDeg(new Dec(30)).toSignificantDigits(30).toString()).toBe('0.5');
      expect(cosDeg(new Dec(60)).toSignificantDigits(30).toString()).toBe('0.5');
      expect(tanDeg(new Dec(45)).toSignificantDigits(30).toString()).toBe('1');
      expect(sinDeg(new Dec(90)).toSignificantDigits(30).toString()).toBe('1');
    });

    it('should invert: asin(sin θ) = θ and atan(tan θ) = θ (property)', () => {
      fc.assert(
        fc.property(fc.double({ min: 0.0001, max: 89.9, noNaN: true }), (deg) => {
          const theta = new Dec(deg);
          expect(asinDeg(sinDeg(theta)).minus(theta).abs().lt('1e-30')).toBe(true);
          expect(atanDeg(tanDeg(theta)).minus(theta).abs().lt('1e-30')).toBe(true);
          expect(acosDeg(cosDeg(theta)).minus(theta).abs().lt('1e-28')).toBe(true);
        }),
        { numRuns: 200 },
      );
    });
  });

  describe('asinRad', () => {
    it('should agree with a 60-digit arc sine, including near 1', () => {
      for (const x of ['0.1', '0.5', '0.7', '0.75', '0.7500001', '0.9', '0.99999999', '0.40168', '1e-20', '-0.3']) {
        closeTo(asinRad(new Dec(x)), REF.asin(x));
      }
      expect(asinRad(new Dec(1)).minus(PI.div(2)).abs().lt('1e-38')).toBe(true);
    });
  });

  describe('text', () => {
    it('should print 30 significant digits without exponent', () => {
      expect(exactText(new Dec(2).sqrt())).toBe('1.41421356237309504880168872421');
      expect(exactText(new Dec('0.00000001'))).toBe('0.00000001');
    });

    it('should never print "-0"', () => {
      expect(fixedText(new Dec('-0.00001'), 4)).toBe('0.0000');
      expect(fixedText(new Dec('-0.5'), 1)).toBe('-0.5');
    });

    it('should round an exact half up though the trig leaves it a hair below', () => {
      // 0.5625 · (1 − cos 60°) is exactly 0.28125 (cos 60° = 1/2, derived); at 40 digits cos 60°
      // comes out as 0.4999…9 or 0.5000…1, so the product sits a hair either side of the half.
      const product = new Dec('0.5625').mul(new Dec(1).minus(cosDeg(new Dec(60))));
      expect(fixedText(product, 4)).toBe('0.2813');
      expect(fixedText(new Dec('0.281249999999999999999999999999999999'), 4)).toBe('0.2813');
      // A value truly below the half by more than noise still rounds down.
      expect(fixedText(new Dec('0.2812499'), 4)).toBe('0.2812');
    });
  });
});
