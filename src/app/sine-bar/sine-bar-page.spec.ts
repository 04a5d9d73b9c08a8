import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import SineBarPage from './sine-bar-page';

describe('SineBarPage', () => {
  let fixture: ComponentFixture<SineBarPage>;

  async function create(url = '/sine-bar'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'sine-bar', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(SineBarPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should give the demo sine-plate stack and draw its blocks', async () => {
    await create();
    // 5 · sin 14.5° = 5 · 0.25038 = 1.2519 in (REFERENCE.md §2 formula, derived).
    expect(resultValue('Stack height')).toBe('1.2519');
    const blocks = (resultValue('Blocks') ?? '').split(' + ');
    const sum = blocks.reduce((total, b) => total + Math.round(Number(b) * 10_000), 0);
    expect(sum).toBe(12_519);
    const labels = Array.from(el().querySelectorAll('svg .block-label')).map((t) => t.textContent);
    expect(labels).toEqual(blocks);
    expect(el().querySelector('svg title')?.textContent).toBe('Sine bar set-up drawing');
  });

  it('should give the angle of a typed stack', async () => {
    await create('/sine-bar?mode=stack&stackHeight=2.5&set=');
    // asin(2.5 / 5) = 30° exactly (derived).
    expect(resultValue('Angle')).toBe('30°00\'00"');
  });

  it('should show the schema message for an angle out of range', async () => {
    await create();
    await type('angle', '95');
    expect(fieldErrors()).toContain('Must be at least 0° and less than 90°');
  });

  it('should offer the complement set-up above 45°', async () => {
    await create();
    await type('angle', '60');
    expect(el().textContent).toContain('Complement set-up: bar at 30°00\'00"');
    expect(el().querySelectorAll('svg[role="img"]').length).toBe(2);
  });

  it('should list the table of stacks as a table and draw the row picked', async () => {
    await create('/sine-bar?mode=table');
    // 10° to 20° by 30′ on the 5 in plate: 21 rows; 5 · sin 14.5° = 1.2519 (derived).
    const rows = Array.from(el().querySelectorAll('table.stack-table tr.mat-mdc-row'));
    expect(rows.length).toBe(21);
    expect(rows[9].querySelector('td.mat-column-stack')?.textContent?.trim()).toBe('1.2519');
    (rows[9].querySelector('button.row-pick') as HTMLButtonElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    expect(Array.from(el().querySelectorAll('svg text')).map((t) => t.textContent)).toContain('H 1.2519 in');
    expect(rows[9].classList.contains('shown')).toBe(true);
  });

  it('should say on the step field when a table would be too long', async () => {
    await create('/sine-bar?mode=table&tableFrom=0&tableTo=80&tableStep=0.01');
    expect(fieldErrors()).toContain('Gives 8001 rows; the page lists at most 400');
    expect(el().querySelector('table.stack-table')).toBeNull();
  });

  it('should set a compound plate from two angles with a view of each plate', async () => {
    await create('/sine-bar?mode=compound');
    expect(resultValue('Stack A')).toBe('1.2519');
    expect(resultValue('Stack B')).toBe('0.8682');
    const titles = Array.from(el().querySelectorAll('svg[role="img"] > title')).map((t) => t.textContent);
    expect(titles).toEqual(['Lower plate, tilted about axis A (seen from the front)', 'Upper plate, tilted about axis B (seen from the side)']);
    await type('angleB', '-3');
    expect(fieldErrors()).toContain('Must be at least 0° and less than 90°');
    expect(el().querySelectorAll('svg[role="img"]').length).toBe(0);
  });

  it('should show the sensitivity with the stack', async () => {
    await create();
    // Δθ = 0.0001 / (5 · cos 14.5°) rad = 4.26″ (REFERENCE.md §2.4, derived).
    expect(resultValue('Sensitivity')).toBe('4.26');
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
  async function type(name: string, value: string): Promise<void> {
    const input = el().querySelector(`input[formcontrolname="${name}"]`) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await new Promise((resolve) => setTimeout(resolve, 150));
    fixture.detectChanges();
    await fixture.whenStable();
  }
});
