import { FormControl, FormGroup } from '@angular/forms';
import { z } from 'zod';

import { fail } from '../../../shared/calc/step';
import { applyControlErrors, controlMessage, failureMessages, fieldWords, sentence, sortFieldMessages, waitingText, zodFieldMessages } from './field-errors';

describe('a field only empty, not typed in yet', () => {
  it('should not be marked red, and the results should say what to type', () => {
    const controls = { stackHeight: new FormControl(''), barLength: new FormControl('5') };
    const messages = { controls: { stackHeight: 'Is required: type the stack height' }, general: [] };
    applyControlErrors(controls, messages.controls);
    expect(controls.stackHeight.touched).toBe(false);
    expect(controlMessage(controls.stackHeight)).toBe('Is required: type the stack height');
    expect(waitingText(messages, controls)).toBe('Type the stack height to see the results.');
  });

  it('should be marked once typed in, and any wrong input makes it a matter of fixing', () => {
    const controls = { stackHeight: new FormControl(''), barLength: new FormControl('x') };
    controls.stackHeight.markAsDirty();
    applyControlErrors(controls, { stackHeight: 'Is required: type the stack height' });
    expect(controls.stackHeight.touched).toBe(true);
    expect(waitingText({ controls: { stackHeight: 'Is required: type the stack height' }, general: [] }, controls)).toBeNull();
    const fresh = { stackHeight: new FormControl(''), barLength: new FormControl('x') };
    expect(waitingText({ controls: { stackHeight: 'Is required: type the stack height', barLength: 'Must be a decimal number' }, general: [] }, fresh)).toBeNull();
    expect(waitingText({ controls: {}, general: ['Something else'] }, fresh)).toBeNull();
  });
});

describe('field errors', () => {
  describe('sentence', () => {
    it('should capitalise the first letter only', () => expect(sentence('must be greater than 0')).toBe('Must be greater than 0'));
    it('should leave an empty message empty', () => expect(sentence('')).toBe(''));
  });

  describe('sortFieldMessages', () => {
    const names = ['angle', 'thickness', 'endThickness'];

    it('should give each control its own message', () => {
      const sorted = sortFieldMessages({ angle: 'must be greater than 0° and less than 90°', thickness: 'is required' }, names);
      expect(sorted.controls).toEqual({ angle: 'Must be greater than 0° and less than 90°', thickness: 'Is required' });
      expect(sorted.general).toEqual([]);
    });

    it('should follow an alias onto the control that holds the field', () => {
      expect(sortFieldMessages({ removedAtEnd: 'must be greater than 0' }, names, { removedAtEnd: 'endThickness' }).controls).toEqual({
        endThickness: 'Must be greater than 0',
      });
    });

    it('should put a nested path on its top-level control', () => {
      expect(sortFieldMessages({ 'angle.0': 'is bad' }, names).controls).toEqual({ angle: 'Is bad' });
    });

    it('should keep whole-request and unknown fields as general messages naming the field', () => {
      const sorted = sortFieldMessages({ body: 'give exactly two of angle, taperLength', cutter: 'is too short' }, names);
      expect(sorted.controls).toEqual({});
      expect(sorted.general).toEqual(['Give exactly two of angle, taperLength', 'Cutter is too short']);
    });

    it('should name a field with no control in words, not by its code name', () => {
      expect(sortFieldMessages({ wearBlocks: 'make 0.1 in together', 'missing.0': 'is not in the box' }, names).general).toEqual([
        'Wear blocks make 0.1 in together',
        'Missing 1 is not in the box',
      ]);
      expect(fieldWords('combination.2.angle')).toBe('Combination 3 angle');
    });
  });

  describe('failureMessages', () => {
    it('should give no messages for a success', () => expect(failureMessages(null, ['a'])).toEqual({ controls: {}, general: [] }));

    it('should fall back to the failure sentence when no field is named', () => {
      const failure = { ...fail('impossible', 'Taper', {}), fields: {} };
      expect(failureMessages(failure, ['a']).general).toEqual(['Taper: no answer']);
    });
  });

  describe('zodFieldMessages', () => {
    it('should keep the first message of each path', () => {
      const schema = z.object({ a: z.number().min(1, 'too small').max(0, 'too big'), b: z.string() });
      const parsed = schema.safeParse({ a: 0.5, b: 3 });
      expect(parsed.success).toBe(false);
      if (!parsed.success) expect(zodFieldMessages(parsed.error)).toEqual({ a: 'too small', b: expect.stringContaining('string') });
    });
  });

  describe('applyControlErrors', () => {
    it('should set the calc error on named controls and clear it elsewhere', () => {
      const form = new FormGroup({ a: new FormControl('1'), b: new FormControl('x') });
      applyControlErrors(form.controls, { b: 'Must be a number' });
      expect(controlMessage(form.controls.b)).toBe('Must be a number');
      expect(form.controls.b.touched).toBe(true);
      expect(form.controls.a.errors).toBeNull();
      applyControlErrors(form.controls, {});
      expect(form.controls.b.errors).toBeNull();
      expect(form.valid).toBe(true);
    });
  });
});
