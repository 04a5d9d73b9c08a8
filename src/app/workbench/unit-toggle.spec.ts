import { FormControl, FormGroup } from '@angular/forms';
import { TestBed } from '@angular/core/testing';

import { UnitToggle, convertLengthControls, convertLengthText } from './unit-toggle';

describe('UnitToggle', () => {
  describe('convertLengthText', () => {
    // 25.4 mm per inch exactly (international inch, 1959): derived.
    it('should convert inches to millimetres exactly within 0.001 mm', () => {
      expect(convertLengthText('0.75', 'in', 'mm')).toBe('19.05');
      expect(convertLengthText('5', 'in', 'mm')).toBe('127');
      expect(convertLengthText('0.0001', 'in', 'mm')).toBe('0.003');
    });
    it('should convert millimetres to inches at 0.0001 in', () => {
      expect(convertLengthText('19.05', 'mm', 'in')).toBe('0.75');
      expect(convertLengthText('100', 'mm', 'in')).toBe('3.937');
      expect(convertLengthText('1', 'mm', 'in')).toBe('0.0394');
    });
    it('should leave non-numbers and the same unit alone', () => {
      expect(convertLengthText('', 'in', 'mm')).toBe('');
      expect(convertLengthText('0.7.5', 'in', 'mm')).toBe('0.7.5');
      expect(convertLengthText('0.75', 'in', 'in')).toBe('0.75');
    });
    it('should write zero as 0', () => expect(convertLengthText('0.00001', 'in', 'mm')).toBe('0'));
  });

  describe('convertLengthControls', () => {
    it('should convert only the named controls', () => {
      const form = new FormGroup({ thickness: new FormControl('0.75', { nonNullable: true }), angle: new FormControl('7.5', { nonNullable: true }) });
      convertLengthControls(form.controls, ['thickness'], 'in', 'mm');
      expect(form.getRawValue()).toEqual({ thickness: '19.05', angle: '7.5' });
    });
    it('should refuse a name the form does not have', () => {
      const form = new FormGroup({ a: new FormControl('1', { nonNullable: true }) });
      expect(() => convertLengthControls(form.controls, ['b'], 'in', 'mm')).toThrow('no control "b"');
    });
  });

  describe('component', () => {
    it('should emit the other unit when it is chosen, and nothing for the same one', () => {
      const fixture = TestBed.createComponent(UnitToggle);
      fixture.componentRef.setInput('unit', 'in');
      const emitted: string[] = [];
      fixture.componentInstance.unitChange.subscribe((u) => emitted.push(u));
      fixture.detectChanges();
      const buttons = fixture.nativeElement.querySelectorAll('button') as NodeListOf<HTMLButtonElement>;
      expect(Array.from(buttons).map((b) => b.textContent?.trim())).toEqual(['in', 'mm']);
      buttons[1].click();
      buttons[0].click();
      expect(emitted).toEqual(['mm']);
    });
  });
});
