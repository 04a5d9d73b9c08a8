import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSelect } from '@angular/material/select';
import { By } from '@angular/platform-browser';

import { DEMO_BOX, demoBoxAnswer, demoBoxWithBlocks, pageSpec } from '../workbench/testing/page-spec-harness';
import { setsInUnit } from './sine-bar-form';
import SineBarPage from './sine-bar-page';

describe('SineBarPage', () => {
  const page = pageSpec(SineBarPage, 'sine-bar');

  it('should give the demo sine-plate stack and draw its blocks', async () => {
    await page.open();
    // 5 · sin 14.5° = 5 · 0.25038 = 1.2519 in (REFERENCE.md §2 formula, derived).
    expect(page.resultValue('Stack height')).toBe('1.2519');
    const blocks = (page.resultValue('Blocks') ?? '').split(' + ');
    const sum = blocks.reduce((total, b) => total + Math.round(Number(b) * 10_000), 0);
    expect(sum).toBe(12_519);
    const labels = Array.from(page.el.querySelectorAll('svg .block-label')).map((t) => t.textContent);
    expect(labels).toEqual(blocks);
    expect(page.el.querySelector('svg title')?.textContent).toBe('Sine bar set-up drawing');
  });

  it('should give the angle of a typed stack', async () => {
    await page.open('/sine-bar?mode=stack&stackHeight=2.5&set=');
    // asin(2.5 / 5) = 30° exactly (derived).
    expect(page.resultValue('Angle')).toBe('30°00\'00"');
  });

  it('should show the schema message for an angle out of range', async () => {
    await page.open();
    await page.type('angle', '95', { blur: false });
    expect(page.fieldErrors()).toContain('Must be at least 0° and less than 90°');
  });

  it('should offer the complement set-up above 45°', async () => {
    await page.open();
    await page.type('angle', '60', { blur: false });
    expect(page.el.textContent).toContain('Complement set-up: bar at 30°00\'00"');
    expect(page.el.querySelectorAll('svg[role="img"]').length).toBe(2);
  });

  it('should say so when the box cannot make the complement\'s stack', async () => {
    await page.open('/sine-bar?angle=89');
    // 5 · sin 1° = 0.08726 → 0.0873 in (derived); the 81-piece set's thinnest block is 0.050 in and no
    // two of them make 0.0873, so the set cannot make it.
    const advice = page.el.querySelector('section.complement p')?.textContent ?? '';
    expect(advice).toContain('Stack 0.0873 in. The box cannot make a 0.0873 in stack; raise both rolls on equal stacks and build the difference, or change the angle slightly.');
  });

  it("should list the complement's blocks when the box can make its stack", async () => {
    await page.open('/sine-bar?angle=60');
    // 5 · sin 30° = 2.5000 in (derived); its blocks add up to it.
    const blocks = /Stack 2\.5000 in: (.+)\./.exec(page.el.querySelector('section.complement p')?.textContent ?? '')?.[1] ?? '';
    expect(blocks.split(' + ').reduce((t, b) => t + Math.round(Number(b) * 10_000), 0)).toBe(25_000);
  });

  it('should name the axis in each steep-angle warning of a compound plate', async () => {
    await page.open('/sine-bar?mode=compound&angle=60&angleB=60');
    const text = page.el.querySelector('.warnings')?.textContent ?? '';
    expect(text).toContain('Angle A is above 45°');
    expect(text).toContain('Angle B is above 45°');
  });

  it('should list the table of stacks as a table and draw the row picked', async () => {
    await page.open('/sine-bar?mode=table');
    // 10° to 20° by 30′ on the 5 in plate: 21 rows; 5 · sin 14.5° = 1.2519 (derived).
    const rows = Array.from(page.el.querySelectorAll('table.stack-table tr.mat-mdc-row'));
    expect(rows.length).toBe(21);
    expect(rows[9].querySelector('td.mat-column-stack')?.textContent?.trim()).toBe('1.2519');
    (rows[9].querySelector('button.row-pick') as HTMLButtonElement).click();
    await page.render();
    expect(Array.from(page.el.querySelectorAll('svg text')).map((t) => t.textContent)).toContain('H 1.2519 in');
    expect(rows[9].classList.contains('shown')).toBe(true);
  });

  it('should say on the step field when a table would be too long', async () => {
    await page.open('/sine-bar?mode=table&tableFrom=0&tableTo=80&tableStep=0.01');
    expect(page.fieldErrors()).toContain('Gives 8001 rows; the page lists at most 400');
    expect(page.el.querySelector('table.stack-table')).toBeNull();
  });

  it('should set a compound plate from two angles with a view of each plate', async () => {
    await page.open('/sine-bar?mode=compound');
    expect(page.resultValue('Stack A')).toBe('1.2519');
    expect(page.resultValue('Stack B')).toBe('0.8682');
    const titles = Array.from(page.el.querySelectorAll('svg[role="img"] > title')).map((t) => t.textContent);
    expect(titles).toEqual(['Lower plate, tilted about axis A (seen from the front)', 'Upper plate, tilted about axis B (seen from the side)']);
    await page.type('angleB', '-3', { blur: false });
    expect(page.fieldErrors()).toContain('Must be at least 0° and less than 90°');
    expect(page.el.querySelectorAll('svg[role="img"]').length).toBe(0);
  });

  it('should show the sensitivity with the stack', async () => {
    await page.open();
    // Δθ = 0.0001 / (5 · cos 14.5°) rad = 4.26″ (REFERENCE.md §2.4, derived).
    expect(page.resultValue('Sensitivity')).toBe('4.26');
  });
});

