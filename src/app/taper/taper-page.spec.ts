import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { pageSpec } from '../workbench/testing/page-spec-harness';
import TaperPage from './taper-page';

describe('TaperPage', () => {
  const page = pageSpec(TaperPage, 'taper');

  it('should show the demo wedge\'s numbers and drawing on opening', async () => {
    await page.open();
    expect(page.resultValue('Depth to stop')).toBe('0.3263');
    expect(page.resultValue('End thickness')).toBe('0.4209');
    const svg = page.el.querySelector('svg[role="img"]');
    expect(svg?.querySelector('title')?.textContent).toBe('Taper set-up drawing');
    expect(svg?.textContent).toContain('0.3263 in');
    expect(svg?.textContent).toContain('Touch off');
  });

  it('should recompute as the user types', async () => {
    await page.open();
    await page.type('taperLength', '2');
    // 2 · sin 7.5° = 0.26105 (derived).
    expect(page.resultValue('Depth to stop')).toBe('0.2611');
  });

  it('should put the schema\'s message under a bad angle and clear the results', async () => {
    await page.open();
    await page.type('angle', '7°75\'');
    expect(page.fieldErrors()).toContain('Minutes must be below 60');
    expect(page.el.querySelector('.no-results')).not.toBeNull();
    expect(page.el.textContent).toContain('The drawing appears when the inputs give an answer.');
  });

  it('should say where a taper runs out through the bottom', async () => {
    await page.open();
    await page.type('taperLength', '9');
    expect(page.fieldErrors()).toContain('runs out through the bottom face');
  });

  it('should convert the entered lengths when switching to mm', async () => {
    await page.open();
    const mm = Array.from(page.el.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.trim() === 'mm') as HTMLButtonElement;
    mm.click();
    await page.settle();
    expect((page.el.querySelector('input[formcontrolname="thickness"]') as HTMLInputElement).value).toBe('19.05');
    // 63.5 mm · sin 7.5° = 8.2883 mm (derived).
    expect(page.resultValue('Depth to stop')).toBe('8.288');
  });

  it('should restore the inputs from the URL', async () => {
    await page.open('/taper?thickness=1&angle=10&taperLength=2');
    // 2 · sin 10° = 0.34730 (derived).
    expect(page.resultValue('Depth to stop')).toBe('0.3473');
    TestBed.inject(HttpTestingController).verify();
  });

  it('should keep the numbers but change the set-up and drawing with the work-holding', async () => {
    await page.open('/taper?holding=sine-plate');
    expect(page.resultValue('Depth to stop')).toBe('0.3263');
    expect(page.el.querySelector('#holding-heading')?.textContent).toBe('Set-up on a sine plate');
    // 5 · sin 7.5° = 0.6526 in (derived).
    expect(page.el.querySelector('svg')?.textContent).toContain('0.6526 in stack');
    expect(page.el.querySelectorAll('svg circle.roll').length).toBe(2);
    await page.type('plateLength', 'x');
    expect(page.fieldErrors()).toContain('Must be a decimal number such as 0.750, got "x"');
  });

  it('should warn when the taper is longer than the part', async () => {
    await page.open('/taper?partLength=1');
    expect(page.el.textContent).toContain('The taper length (2.5000 in) is longer than the part (1 in): check both against the drawing.');
    await page.type('partLength', '4');
    expect(page.el.textContent).not.toContain('is longer than the part');
  });

  it('should offer the print sheet only while the inputs give an answer', async () => {
    await page.open();
    const print = () => Array.from(page.el.querySelectorAll('button')).find((b) => b.textContent?.includes('Print sheet')) as HTMLButtonElement;
    expect(print().disabled).toBe(false);
    await page.type('thickness', 'abc');
    expect(print().disabled).toBe(true);
    await page.type('thickness', '0.75');
    expect(print().disabled).toBe(false);
  });

  it('should draw a tilting vise with its scale', async () => {
    await page.open('/taper?holding=tilted-vise');
    expect(page.resultValue('Depth to stop')).toBe('0.3263');
    expect(page.el.querySelector('svg path.scale')).not.toBeNull();
    expect(page.el.querySelector('.holding-plan li')?.textContent).toContain('Tilt the vise body to 7°30\'00"');
  });

  it('should ask for the newly shown size under its own box when "Defined by" changes', async () => {
    await page.open('/taper?given=angle-end');
    // Not typed in yet: not marked red, but the results say what to type.
    expect(page.fieldErrors()).not.toMatch(/required/i);
    expect(page.el.querySelector('.no-results')?.textContent).toContain('Type the end thickness to see the results.');
    expect(page.fieldErrors()).not.toMatch(/exactly two/);
    await page.type('endThickness', '0.5');
    // t = T − L·tan α → L = (0.750 − 0.5)/tan 7.5° = 1.8989 (derived); h = L·sin α = 0.2479 in.
    expect(page.resultValue('Depth to stop')).toBe('0.2479');
  });

  it('should carry the sizes of the last answer into the boxes a switch of "Defined by" shows', async () => {
    await page.open();
    // The demo wedge: 7°30' over 2.5 in on 0.75 in stock; t = 0.75 − 2.5 · tan 7.5° = 0.4209 in (derived).
    expect(page.resultValue('End thickness')).toBe('0.4209');
    page.fixture.componentInstance['form'].controls.given.setValue('angle-end');
    await page.render();
    expect((page.el.querySelector('input[formcontrolname="endThickness"]') as HTMLInputElement).value).toBe('0.4209');
    // The same part, now defined by its angle and end thickness: the same depth to stop (2.5 · sin 7.5° = 0.3263 in, derived).
    expect(page.resultValue('Depth to stop')).toBe('0.3263');
  });

  it('should name the chamfer\'s leg when it is missing', async () => {
    await page.open('/taper?shape=chamfer&given=angle-end');
    expect(page.el.querySelector('.no-results')?.textContent).toMatch(/type the leg on the end face to see the results/i);
    // Once typed in and emptied again, the box itself says it.
    await page.type('endThickness', '0.1');
    await page.type('endThickness', '');
    expect(page.fieldErrors()).toMatch(/required: type the leg on the end face/i);
    expect(page.el.querySelector('.no-results')?.textContent).toContain('Fix the highlighted inputs to see the results.');
  });

  it('should name a bad part length under its box', async () => {
    await page.open();
    await page.type('partLength', '-5');
    expect(page.fieldErrors()).toContain('Must be greater than 0');
  });

  it('should warn of a knife edge when the end thickness comes out at zero', async () => {
    await page.open('/taper?thickness=1&angle=45&taperLength=0.99996');
    // t = 1 − 0.99996 · tan 45° = 0.00004 in, read 0.0000 in (derived).
    expect(page.resultValue('End thickness')).toBe('0.0000');
    expect(page.el.textContent).toContain('The taper runs out at the bottom edge of the end, to within 0.0001 in: it leaves a knife edge.');
  });

  it('should not give the steps of a sine-plate stack the set cannot make', async () => {
    await page.open('/taper?holding=sine-plate&angle=0.5');
    // 5 · sin 0.5° = 0.0436 in, thinner than any block of the 81-piece set (derived).
    const steps = page.el.querySelector('.holding-plan')?.textContent ?? '';
    expect(steps).toContain('cannot make the 0.0436 in stack');
    expect(steps).not.toContain('Wring a 0.0436 in stack');
    expect(steps).not.toContain('the hinge roll stays where it is');
    expect(page.el.textContent).not.toContain('raise both rolls');
  });

  it('should say so in words when the sizes are too far apart to draw', async () => {
    await page.open('/taper?angle=0.00001');
    // 2.5 · sin 0.00001° rounds to 0.0000 in: the depth dimension has no length to draw.
    expect(page.resultValue('Depth to stop')).toBe('0.0000');
    expect(page.el.textContent).toContain('These sizes are too far apart to draw to scale; the numbers still hold.');
    expect(page.el.textContent).toContain('The taper is too small to cut at 0.0001 in');
  });
});
