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
