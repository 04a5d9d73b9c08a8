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
import { gaugeSetsInUnit } from './gauge-blocks-form';
import GaugeBlocksPage from './gauge-blocks-page';

describe('GaugeBlocksPage', () => {
  let fixture: ComponentFixture<GaugeBlocksPage>;

  async function create(url = '/gauge-blocks'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'gauge-blocks', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(GaugeBlocksPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should build the demo stack with blocks that add up, and draw both stacks', async () => {
    await create();
    const blocks = (resultValue('Fewest blocks') ?? '').split(' + ');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
    // The exact solver never needs more blocks than the textbook last-digit method (REFERENCE.md §3.2).
    const last = (resultValue('Last-digit method') ?? '').split(' + ');
    expect(blocks.length).toBeLessThanOrEqual(last.length);
    const titles = Array.from(el().querySelectorAll('svg .title')).map((t) => t.textContent);
    expect(titles).toEqual([`Fewest: ${blocks.length} blocks`, `Last-digit method: ${last.length} blocks`]);
  });

  it('should leave a missing block out of the stack', async () => {
    await create();
    const first = (resultValue('Fewest blocks') ?? '').split(' + ');
    await type('missing', first[first.length - 1]);
    const again = (resultValue('Fewest blocks') ?? '').split(' + ');
    expect(again).not.toContain(first[first.length - 1]);
    expect(again.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
  });

  it('should name a block that is not in the box', async () => {
    await create();
    await type('missing', '0.7777');
    expect(fieldErrors()).toContain('There is no 0.7777 block left in the box');
  });

  it('should refuse a target finer than the box can make', async () => {
    await create();
    await type('target', '1.25195');
    expect(el().querySelector('.no-results')).not.toBeNull();
    expect(fieldErrors()).not.toBe('');
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
function boxAnswer(target: string, wear: boolean): object {
  const set = findGaugeSet('inch-81');
  if (!set) throw new Error('inch-81 missing from the standard sets');
  const gone = new Set(EXCLUDED.map((b) => Number(b.size)));
  const blocks = set.blocks.filter((b) => !gone.has(Number(b.size))).map((b) => ({ size: b.size, count: b.count }));
  const r = calculateGaugeStack({ target, unit: 'in', blocks, grade: '0', wearBlocks: wear ? '0.050' : undefined });
  if (!r.ok) throw new Error(r.error);
  return { ...r.value, inventory: { id: DEMO_BOX.id, name: DEMO_BOX.name, version: 3 }, excluded: EXCLUDED };
}

describe('GaugeBlocksPage with the team inventory', () => {
  let fixture: ComponentFixture<GaugeBlocksPage>;
  let http: HttpTestingController;

  async function create(signedIn: boolean, url = '/gauge-blocks'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'gauge-blocks', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    const loading = TestBed.inject(Auth).load();
    http.expectOne('/api/auth/session').flush({ user: signedIn ? { id: 4, email: 'machinist@demo.test', name: 'Demo machinist', role: 'machinist' } : null });
    await loading;
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(GaugeBlocksPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  it('should list the team box first, choose it, ask the route with the target and show the blocks left out', async () => {
    await create(true);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    const options = await optionTexts();
    expect(options[0]).toBe('Our box: Inch 81-piece set, cabinet 2');
    expect(options.slice(1)).toEqual(gaugeSetsInUnit('in').map((s) => s.name));
    await closeSelect();
    // The demo target first (default), then 0.2507, which the standard set makes as 0.1007 + 0.150.
    flushStack('1.2519');
    await settle();
    await type('target', '0.2507');
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack');
    expect(req.request.params.get('target')).toBe('0.2507');
    expect(req.request.params.get('wear')).toBe('no');
    expect(req.request.params.get('grade')).toBe('0');
    req.flush(boxAnswer('0.2507', false));
    await settle();
    const blocks = (resultValue('Fewest blocks') ?? '').split(' + ');
    expect(blocks).not.toContain('0.1007');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(2_507);
    expect(el().querySelector('.box-note .left-out')?.textContent).toContain('0.1007 in (1 missing); 0.137 in (1 damaged)');
    // Drawn like a standard set: one block per label, both stacks.
    const titles = Array.from(el().querySelectorAll('svg .title')).map((t) => t.textContent);
    expect(titles[0]).toBe(`Fewest: ${blocks.length} blocks`);
    // No temperature or typed missing list for the box: the inventory says what is missing.
    expect(el().querySelector('input[formcontrolname="missing"]')).toBeNull();
    expect(el().querySelector('input[formcontrolname="temperature"]')).toBeNull();
  });

  it('should drop the answer of a request a newer target has overtaken', async () => {
    await create(true);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    flushStack('1.2519');
    await settle();
    await type('target', '0.2507');
    const stale = http.expectOne((r) => r.url.endsWith('/stack') && r.params.get('target') === '0.2507');
    await type('target', '0.3507');
    expect(stale.cancelled).toBe(true);
    http.expectOne((r) => r.url.endsWith('/stack') && r.params.get('target') === '0.3507').flush(boxAnswer('0.3507', false));
    await settle();
    expect(resultValue('Stack length')).toBe('0.3507');
  });

  it('should show the route message when the box cannot make the target', async () => {
    await create(true);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    flushStack('1.2519');
    await settle();
    await type('target', '0.1007');
    http
      .expectOne((r) => r.url.endsWith('/stack'))
      .flush(
        { error: 'Gauge stack: target cannot be made from the blocks in the box (0.1007 in wanted)', fields: { target: 'cannot be made from the blocks in the box (0.1007 in wanted)' }, excluded: EXCLUDED },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await settle();
    expect(el().querySelector('.warnings.problem')?.textContent).toContain('Stack length cannot be made from the blocks in the box (0.1007 in wanted).');
    expect(el().querySelector('.box-note .left-out')?.textContent).toContain('0.1007 in (1 missing)');
    expect(el().querySelector('.no-drawing')).not.toBeNull();
  });

  it('should check the target in the browser before asking the server', async () => {
    await create(true);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    flushStack('1.2519');
    await settle();
    await type('target', 'abc');
    http.expectNone((r) => r.url.endsWith('/stack'));
    expect(fieldErrors()).toContain('Must be a decimal number such as 0.750, got "abc"');
  });

  it('should keep a set named in the URL and use the box\'s wear-block pair when chosen', async () => {
    await create(true, '/gauge-blocks?set=box:7&wearBlocks=0.050&target=2.0084');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    const req = http.expectOne((r) => r.url.endsWith('/gauge-sets/7/stack'));
    expect([req.request.params.get('target'), req.request.params.get('wear')]).toEqual(['2.0084', 'yes']);
    req.flush(boxAnswer('2.0084', true));
    await settle();
    const blocks = (resultValue('Fewest blocks') ?? '').split(' + ');
    expect([blocks[0], blocks[blocks.length - 1]]).toEqual(['0.050', '0.050']);
  });

  it('should fall back to the standard set for a box that is not the team\'s', async () => {
    await create(true, '/gauge-blocks?set=box:99');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await settle();
    http.expectNone((r) => r.url.endsWith('/stack'));
    expect(fixture.componentInstance['form'].controls.set.value).toBe('inch-81');
    expect(resultValue('Stack length')).toBe('1.2519');
  });

  it('should keep the standard sets only and ask nothing of the inventory for a visitor', async () => {
    await create(false);
    http.expectNone('/api/inventories');
    expect(await optionTexts()).toEqual(gaugeSetsInUnit('in').map((s) => s.name));
    await closeSelect();
    expect(el().querySelector('.box-note')).toBeNull();
    expect((resultValue('Fewest blocks') ?? '').split(' + ').reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
  });

  function flushStack(target: string): void {
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack');
    expect(req.request.params.get('target')).toBe(target);
    req.flush(boxAnswer(target, req.request.params.get('wear') === 'yes'));
  }
  function el(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 150));
    fixture.detectChanges();
    await fixture.whenStable();
  }
  async function optionTexts(): Promise<string[]> {
    const trigger = el().querySelector('mat-select[formcontrolname="set"] .mat-mdc-select-trigger') as HTMLElement;
    if (!document.querySelector('mat-option')) trigger.click();
    fixture.detectChanges();
    await fixture.whenStable();
    return Array.from(document.querySelectorAll('mat-option')).map((o) => o.textContent?.trim() ?? '');
  }
  async function closeSelect(): Promise<void> {
    (fixture.debugElement.query(By.directive(MatSelect)).componentInstance as MatSelect).close();
    fixture.detectChanges();
    await fixture.whenStable();
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
    input.dispatchEvent(new Event('blur'));
    await settle();
  }
});
