import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import TaperPage from './taper-page';

describe('TaperPage', () => {
  let fixture: ComponentFixture<TaperPage>;

  async function create(url = '/taper'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'taper', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(TaperPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should show the demo wedge\'s numbers and drawing on opening', async () => {
    await create();
    expect(resultValue('Depth to stop')).toBe('0.3263');
    expect(resultValue('End thickness')).toBe('0.4209');
    const svg = el().querySelector('svg[role="img"]');
    expect(svg?.querySelector('title')?.textContent).toBe('Taper set-up drawing');
    expect(svg?.textContent).toContain('0.3263 in');
    expect(svg?.textContent).toContain('Touch off');
  });

  it('should recompute as the user types', async () => {
    await create();
    await type('taperLength', '2');
    // 2 · sin 7.5° = 0.26105 (derived).
    expect(resultValue('Depth to stop')).toBe('0.2611');
  });

  it('should put the schema\'s message under a bad angle and clear the results', async () => {
    await create();
    await type('angle', '7°75\'');
    expect(fieldError()).toContain('Minutes must be below 60');
    expect(el().querySelector('.no-results')).not.toBeNull();
    expect(el().textContent).toContain('The drawing appears when the inputs give an answer.');
  });

  it('should say where a taper runs out through the bottom', async () => {
    await create();
    await type('taperLength', '9');
    expect(fieldError()).toContain('runs out through the bottom face');
  });

  it('should convert the entered lengths when switching to mm', async () => {
    await create();
    const mm = Array.from(el().querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.trim() === 'mm') as HTMLButtonElement;
    mm.click();
    await settle();
    expect((el().querySelector('input[formcontrolname="thickness"]') as HTMLInputElement).value).toBe('19.05');
    // 63.5 mm · sin 7.5° = 8.2883 mm (derived).
    expect(resultValue('Depth to stop')).toBe('8.288');
  });

  it('should restore the inputs from the URL', async () => {
    await create('/taper?thickness=1&angle=10&taperLength=2');
    // 2 · sin 10° = 0.34730 (derived).
    expect(resultValue('Depth to stop')).toBe('0.3473');
    TestBed.inject(HttpTestingController).verify();
  });

  it('should keep the numbers but change the set-up and drawing with the work-holding', async () => {
    await create('/taper?holding=sine-plate');
    expect(resultValue('Depth to stop')).toBe('0.3263');
    expect(el().querySelector('#holding-heading')?.textContent).toBe('Set-up on a sine plate');
    // 5 · sin 7.5° = 0.6526 in (derived).
    expect(el().querySelector('svg')?.textContent).toContain('0.6526 in stack');
    expect(el().querySelectorAll('svg circle.roll').length).toBe(2);
    await type('plateLength', 'x');
    expect(fieldError()).toContain('Must be a decimal number such as 0.750, got "x"');
  });

  it('should draw a tilting vise with its scale', async () => {
    await create('/taper?holding=tilted-vise');
    expect(resultValue('Depth to stop')).toBe('0.3263');
    expect(el().querySelector('svg path.scale')).not.toBeNull();
    expect(el().querySelector('.holding-plan li')?.textContent).toContain('Tilt the vise body to 7°30\'00"');
  });

  it('should name a bad part length under its box', async () => {
    await create();
    await type('partLength', '-5');
    expect(fieldError()).toContain('Must be greater than 0');
  });

  it('should say so in words when the sizes are too far apart to draw', async () => {
    await create('/taper?angle=0.00001');
    // 2.5 · sin 0.00001° rounds to 0.0000 in: the depth dimension has no length to draw.
    expect(resultValue('Depth to stop')).toBe('0.0000');
    expect(el().textContent).toContain('These sizes are too far apart to draw to scale; the numbers still hold.');
  });

  function el(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  function resultValue(label: string): string | undefined {
    const row = Array.from(el().querySelectorAll('.result')).find((r) => r.querySelector('dt')?.textContent?.trim() === label);
    return row?.querySelector('.number')?.textContent?.trim();
  }

  function fieldError(): string {
    return Array.from(el().querySelectorAll('mat-error')).map((e) => e.textContent ?? '').join(' | ');
  }

  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 150));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function type(name: string, value: string): Promise<void> {
    const input = el().querySelector(`input[formcontrolname="${name}"]`) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await settle();
  }
});
