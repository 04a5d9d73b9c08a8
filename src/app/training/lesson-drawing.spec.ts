import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSliderHarness } from '@angular/material/slider/testing';

import { LessonDrawing } from './lesson-drawing';
import { LESSONS } from './lessons';

describe('LessonDrawing', () => {
  let fixture: ComponentFixture<LessonDrawing>;

  async function show(kind: string): Promise<HTMLElement> {
    fixture = TestBed.createComponent(LessonDrawing);
    fixture.componentRef.setInput('kind', kind);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it.each(LESSONS.map((l) => [l.drawing]))('should draw %s as a labelled SVG with engine readouts', async (kind) => {
    const el = await show(kind);
    const svg = el.querySelector('svg')!;
    const picture = svg.querySelector('[role="img"]')!;
    expect(picture.getAttribute('aria-label')).toBeTruthy();
    expect(svg.querySelectorAll('polygon, rect, circle').length).toBeGreaterThan(0);
    expect(el.querySelectorAll('.readouts dd').length).toBeGreaterThan(0);
    expect(el.textContent).not.toMatch(/NaN|Infinity/);
  });

  it('should give the 14°30\' sine-bar stack of the demo sine plate from the engine: 1.2519 in on a 5 in bar', async () => {
    // H = 5 · sin 14.5° = 1.25186… (Army OD1642 formula; derived).
    const el = await show('sine-bar');
    expect(el.textContent).toContain('1.2519 in');
  });

  it('should read 3.3660 in over 0.500 in pins on a 2.000 in, 60° dovetail', async () => {
    // Machinery's Handbook "Measuring dovetail slides", REFERENCE.md §5.1 check value (derived).
    const el = await show('over-pins');
    expect(el.textContent).toContain('3.3660 in');
  });

  it('should show the fewest-blocks stack beside the last-digit stack', async () => {
    const el = await show('gauge-stack');
    // 2.826 in from the 81 set: 3 blocks (.126 + .700 + 2.000), REFERENCE.md §3.5 G7 (derived).
    expect(el.querySelector('.readouts')!.textContent).toContain('3: ');
    expect(el.querySelectorAll('rect.stack:not(.alt)')).toHaveLength(3);
  });

  describe('gauge-stack length', () => {
    const thumb = () => TestbedHarnessEnvironment.loader(fixture).getHarness(MatSliderHarness).then((h) => h.getEndThumb());
    const box = (el: HTMLElement) => el.querySelector('.length-box input') as HTMLInputElement;
    const fewest = (el: HTMLElement) => el.querySelector('.readouts dd')!.textContent;

    it('should move a thousandth of an inch per arrow press and a tenth per page', async () => {
      const el = await show('gauge-stack');
      const input = el.querySelector('input[matSliderThumb]') as HTMLInputElement;
      expect(input.step).toBe('0.001');
      expect(await (await thumb()).getValue()).toBeCloseTo(2.826, 6);
      input.dispatchEvent(new KeyboardEvent('keydown', { key: 'PageUp', bubbles: true, cancelable: true }));
      await fixture.whenStable();
      expect(await (await thumb()).getValue()).toBeCloseTo(2.926, 6);
      expect(box(el).value).toBe('2.9260');
      input.dispatchEvent(new KeyboardEvent('keydown', { key: 'PageDown', bubbles: true, cancelable: true }));
      input.dispatchEvent(new KeyboardEvent('keydown', { key: 'PageDown', bubbles: true, cancelable: true }));
      await fixture.whenStable();
      expect(box(el).value).toBe('2.7260');
    });

    it('should build a typed length to the ten-thousandth, and say what it needs when a length will not do', async () => {
      const el = await show('gauge-stack');
      box(el).value = '3,1415';
      box(el).dispatchEvent(new Event('change'));
      await fixture.whenStable();
      // 3.1415 in from the 81 set: 0.1005 + 0.141 + 0.900 + 2.000, four blocks (derived by hand: last digit first).
      expect(fewest(el)).toMatch(/^4: /);
      expect(el.querySelector('.length-error')).toBeNull();
      box(el).value = '7';
      box(el).dispatchEvent(new Event('change'));
      await fixture.whenStable();
      expect(el.querySelector('.length-error')!.textContent).toContain('from 0.3000 to 6.0000 in');
      expect(fewest(el)).toMatch(/^4: /);
      box(el).value = '2.82651';
      box(el).dispatchEvent(new Event('change'));
      await fixture.whenStable();
      expect(el.querySelector('.length-error')!.textContent).toContain('at most four decimals');
    });
  });

  describe('angle handle', () => {
    /** jsdom has no PointerEvent: a mouse event that carries a pointer id is all the handle reads. */
    class TestPointerEvent extends MouseEvent {
      readonly pointerId = 7;
    }

    const handle = (el: HTMLElement) => el.querySelector<SVGGElement>('svg .grip[role="slider"]')!;
    const readout = (el: HTMLElement, label: string) =>
      Array.from(el.querySelectorAll('.readouts div')).find((d) => d.querySelector('dt')!.textContent === label)!.querySelector('dd')!.textContent;
    const sliderValue = () => TestbedHarnessEnvironment.loader(fixture).getHarness(MatSliderHarness).then((h) => h.getEndThumb()).then((t) => t.getValue());
    /** tan of `deg` degrees to 4 places (derived: definition of the tangent). */
    const tan4 = (deg: number) => Math.tan((deg * Math.PI) / 180).toFixed(4);

    async function key(el: HTMLElement, name: string): Promise<void> {
      handle(el).dispatchEvent(new KeyboardEvent('keydown', { key: name, bubbles: true, cancelable: true }));
      await fixture.whenStable();
    }

    it.each([
      ['taper-triangle', 'Drag on the drawing to set α', '1', '30'],
      ['sine-bar', 'Drag on the drawing to set θ', '0', '60'],
      ['over-pins', 'Drag on the drawing to set the dovetail α', '40', '70'],
    ])('should give the %s drawing a focusable slider handle', async (kind, name, min, max) => {
      const el = await show(kind);
      const h = handle(el);
      expect(h.getAttribute('tabindex')).toBe('0');
      expect(h.getAttribute('aria-label')).toBe(name);
      expect(h.getAttribute('aria-valuemin')).toBe(min);
      expect(h.getAttribute('aria-valuemax')).toBe(max);
      expect(Number(h.getAttribute('aria-valuenow'))).toBe(await sliderValue());
      expect(h.querySelector('.grip-hit')!.getAttribute('r')).toBe('18');
    });

    it.each(['gauge-stack', 'lathe-taper'])('should have no handle on the %s drawing, whose slider is not an angle', async (kind) => {
      expect(handle(await show(kind))).toBeNull();
    });

    it('should step the angle from the keyboard and keep the slider and readouts in step', async () => {
      const el = await show('taper-triangle');
      expect(await sliderValue()).toBe(7.5);
      await key(el, 'ArrowUp');
      expect(handle(el).getAttribute('aria-valuenow')).toBe('8');
      expect(await sliderValue()).toBe(8);
      expect(readout(el, 'tan α')).toBe(tan4(8));
      await key(el, 'ArrowLeft');
      await key(el, 'PageDown');
      expect(await sliderValue()).toBe(2.5);
      await key(el, 'End');
      expect(await sliderValue()).toBe(30);
      expect(readout(el, 'tan α')).toBe(tan4(30));
      await key(el, 'PageUp');
      expect(await sliderValue()).toBe(30);
      await key(el, 'Home');
      expect(await sliderValue()).toBe(1);
      await key(el, 'Tab');
      expect(await sliderValue()).toBe(1);
    });

    it('should follow the slider when the slider moves', async () => {
      const el = await show('sine-bar');
      const thumb = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSliderHarness).then((h) => h.getEndThumb());
      await thumb.setValue(30);
      await fixture.whenStable();
      expect(handle(el).getAttribute('aria-valuenow')).toBe('30');
    });

    it('should turn the arm to a dragged pointer and update the readouts and the slider', async () => {
      const el = await show('sine-bar');
      const svg = el.querySelector('svg')!;
      // Screen = view units, shifted by (100, 50): the inverse matrix takes that shift off.
      const inverse = { a: 1, b: 0, c: 0, d: 1, e: -100, f: -50 };
      svg.getScreenCTM = () => ({ inverse: () => inverse }) as unknown as DOMMatrix;
      const { x, y } = { x: 70 + 100, y: 256 + 50 }; // the left roll centre (the vertex) on screen
      const at = (deg: number) => ({ clientX: x + 150 * Math.cos((deg * Math.PI) / 180), clientY: y - 150 * Math.sin((deg * Math.PI) / 180), bubbles: true });
      const h = handle(el);

      // A move without a press does nothing.
      h.dispatchEvent(new TestPointerEvent('pointermove', at(45)));
      await fixture.whenStable();
      expect(readout(el, 'Stack H = 5 · sin θ')).toBe('1.2519 in');

      h.dispatchEvent(new TestPointerEvent('pointerdown', { ...at(14.5), button: 0, cancelable: true }));
      h.dispatchEvent(new TestPointerEvent('pointermove', at(22)));
      h.dispatchEvent(new TestPointerEvent('pointermove', at(30.1)));
      await fixture.whenStable();
      expect(h.classList).toContain('dragging');
      h.dispatchEvent(new TestPointerEvent('pointerup', at(30.1)));
      await fixture.whenStable();
      // 5 · sin 30° = 2.5 (derived: definition of the sine).
      expect(readout(el, 'sin θ')).toBe('0.5000');
      expect(readout(el, 'Stack H = 5 · sin θ')).toBe('2.5000 in');
      expect(await sliderValue()).toBe(30);
      expect(h.classList).not.toContain('dragging');

      // After letting go, moves no longer turn the arm.
      h.dispatchEvent(new TestPointerEvent('pointermove', at(50)));
      await fixture.whenStable();
      expect(await sliderValue()).toBe(30);
    });

    it('should clamp a drag past the end of the range to the end', async () => {
      const el = await show('over-pins');
      const svg = el.querySelector('svg')!;
      svg.getScreenCTM = () => ({ inverse: () => ({ a: 1, b: 0, c: 0, d: 1, e: 0, f: 0 }) }) as unknown as DOMMatrix;
      const h = handle(el);
      h.dispatchEvent(new TestPointerEvent('pointerdown', { clientX: 420, clientY: 150, button: 0, bubbles: true }));
      // Flank corner at (370, 230); a point up and a little left is past 90°, beyond the 70° end.
      h.dispatchEvent(new TestPointerEvent('pointermove', { clientX: 360, clientY: 120, bubbles: true }));
      h.dispatchEvent(new TestPointerEvent('pointerup', { clientX: 360, clientY: 120, bubbles: true }));
      await fixture.whenStable();
      expect(await sliderValue()).toBe(70);
      expect(h.getAttribute('aria-valuenow')).toBe('70');
    });
  });
});
