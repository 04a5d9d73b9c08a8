import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSelect } from '@angular/material/select';
import { By } from '@angular/platform-browser';
import { Router, provideRouter } from '@angular/router';

import type { InventorySetDto } from '../../../shared/api/inventory';
import { calculateGaugeStack } from '../../../shared/calc/gauge-stack';
import { findGaugeSet } from '../../../shared/data/gauge-sets';
import { Auth } from '../core/auth';
import { setsInUnit } from './sine-bar-form';
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

/** The demo team's inch box as GET /api/inventories lists it (demo seed: .1007 missing, .137 damaged). */
const DEMO_BOX: InventorySetDto = {
  id: 7, type: 'gauge-blocks', name: 'Inch 81-piece set, cabinet 2', unit: 'in', standardSet: 'inch-81', grade: '0',
  wearBlockSize: '0.050', wearBlockCount: 2, notes: '', version: 3,
  totals: { sizes: 81, blocks: 81, missing: 1, damaged: 1, available: 79 }, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z',
};
const EXCLUDED = [{ size: '0.1007', missing: 1, damaged: 0 }, { size: '0.137', missing: 0, damaged: 1 }];

/** What the inventory route answers for the demo box: the shared engine on the blocks left (as the server does). */
function boxAnswer(target: string): object {
  const set = findGaugeSet('inch-81');
  if (!set) throw new Error('inch-81 missing from the standard sets');
  const gone = new Set(EXCLUDED.map((b) => Number(b.size)));
  const r = calculateGaugeStack({ target, unit: 'in', blocks: set.blocks.filter((b) => !gone.has(Number(b.size))).map((b) => ({ size: b.size, count: b.count })) });
  if (!r.ok) throw new Error(r.error);
  return { ...r.value, inventory: { id: 7, name: DEMO_BOX.name, version: 3 }, excluded: EXCLUDED };
}

describe('SineBarPage with the team inventory', () => {
  let fixture: ComponentFixture<SineBarPage>;
  let http: HttpTestingController;

  async function create(signedIn: boolean, url = '/sine-bar'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'sine-bar', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const loading = TestBed.inject(Auth).load();
    http.expectOne('/api/auth/session').flush({ user: signedIn ? { id: 4, email: 'machinist@demo.test', name: 'Demo machinist', role: 'machinist' } : null });
    await loading;
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(SineBarPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  it('should offer the team box first and pick the blocks of the stack height from it', async () => {
    // From the standard set 0.2507 in is 0.1007 + 0.150; the demo box has no 0.1007 (derived by hand).
    await create(true, '/sine-bar?mode=stack&stackHeight=0.2507');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    expect(await optionTexts()).toEqual(['No set: round to 0.0001 in', 'Our box: Inch 81-piece set, cabinet 2', ...setsInUnit('in').map((s) => s.name)]);
    await closeSelect();
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack');
    expect([req.request.params.get('target'), req.request.params.get('wear')]).toEqual(['0.2507', 'no']);
    req.flush(boxAnswer('0.2507'));
    await settle();
    // asin(0.2507 / 5) = 2.8740° (derived).
    expect(resultValue('Angle')).toMatch(/^2°52'/);
    const blocks = (resultValue('Blocks') ?? '').split(' + ');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(2_507);
    expect(blocks).not.toContain('0.1007');
    expect(Array.from(el().querySelectorAll('svg .block-label')).map((t) => t.textContent)).toEqual(blocks);
    expect(el().querySelector('.box-note .left-out')?.textContent).toContain('0.1007 in (1 missing); 0.137 in (1 damaged)');
    expect(el().querySelector('input[formcontrolname="missing"]')).toBeNull();
  });

  it('should list stacks without blocks for the box in the table, asking nothing per row', async () => {
    await create(true, '/sine-bar?mode=table&set=box:7');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    http.expectNone((r) => r.url.endsWith('/stack'));
    expect(el().querySelectorAll('table.stack-table tr.mat-mdc-row').length).toBe(21);
    expect(el().querySelector('.box-note')?.textContent).toContain('picked for one setting at a time');
  });

  it('should keep the standard sets only and ask nothing of the inventory for a visitor', async () => {
    await create(false);
    http.expectNone('/api/inventories');
    expect(await optionTexts()).toEqual(['No set: round to 0.0001 in', ...setsInUnit('in').map((s) => s.name)]);
    await closeSelect();
    expect(resultValue('Stack height')).toBe('1.2519');
    expect(el().querySelector('.box-note')).toBeNull();
  });

  function el(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 150));
    fixture.detectChanges();
    await fixture.whenStable();
  }
  async function optionTexts(): Promise<string[]> {
    const select = fixture.debugElement.queryAll(By.directive(MatSelect)).find((d) => d.attributes['formControlName'] === 'set');
    (select?.componentInstance as MatSelect).open();
    fixture.detectChanges();
    await fixture.whenStable();
    return Array.from(document.querySelectorAll('mat-option')).map((o) => o.textContent?.trim() ?? '');
  }
  async function closeSelect(): Promise<void> {
    for (const d of fixture.debugElement.queryAll(By.directive(MatSelect))) (d.componentInstance as MatSelect).close();
    fixture.detectChanges();
    await fixture.whenStable();
  }
  function resultValue(label: string): string | undefined {
    const row = Array.from(el().querySelectorAll('.result')).find((r) => r.querySelector('dt')?.textContent?.trim() === label);
    return row?.querySelector('.number')?.textContent?.trim();
  }
  async function type(name: string, value: string): Promise<void> {
    const input = el().querySelector(`input[formcontrolname="${name}"]`) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await settle();
  }
});
