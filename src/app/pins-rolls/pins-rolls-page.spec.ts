import { Router } from '@angular/router';
import { TestBed } from '@angular/core/testing';

import { pageSpec } from '../workbench/testing/page-spec-harness';
import PinsRollsPage, { trimDms } from './pins-rolls-page';

describe('PinsRollsPage', () => {
  const page = pageSpec(PinsRollsPage, 'pins-rolls');

  it('should show the demo dovetail’s reading over the rolls and draw it', async () => {
    await page.open();
    // REFERENCE.md §5.1, Machinery's Handbook "Measuring dovetail slides": 60°, D 0.375, a 1.250 → 2.2745.
    expect(page.resultValue('Reading over the rolls')).toBe('2.2745');
    const svg = page.el.querySelector('sw-roll-drawing svg');
    expect(svg?.querySelector('title')?.textContent).toContain('Male dovetail');
    expect(svg?.querySelectorAll('circle.roll')).toHaveLength(2);
    expect(svg?.textContent).toContain('x 2.2745 in');
    expect(svg?.textContent).toContain('α 60°');
  });

  it('should recompute as the user types a roll size', async () => {
    await page.open();
    await page.type('rollDiameter', '0.5');
    await page.type('width', '2');
    // REFERENCE.md §5.1 check value: 60°, D 0.500, a 2.000 → 3.3660.
    expect(page.resultValue('Reading over the rolls')).toBe('3.3660');
  });

  it('should put the schema’s message under a bad roll diameter and clear the results', async () => {
    await page.open();
    await page.type('rollDiameter', '-1');
    expect(page.fieldErrors()).toContain('Must be greater than 0');
    expect(page.el.querySelector('.no-results')).not.toBeNull();
    expect(page.el.querySelector('sw-roll-drawing')).toBeNull();
  });

  it('should warn when the roll would touch above the dovetail’s depth', async () => {
    await page.open();
    await page.type('depth', '0.2');
    // Contact height r·(1 + cos α) = 0.1875 · 1.5 = 0.28125 > 0.2 (derived).
    const warnings = Array.from(page.el.querySelectorAll('sw-warnings')).map((w) => w.textContent).join(' ');
    expect(warnings).toContain('use a smaller roll');
  });

  it('should round the roll’s contact height half up like every other length', async () => {
    await page.open();
    // 0.1875 · (1 + cos 60°) = 0.28125 exactly → 0.2813 (derived; half up, as 0.99985 → 0.9999).
    expect(page.resultValue('Roll touches the flank at')).toBe('0.2813');
  });

  it('should restore a female dovetail from the URL', async () => {
    await page.open('/pins-rolls?side=female&rollDiameter=0.5&width=2.5&depth=');
    // REFERENCE.md §5.1 check value: 60°, D 0.500, b 2.500 → 1.1340.
    expect(page.resultValue('Reading between the rolls')).toBe('1.1340');
  });

  it('should give the pin’s height in a V-groove', async () => {
    await page.open('/pins-rolls?kind=v-groove&includedAngle=90&pinDiameter=0.5&grooveWidth=1');
    // Derived: 0.25 / sin 45° + 0.25 − 0.5 = 0.1036.
    expect(page.resultValue('Pin top over the surface')).toBe('0.1036');
    expect(page.el.querySelector('sw-roll-drawing svg title')?.textContent).toContain('V-groove');
  });

  it('should convert the entered lengths when switching to mm', async () => {
    await page.open();
    const mm = Array.from(page.el.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.trim() === 'mm') as HTMLButtonElement;
    mm.click();
    await page.settle();
    expect((page.el.querySelector('input[formcontrolname="rollDiameter"]') as HTMLInputElement).value).toBe('9.525');
    // 31.75 + 9.525 × 2.7320508 = 57.7728 mm (derived).
    expect(page.resultValue('Reading over the rolls')).toBe('57.773');
  });

  describe('from a measured reading', () => {
    it('should work a male dovetail back to its width now and what is left to cut', async () => {
      await page.open('/pins-rolls?mode=check&reading=2.2900');
      // Derived from REFERENCE.md §5.1: a = x − D·(1 + cot 30°) = 2.29 − 0.375 × 2.7320508 = 1.2655;
      // at a = 1.250 the reading is 2.2745, so 2.2900 − 2.2745 = 0.0155 is left on the width.
      expect(page.resultValue('Corner width a now')).toBe('1.2655');
      expect(page.resultValue('Left to cut on the width')).toBe('0.0155');
      expect(page.el.querySelector('.stop-value')?.textContent?.trim()).toBe('2.2745 in');
      expect(page.el.querySelector('.stop-left')?.textContent).toContain('0.0155 in left to cut on the width');
      expect(page.el.querySelector('sw-roll-drawing svg')?.textContent).toContain('stop at x 2.2745 in');
    });

    it('should count a female dovetail’s remaining cut the other way round', async () => {
      await page.open('/pins-rolls?mode=check&side=female&rollDiameter=0.5&width=2.5&reading=1.1200&depth=');
      // y at b = 2.500 is 1.1340 (REFERENCE.md §5.1); the rolls are 1.1200 apart now: 0.0140 to go.
      expect(page.resultValue('Left to cut on the width')).toBe('0.0140');
    });

    it('should say when the work is already past the drawing size', async () => {
      await page.open('/pins-rolls?mode=check&reading=2.2700');
      expect(page.resultValue('Left to cut on the width')).toBe('-0.0045');
      expect(warningText()).toContain('already 0.0045 in past the drawing size');
    });

    it('should give a V-groove’s width now and the depth left from the pin height', async () => {
      await page.open('/pins-rolls?kind=v-groove&mode=check&pinHeight=0.1200');
      // Derived: e = 0.25/sin 45° + 0.25 − 0.12 = 0.4836, W = 2e·tan 45° = 0.9671; stop at 0.1036: 0.0164 deeper.
      expect(page.resultValue('Groove width now')).toBe('0.9671');
      expect(page.resultValue('Left to cut on the depth')).toBe('0.0164');
      expect(page.el.querySelector('.stop-value')?.textContent?.trim()).toBe('0.1036 in');
    });

    it('should ask for the reading when it is left empty or is not a number', async () => {
      await page.open('/pins-rolls?mode=check');
      await page.type('reading', '');
      expect(page.fieldErrors()).toContain('Is required: type the reading you measured');
      await page.type('reading', 'abc');
      expect(page.fieldErrors()).toContain('Must be a decimal number');
      expect(page.el.querySelector('sw-roll-drawing')).toBeNull();
    });
  });

  describe('other measurements', () => {
    it('should find a dovetail’s angle from readings over two roll sizes', async () => {
      await page.open('/pins-rolls?kind=dovetail-angle');
      // k = (2.6160 − 2.2745)/(0.500 − 0.375) = 2.732, α = 2·atan(1/(k − 1)) ≈ 60° (derived from REFERENCE.md §5.1).
      expect(page.resultValue('Dovetail angle α')).toMatch(/^60°00'0\d"$/);
      expect(page.resultValue('Corner width a')).toBe('1.2500');
      const svg = page.el.querySelector('sw-roll-drawing svg');
      expect(svg?.querySelectorAll('circle.roll.second')).toHaveLength(2);
      expect(svg?.textContent).toContain('x₂ 2.6160 in');
    });

    it('should find a taper from readings over rolls at two heights', async () => {
      await page.open('/pins-rolls?kind=taper-two-heights');
      // tan(α/2) = (1.25 − 1.15)/(2 × 2) = 0.025: TPF 24 × 0.025 = 0.6 (common practice/derived).
      expect(page.resultValue('Taper per foot')).toBe('0.60000');
      expect(page.resultValue('Half angle (each side)')).toBe(`1°25'56"`);
      expect(page.el.querySelector('sw-roll-drawing svg')?.textContent).toContain('ΔH 2.000 in');
    });

    it('should read equal readings at two heights as parallel sides, 0° with a note, and still draw the work', async () => {
      await page.open('/pins-rolls?kind=taper-two-heights&lowerReading=1.2500&upperReading=1.2500&heightDifference=2');
      // tan(α/2) = 0 / (2 × 2) = 0: parallel sides (derived).
      expect(page.resultValue('Included angle')).toBe(`0°00'00"`);
      expect(page.resultValue('Taper per foot')).toBe('0.00000');
      expect(page.el.querySelector('sw-results')?.textContent).toContain('The readings are equal: the sides are parallel (no taper).');
      expect(page.fieldErrors()).toBe('');
      const svg = page.el.querySelector('sw-roll-drawing svg');
      expect(svg?.textContent).toContain('α/2 0°');
      expect(svg?.innerHTML).not.toContain('NaN');
    });

    it('should give the taper two discs set 3 in apart make', async () => {
      await page.open('/pins-rolls?kind=taper-discs');
      // Machinery's Handbook 31 p. 701: K = 0.25/3, TPF = 24K/√(1 − K²) = 2.00698.
      expect(page.resultValue('Taper per foot')).toBe('2.00698');
      await page.type('largeDisc', '0.4');
      expect(page.fieldErrors()).toContain('Must be larger than the small disc d');
      expect(page.fieldErrors()).not.toMatch(/smallDisc/);
    });

    it('should find the disc centre distance for an angle', async () => {
      await page.open('/pins-rolls?kind=taper-discs&discGiven=includedAngle&discAngle=10');
      // C = ((D − d)/2) / sin 5° = 0.25 / 0.0871557 = 2.8684 (derived).
      expect(page.resultValue('Centre distance of the discs')).toBe('2.8684');
    });

    it('should find an internal taper from two balls', async () => {
      await page.open('/pins-rolls?kind=taper-balls');
      // sin(α/2) = 0.25 / 1.5 → tan(α/2) = 1/√35, TPF = 24/√35 = 4.05674 (derived).
      expect(page.resultValue('Taper per foot')).toBe('4.05674');
      expect(page.resultValue('Centre distance of the balls')).toBe('1.5000');
      expect(page.el.querySelector('sw-roll-drawing svg title')?.textContent).toContain('Internal taper');
    });
  });

  describe('addresses and readings that do not fit', () => {
    it.each(['/pins-rolls?kind=foo', '/pins-rolls?kind='])('should fall back to the dovetail for %s and tidy the address', async (url) => {
      await page.open(url);
      // The demo dovetail: REFERENCE.md §5.1, 60°, D 0.375, a 1.250 → 2.2745.
      expect(page.resultValue('Reading over the rolls')).toBe('2.2745');
      await new Promise((resolve) => setTimeout(resolve, 350));
      expect(TestBed.inject(Router).url).toContain('kind=dovetail');
    });

    it('should not carry a reading over to the other side of a dovetail', async () => {
      await page.open('/pins-rolls?mode=check&side=female');
      // Nothing measured yet: ask for the reading rather than work from a made-up one.
      expect((page.el.querySelector('input[formcontrolname="reading"]') as HTMLInputElement).value).toBe('');
      expect(page.el.querySelector('.stop-left')).toBeNull();
      expect(page.el.querySelector('.no-results')?.textContent).toContain('Type the reading you measured to see the results.');
      await page.type('reading', '0.2300');
      expect(page.resultValue('Left to cut on the width')).toBeDefined();
      pickToggle('Male (tongue)');
      await page.settle();
      expect((page.el.querySelector('input[formcontrolname="reading"]') as HTMLInputElement).value).toBe('');
      expect(page.resultValue('Left to cut on the width')).toBeUndefined();
    });

    it('should refuse a second reading that gives a negative corner width, under that reading', async () => {
      await page.open('/pins-rolls?kind=dovetail-angle&measurement2=9.000');
      // Derived: k = (9.000 − 2.2745)/0.125 = 53.804, a = 2.2745 − 0.375k = −17.9020 in.
      expect(page.fieldErrors()).toContain('With x₁ 2.2745 gives a corner width of -17.9020 in (it must be more than 0): check x₂ and x₁');
      expect(page.resultValue('Corner width a')).toBeUndefined();
      expect(page.el.querySelector('sw-roll-drawing')).toBeNull();
    });

    it('should refuse a dovetail angle typed with an inch mark, saying what it was read as', async () => {
      await page.open();
      await page.type('angle', '0.25"');
      expect(page.fieldErrors()).toContain(`Must be from 10° to 80° for a dovetail, got 0°00'00.25" (in an angle " marks seconds of arc, not inches)`);
      expect(page.el.querySelector('.stop-value')).toBeNull();
    });

    it('should name the other roll in words when both rolls are the same size', async () => {
      await page.open('/pins-rolls?kind=dovetail-angle&rollDiameter2=0.375');
      expect(page.fieldErrors()).toContain('Must differ from the first roll diameter D₁');
    });
  });

  describe('trimDms', () => {
    it('should drop zero places only at the end', () => {
      expect(trimDms(`60°00'00"`)).toBe('60°');
      expect(trimDms(`55°30'00"`)).toBe(`55°30'`);
      expect(trimDms(`1°26'16"`)).toBe(`1°26'16"`);
    });
  });

  function pickToggle(text: string): void {
    const button = Array.from(page.el.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.trim() === text) as HTMLButtonElement;
    button.click();
  }

  function warningText(): string {
    return Array.from(page.el.querySelectorAll('sw-warnings')).map((w) => w.textContent ?? '').join(' ');
  }
});
