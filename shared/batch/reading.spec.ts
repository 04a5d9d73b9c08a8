import type { SetupCheck } from '../api/setup';
import { farFromNominal, farMessage, plausibleDistance, readingProblem, readReading } from './reading';

// The tolerance bands are invented; the limits are plain arithmetic (derived).
const END: SetupCheck = { key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' };
const FLAT: SetupCheck = { key: 'flatness', label: 'Flatness', unit: 'in', nominal: '0', plus: '0.0005', minus: '0' };
const NONE: SetupCheck = { key: 'zero', label: 'Zero', unit: 'in', nominal: '0', plus: '0', minus: '0' };

describe('reading', () => {
  describe('readReading', () => {
    it('should read numbers written the usual shop ways, keeping the digits as written', () => {
      expect(readReading('.585')).toEqual({ ok: true, text: '0.585' });
      expect(readReading('+0.5854')).toEqual({ ok: true, text: '0.5854' });
      expect(readReading(' -.25 ')).toEqual({ ok: true, text: '-0.25' });
      expect(readReading('+.5')).toEqual({ ok: true, text: '0.5' });
      expect(readReading('5.')).toEqual({ ok: true, text: '5' });
      expect(readReading('0.5850')).toEqual({ ok: true, text: '0.5850' });
      expect(readReading('-0.1632')).toEqual({ ok: true, text: '-0.1632' });
    });
    it('should keep "-0" as written, for the plausibility check to name', () => {
      expect(readReading('-0')).toEqual({ ok: true, text: '-0' });
    });
    it('should refuse what is no number', () => {
      for (const bad of ['', '.', '+', '-', 'abc', '0,5858', '1e3', '--1', '+-1', '0.5.8', '1 2']) expect(readReading(bad)).toEqual({ ok: false, problem: 'not-a-number' });
    });
    it('should call a number with too many digits too long, not "not a number"', () => {
      expect(readReading(`0.${'5'.repeat(300)}`)).toEqual({ ok: false, problem: 'too-long' });
      expect(readReading('0.5854321')).toEqual({ ok: false, problem: 'too-long' });
      expect(readReading('1234567')).toEqual({ ok: false, problem: 'too-long' });
      expect(readReading('123456.123456')).toEqual({ ok: true, text: '123456.123456' });
      expect(readingProblem('End thickness', 'too-long', '0.5854')).toBe('End thickness is too long: a reading has at most 6 digits before and 6 after the decimal point.');
      expect(readingProblem('End thickness', 'not-a-number', '0.5854')).toBe('End thickness must be a decimal number such as 0.5854.');
    });
  });

  describe('farFromNominal', () => {
    it('should allow half the nominal either way when that is wider than ten bands', () => {
      // 0.5854 / 2 = 0.2927 (wider than 10 × 0.0020 = 0.02): plausible from 0.2927 to 0.8781.
      expect(plausibleDistance(END).toString()).toBe('0.2927');
      expect(farFromNominal(END, '0.2927')).toBe(false);
      expect(farFromNominal(END, '0.8781')).toBe(false);
      expect(farFromNominal(END, '0.6054')).toBe(false); // a bad part, but a reading of this part
      expect(farFromNominal(END, '0.29269')).toBe(true);
      expect(farFromNominal(END, '0.87811')).toBe(true);
    });
    it('should catch a missing or shifted decimal point', () => {
      expect(farFromNominal(END, '5854')).toBe(true);
      expect(farFromNominal(END, '5.854')).toBe(true);
      expect(farFromNominal(END, '0.05854')).toBe(true);
      expect(farMessage(END, '5854')).toBe('End thickness 5854 is far from the nominal 0.5854 in: check the decimal point. If the reading is right, confirm it to record it anyway.');
    });
    it('should use ten tolerance bands for a nominal of 0, and no limit without a band', () => {
      // 10 × (0.0005 + 0) = 0.005.
      expect(farFromNominal(FLAT, '0.005')).toBe(false);
      expect(farFromNominal(FLAT, '0.0051')).toBe(true);
      expect(farFromNominal(NONE, '12')).toBe(false);
    });
  });
});
