import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSelect } from '@angular/material/select';
import { By } from '@angular/platform-browser';

import { DEMO_BOX, DEMO_BOX_EXCLUDED, demoBoxAnswer, pageSpec } from '../workbench/testing/page-spec-harness';
import { gaugeSetsInUnit } from './gauge-blocks-form';
import GaugeBlocksPage from './gauge-blocks-page';

describe('GaugeBlocksPage', () => {
  const page = pageSpec(GaugeBlocksPage, 'gauge-blocks');

  it('should build the demo stack with blocks that add up, and draw both stacks', async () => {
    await page.open();
    const blocks = (page.resultValue('Fewest blocks') ?? '').split(' + ');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
    // The exact solver never needs more blocks than the textbook last-digit method (REFERENCE.md §3.2).
    const last = (page.resultValue('Last-digit method') ?? '').split(' + ');
    expect(blocks.length).toBeLessThanOrEqual(last.length);
    const titles = Array.from(page.el.querySelectorAll('svg .title')).map((t) => t.textContent);
    expect(titles).toEqual([`Fewest: ${blocks.length} blocks`, `Last-digit method: ${last.length} blocks`]);
  });

  it('should say which blocks are the wear blocks in the result text', async () => {
    await page.open('/gauge-blocks?target=2.75&wearBlocks=0.050');
    // 2.75 = 0.050 wear + 2.000 + 0.600 + 0.050 + 0.050 wear by the last digit: one 0.050 from the set,
    // the wear pair at the ends (derived; wear blocks at both ends is common practice).
    expect(page.resultValue('Last-digit method')).toBe('0.050 wear + 2.000 + 0.600 + 0.050 + 0.050 wear');
    expect(page.resultValue('Fewest blocks')).toMatch(/^0\.050 wear \+ .* \+ 0\.050 wear$/);
    expect(page.el.textContent).toContain('wear blocks at both ends');
  });

  it('should say "1 block" for a stack of one block', async () => {
    await page.open();
    // 0.500 in is a single block of the 81-piece set (REFERENCE.md §3.2).
    await page.type('target', '0.500');
    expect(page.resultValue('Fewest blocks')).toBe('0.500');
    expect(page.el.textContent).toContain('1 block, wringing order');
    expect(page.el.textContent).not.toContain('1 blocks');
  });

  it('should leave a missing block out of the stack', async () => {
    await page.open();
    const first = (page.resultValue('Fewest blocks') ?? '').split(' + ');
    await page.type('missing', first[first.length - 1], { blur: false });
    const again = (page.resultValue('Fewest blocks') ?? '').split(' + ');
    expect(again).not.toContain(first[first.length - 1]);
    expect(again.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
  });

  it('should name a block that is not in the box', async () => {
    await page.open();
    await page.type('missing', '0.7777', { blur: false });
    expect(page.fieldErrors()).toContain('There is no 0.7777 block left in the box');
  });

  it('should take a block temperature in °F when it ends with F', async () => {
    await page.open();
    await page.type('temperature', '77F', { blur: false });
    // 77 °F = 25 °C (definition of the scale).
    expect(page.el.textContent).toContain('Length at 25 °C');
  });

  it('should refuse a target finer than the box can make', async () => {
    await page.open();
    await page.type('target', '1.25195', { blur: false });
    expect(page.el.querySelector('.no-results')).not.toBeNull();
    // The 81-piece set steps by 0.0001 in: the stacks either side are 1.2519 and 1.2520 (derived).
    expect(page.fieldErrors()).toContain('its smallest step is 0.0001 in; the nearest stacks are 1.2519 and 1.2520 in');
  });
});

/** The inventory route's answer for the demo box, graded '0' and with its wear-block pair when `wear`. */
function boxAnswer(target: string, wear: boolean): object {
  return demoBoxAnswer(target, { grade: '0', wearBlocks: wear ? '0.050' : undefined });
}

describe('GaugeBlocksPage with the team inventory', () => {
  const page = pageSpec(GaugeBlocksPage, 'gauge-blocks');
  let http: HttpTestingController;

  async function create(signedIn: boolean, url?: string): Promise<void> {
    await page.open(url, { signedIn });
    http = TestBed.inject(HttpTestingController);
  }

  /** Signed in, the team box listed and its first stack (the default 1.2519 in) answered. */
  async function openWithBox(): Promise<void> {
    await create(true);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    flushStack('1.2519');
    await page.settle();
  }

  afterEach(() => http.verify());

  it('should list the team box first, choose it, ask the route with the target and show the blocks left out', async () => {
    await create(true);
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    const options = await optionTexts();
    expect(options[0]).toBe('Our box: Inch 81-piece set, cabinet 2');
    expect(options.slice(1)).toEqual(gaugeSetsInUnit('in').map((s) => s.name));
    await closeSelect();
    // The demo target first (default), then 0.2507, which the standard set makes as 0.1007 + 0.150.
    flushStack('1.2519');
    await page.settle();
    await page.type('target', '0.2507');
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack');
    expect(req.request.params.get('target')).toBe('0.2507');
    expect(req.request.params.get('wear')).toBe('no');
    expect(req.request.params.get('grade')).toBe('0');
    req.flush(boxAnswer('0.2507', false));
    await page.settle();
    const blocks = (page.resultValue('Fewest blocks') ?? '').split(' + ');
    expect(blocks).not.toContain('0.1007');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(2_507);
    expect(page.el.querySelector('.box-note .left-out')?.textContent).toContain('0.1007 in (1 missing); 0.137 in (1 damaged)');
    // Drawn like a standard set: one block per label, both stacks.
    const titles = Array.from(page.el.querySelectorAll('svg .title')).map((t) => t.textContent);
    expect(titles[0]).toBe(`Fewest: ${blocks.length} blocks`);
    // No temperature or typed missing list for the box: the inventory says what is missing.
    expect(page.el.querySelector('input[formcontrolname="missing"]')).toBeNull();
    expect(page.el.querySelector('input[formcontrolname="temperature"]')).toBeNull();
  });

  it('should drop the answer of a request a newer target has overtaken', async () => {
    await openWithBox();
    await page.type('target', '0.2507');
    const stale = http.expectOne((r) => r.url.endsWith('/stack') && r.params.get('target') === '0.2507');
    await page.type('target', '0.3507');
    expect(stale.cancelled).toBe(true);
    http.expectOne((r) => r.url.endsWith('/stack') && r.params.get('target') === '0.3507').flush(boxAnswer('0.3507', false));
    await page.settle();
    expect(page.resultValue('Stack length')).toBe('0.3507');
  });

  it('should show the route message when the box cannot make the target', async () => {
    await openWithBox();
    await page.type('target', '0.1007');
    http
      .expectOne((r) => r.url.endsWith('/stack'))
      .flush(
        { error: 'Gauge stack: target cannot be made from the blocks in the box (0.1007 in wanted)', fields: { target: 'cannot be made from the blocks in the box (0.1007 in wanted)' }, excluded: DEMO_BOX_EXCLUDED },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await page.settle();
    expect(page.el.querySelector('.warnings.problem')?.textContent).toContain('Stack length cannot be made from the blocks in the box (0.1007 in wanted).');
    expect(page.el.querySelector('.box-note .left-out')?.textContent).toContain('0.1007 in (1 missing)');
    expect(page.el.querySelector('.no-drawing')).not.toBeNull();
    // The refused field is marked too, as the results panel's "fix the highlighted inputs" says.
    expect(page.fieldErrors()).toContain('Stack length cannot be made from the blocks in the box (0.1007 in wanted).');
  });

  it('should write a size left out as the inventory does (0.050 in, not 0.05 in)', async () => {
    await openWithBox();
    await page.type('target', '0.2507');
    // The route sends sizes as stored: "0.05" for the 0.050 in block.
    http.expectOne((r) => r.url.endsWith('/stack')).flush({ ...(boxAnswer('0.2507', false) as object), excluded: [{ size: '0.05', missing: 2, damaged: 0 }] });
    await page.settle();
    expect(page.el.querySelector('.box-note .left-out')?.textContent).toContain('0.050 in (2 missing)');
  });

  it('should check the target in the browser before asking the server', async () => {
    await openWithBox();
    await page.type('target', 'abc');
    http.expectNone((r) => r.url.endsWith('/stack'));
    expect(page.fieldErrors()).toContain('Must be a decimal number such as 0.750, got "abc"');
    // Nothing asked, so nothing left out yet: the note still says the box has blocks out of use.
    expect(page.el.querySelector('.box-note .left-out')?.textContent).toContain('79 of 81 blocks usable (1 missing, 1 damaged)');
    expect(page.el.querySelector('.box-note')?.textContent).not.toContain('Every block of the box is usable');
  });

  it('should keep a set named in the URL and use the box\'s wear-block pair when chosen', async () => {
    await create(true, '/gauge-blocks?set=box:7&wearBlocks=0.050&target=2.0084');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    const req = http.expectOne((r) => r.url.endsWith('/gauge-sets/7/stack'));
    expect([req.request.params.get('target'), req.request.params.get('wear')]).toEqual(['2.0084', 'yes']);
    req.flush(boxAnswer('2.0084', true));
    await page.settle();
    const blocks = (page.resultValue('Fewest blocks') ?? '').split(' + ');
    expect([blocks[0], blocks[blocks.length - 1]]).toEqual(['0.050 wear', '0.050 wear']);
  });

  it('should fall back to the standard set for a box that is not the team\'s', async () => {
    await create(true, '/gauge-blocks?set=box:99');
    http.expectOne('/api/inventories').flush({ gaugeSets: [DEMO_BOX], angleSets: [] });
    await page.settle();
    http.expectNone((r) => r.url.endsWith('/stack'));
    expect(page.fixture.componentInstance['form'].controls.set.value).toBe('inch-81');
    expect(page.resultValue('Stack length')).toBe('1.2519');
    // Said, not silent: the box named is not used, and the set used instead is named.
    const problems = Array.from(page.el.querySelectorAll('sw-warnings')).map((w) => w.textContent).join(' ');
    expect(problems).toContain("The gauge-block box this page was opened with (no. 99) is not in your team's inventory");
    expect(problems).toContain('worked out from the Inch 81-piece set instead.');
    // Choosing another set ends the note.
    page.fixture.componentInstance['form'].controls.set.setValue('inch-36');
    await page.settle();
    expect(page.el.textContent).not.toContain('(no. 99)');
  });

  it('should ask a visitor with a link to a team box to sign in, and say which set is used meanwhile', async () => {
    await create(false, '/gauge-blocks?set=box:7');
    http.expectNone('/api/inventories');
    expect(page.fixture.componentInstance['form'].controls.set.value).toBe('inch-81');
    expect(page.el.textContent).toContain("This page was opened with a team's gauge-block box (no. 7): sign in to use it. The stack below is worked out from the Inch 81-piece set instead.");
  });

  it('should keep the standard sets only and ask nothing of the inventory for a visitor', async () => {
    await create(false);
    http.expectNone('/api/inventories');
    expect(await optionTexts()).toEqual(gaugeSetsInUnit('in').map((s) => s.name));
    await closeSelect();
    expect(page.el.querySelector('.box-note')).toBeNull();
    expect((page.resultValue('Fewest blocks') ?? '').split(' + ').reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
  });

  function flushStack(target: string): void {
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/7/stack');
    expect(req.request.params.get('target')).toBe(target);
    req.flush(boxAnswer(target, req.request.params.get('wear') === 'yes'));
  }
  async function optionTexts(): Promise<string[]> {
    const trigger = page.el.querySelector('mat-select[formcontrolname="set"] .mat-mdc-select-trigger') as HTMLElement;
    if (!document.querySelector('mat-option')) trigger.click();
    await page.render();
    return Array.from(document.querySelectorAll('mat-option')).map((o) => o.textContent?.trim() ?? '');
  }
  async function closeSelect(): Promise<void> {
    (page.fixture.debugElement.query(By.directive(MatSelect)).componentInstance as MatSelect).close();
    await page.render();
  }
});
