import { checkFromResult, checkKey } from './check-suggestions';

describe('check-suggestions', () => {
  describe('checkKey', () => {
    it('should make a lower-case dashed key starting with a letter', () => {
      expect(checkKey('End thickness')).toBe('end-thickness');
      expect(checkKey('  Face length (aligned) ')).toBe('face-length-aligned');
      expect(checkKey('2nd reading')).toBe('check-2nd-reading');
    });
  });

  describe('checkFromResult', () => {
    it('should turn a length line into a check with the default band', () => {
      expect(checkFromResult({ label: 'End thickness', value: '0.5854 in' }, 'in')).toEqual({ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' });
      expect(checkFromResult({ label: 'Face length', value: '32.024 mm' }, 'in')).toMatchObject({ unit: 'mm', plus: '0.025' });
    });
    it('should read angles in degrees', () => {
      expect(checkFromResult({ label: 'Angle (°)', value: '7.5000' }, 'in')).toMatchObject({ label: 'Angle', unit: 'deg', nominal: '7.5000' });
    });
    it('should refuse text that is not one number', () => {
      expect(checkFromResult({ label: 'Angle dms', value: "7°30'00\"" }, 'in')).toBeNull();
      expect(checkFromResult({ label: 'Shape', value: 'taper' }, 'in')).toBeNull();
    });
  });
});
