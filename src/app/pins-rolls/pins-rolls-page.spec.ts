import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import PinsRollsPage, { trimDms } from './pins-rolls-page';

describe('PinsRollsPage', () => {
  let fixture: ComponentFixture<PinsRollsPage>;

  async function create(url = '/pins-rolls'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'pins-rolls', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(PinsRollsPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should show the demo dovetail’s reading over the rolls and draw it', async () => {
    await create();
    // REFERENCE.md §5.1, Machinery's Handbook "Measuring dovetail slides": 60°, D 0.375, a 1.250 → 2.2745.
    expect(resultValue('Reading over the rolls')).toBe('2.2745');
    const svg = el().querySelector('sw-roll-drawing svg');
    expect(svg?.querySelector('title')?.textContent).toContain('Male dovetail');
    expect(svg?.querySelectorAll('circle.roll')).toHaveLength(2);
    expect(svg?.textContent).toContain('x 2.2745 in');
    expect(svg?.textContent).toContain('α 60°');
  });

  it('should recompute as the user types a roll size', async () => {
    await create();
    await type('rollDiameter', '0.5');
    await type('width', '2');
    // REFERENCE.md §5.1 check value: 60°, D 0.500, a 2.000 → 3.3660.
    expect(resultValue('Reading over the rolls')).toBe('3.3660');
  });

  it('should put the schema’s message under a bad roll diameter and clear the results', async () => {
    await create();
    await type('rollDiameter', '-1');
    expect(fieldErrors()).toContain('Must be greater than 0');
    expect(el().querySelector('.no-results')).not.toBeNull();
    expect(el().querySelector('sw-roll-drawing')).toBeNull();
  });

  it('should warn when the roll would touch above the dovetail’s depth', async () => {
    await create();
    await type('depth', '0.2');
    // Contact height r·(1 + cos α) = 0.1875 · 1.5 = 0.28125 > 0.2 (derived).
    const warnings = Array.from(el().querySelectorAll('sw-warnings')).map((w) => w.textContent).join(' ');
    expect(warnings).toContain('use a smaller roll');
  });

  it('should restore a female dovetail from the URL', async () => {
    await create('/pins-rolls?side=female&rollDiameter=0.5&width=2.5&depth=');
    // REFERENCE.md §5.1 check value: 60°, D 0.500, b 2.500 → 1.1340.
    expect(resultValue('Reading between the rolls')).toBe('1.1340');
  });

  it('should give the pin’s height in a V-groove', async () => {
    await create('/pins-rolls?kind=v-groove&includedAngle=90&pinDiameter=0.5&grooveWidth=1');
    // Derived: 0.25 / sin 45° + 0.25 − 0.5 = 0.1036.
    expect(resultValue('Pin top over the surface')).toBe('0.1036');
    expect(el().querySelector('sw-roll-drawing svg title')?.textContent).toContain('V-groove');
  });

  it('should convert the entered lengths when switching to mm', async () => {
    await create();
    const mm = Array.from(el().querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.trim() === 'mm') as HTMLButtonElement;
    mm.click();
    await settle();
    expect((el().querySelector('input[formcontrolname="rollDiameter"]') as HTMLInputElement).value).toBe('9.525');
    // 31.75 + 9.525 × 2.7320508 = 57.7728 mm (derived).
    expect(resultValue('Reading over the rolls')).toBe('57.773');
  });

  describe('trimDms', () => {
    it('should drop zero places only at the end', () => {
      expect(trimDms(`60°00'00"`)).toBe('60°');
      expect(trimDms(`55°30'00"`)).toBe(`55°30'`);
      expect(trimDms(`1°26'16"`)).toBe(`1°26'16"`);
    });
  });

  function el(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  function resultValue(label: string): string | undefined {
    const row = Array.from(el().querySelectorAll('.result')).find((r) => r.querySelector('dt')?.textContent?.trim() === label);
    return row?.querySelector('.number')?.textContent?.trim();
  }

  function fieldErrors(): string {
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