describe('SineBarPage with the team inventory', () => {
  const page = pageSpec(SineBarPage, 'sine-bar');
  let http: HttpTestingController;

  async function create(signedIn: boolean, url?: string): Promise<void> {
    await page.open(url, { signedIn });
    http = TestBed.inject(HttpTestingController);
  }

  afterEach(() => http.verify());

  it('should offer the team box first and pick the blocks of the stack height from it', async () => {
    // From the standard set 0.2507 in is 0.1007 + 0.150; the demo box has no 0.1007 (derived by hand).
    await create(true, '/sine-bar?mode=stack&stackHeight=0.2507');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    expect(await optionTexts()).toEqual(['No set: round to 0.0001 in', 'Our box: Inch 81-piece set, cabinet 2', ...setsInUnit('in').map((s) => s.name)]);
    await closeSelect();
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack');
    expect([req.request.params.get('target'), req.request.params.get('wear')]).toEqual(['0.2507', 'no']);
    req.flush(demoBoxAnswer('0.2507'));
    await page.settle();
    // asin(0.2507 / 5) = 2.8740° (derived).
    expect(page.resultValue('Angle')).toMatch(/^2°52'/);
    const blocks = (page.resultValue('Blocks') ?? '').split(' + ');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(2_507);
    expect(blocks).not.toContain('0.1007');
    expect(Array.from(page.el.querySelectorAll('svg .block-label')).map((t) => t.textContent)).toEqual(blocks);
    expect(page.el.querySelector('.box-note .left-out')?.textContent).toContain('0.1007 in (1 missing); 0.137 in (1 damaged)');
    expect(page.el.querySelector('input[formcontrolname="missing"]')).toBeNull();
  });

  it('should say what to do when the box cannot make the stack for the angle', async () => {
    // 5 in · sin 0.01° = 0.00087 in, rounded 0.0009 in (derived); no block in the box is that thin.
    await create(true, '/sine-bar?mode=angle&angle=0.01&set=box:7');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    http
      .expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack' && r.params.get('target') === '0.0009')
      .flush(
        { error: 'Gauge stack: target cannot be made from the blocks in the box (0.0009 in wanted)', fields: { target: 'cannot be made from the blocks in the box (0.0009 in wanted)' }, excluded: [] },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await page.settle();
    expect(page.el.querySelector('.warnings.problem')?.textContent).toContain(
      'The box cannot make a 0.0009 in stack; raise both rolls on equal stacks and build the difference, or change the angle slightly.',
    );
    expect(page.resultValue('Blocks')).toBe('none from the box');
  });

  it("should list each row's blocks from what is in the box, reading the box once and asking nothing per row", async () => {
    await create(true, '/sine-bar?mode=table&set=box:7');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    http.expectOne('/api/inventories/gauge-sets/7').flush(demoBoxWithBlocks());
    await page.settle();
    http.expectNone((r) => r.url.endsWith('/stack'));
    const rows = Array.from(page.el.querySelectorAll('table.stack-table tr.mat-mdc-row'));
    expect(rows.length).toBe(21);
    // Every row's blocks add up to its stack and never use the box's missing 0.1007 or damaged 0.137 (derived).
    for (const row of rows) {
      const stack = row.querySelector('td.mat-column-stack')?.textContent?.trim() ?? '';
      const blocks = (row.querySelector('td.mat-column-blocks')?.textContent?.trim() ?? '').split(' + ');
      expect(blocks.reduce((t, b) => t + Math.round(Number(b) * 10_000), 0)).toBe(Math.round(Number(stack) * 10_000));
      expect(blocks).not.toContain('0.1007');
      expect(blocks).not.toContain('0.137');
      expect(row.querySelector('td.mat-column-count')?.textContent?.trim()).toBe(String(blocks.length));
    }
    expect(page.el.querySelector('.box-note')?.textContent).toContain('picked from what is in the box now');
  });

  it('should pick both stacks of a compound plate from the box', async () => {
    await create(true, '/sine-bar?mode=compound&set=box:7');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    http.expectOne('/api/inventories/gauge-sets/7').flush(demoBoxWithBlocks());
    await page.settle();
    // Stack A 1.2519 in from the box (the default compound plate, as above); its blocks add up to it.
    const blocksA = (page.resultValue('Blocks A') ?? '').split(' + ');
    expect(blocksA.reduce((t, b) => t + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
    expect(blocksA).not.toContain('0.1007');
  });

  it('should give the two stacks of a compound plate different blocks from the box', async () => {
    // 14°30' on both axes: 1.2519 in each (derived); the box holds one block of each size.
    await create(true, `/sine-bar?mode=compound&angleB=${encodeURIComponent("14°30'")}&set=box:7`);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    http.expectOne('/api/inventories/gauge-sets/7').flush(demoBoxWithBlocks());
    await page.settle();
    const [a, b] = [(page.resultValue('Blocks A') ?? '').split(' + '), (page.resultValue('Blocks B') ?? '').split(' + ')];
    expect([a, b].map((blocks) => blocks.reduce((t, x) => t + Math.round(Number(x) * 10_000), 0))).toEqual([12_519, 12_519]);
    expect(new Set([...a, ...b]).size).toBe(a.length + b.length);
    expect([...a, ...b]).not.toContain('0.1007');
  });

  it("should pick the complement's blocks from the box, or say it cannot make them", async () => {
    // 89°: the complement 1° needs 0.0873 in (derived), which no blocks of the box make.
    await create(true, '/sine-bar?mode=angle&angle=89&set=box:7');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack').flush(demoBoxAnswer('4.9992'));
    http.expectOne('/api/inventories/gauge-sets/7').flush(demoBoxWithBlocks());
    await page.settle();
    expect(page.el.querySelector('section.complement p')?.textContent).toContain('Stack 0.0873 in. The box cannot make a 0.0873 in stack;');
  });

  it('should keep the standard sets only and ask nothing of the inventory for a visitor', async () => {
    await create(false);
    http.expectNone('/api/inventories');
    expect(await optionTexts()).toEqual(['No set: round to 0.0001 in', ...setsInUnit('in').map((s) => s.name)]);
    await closeSelect();
    expect(page.resultValue('Stack height')).toBe('1.2519');
    expect(page.el.querySelector('.box-note')).toBeNull();
  });

  async function optionTexts(): Promise<string[]> {
    const select = page.fixture.debugElement.queryAll(By.directive(MatSelect)).find((d) => d.attributes['formControlName'] === 'set');
    (select?.componentInstance as MatSelect).open();
    await page.render();
    return Array.from(document.querySelectorAll('mat-option')).map((o) => o.textContent?.trim() ?? '');
  }
  async function closeSelect(): Promise<void> {
    for (const d of page.fixture.debugElement.queryAll(By.directive(MatSelect))) (d.componentInstance as MatSelect).close();
    await page.render();
  }
});
