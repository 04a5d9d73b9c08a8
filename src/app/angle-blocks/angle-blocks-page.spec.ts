import { ANGLE_BLOCK_SETS } from '../../../shared/data/angle-block-sets';
import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { InventorySetDto } from '../../../shared/api/inventory';
import { pageSpec } from '../workbench/testing/page-spec-harness';
import AngleBlocksPage, { angleBlocksRequest } from './angle-blocks-page';

/** An invented team box of three angle blocks (sizes in seconds of arc), the 1° block marked missing. */
function box(missing1: number): InventorySetDto {
  const block = (id: number, size: number, label: string, missing = 0) => ({ id, size: String(size), label, count: 1, missing, damaged: 0, available: 1 - missing, note: '' });
  return {
    id: 2, type: 'angle-blocks', name: 'Bench box', unit: 'arcsec', standardSet: null, grade: null, wearBlockSize: null, wearBlockCount: 0, notes: '', version: 1,
    totals: { sizes: 3, blocks: 3, missing: missing1, damaged: 0, available: 3 - missing1 },
    blocks: [block(1, 54_000, '15°'), block(2, 10_800, '3°'), block(3, 3_600, '1°', missing1)],
  } as InventorySetDto;
}

describe('AngleBlocksPage', () => {
  const page = pageSpec(AngleBlocksPage, 'angle-blocks');

  it('should make 17°35′ exactly with no more blocks than the hand combination, and draw them', async () => {
    await page.open();
    // REFERENCE.md §6 [DER]: 17°35′ by hand with the 13-piece set takes six blocks.
    expect(page.resultValue('Angle the blocks make')).toBe(`17°35'00"`);
    expect(page.resultValue('Error')).toBe('0.00');
    const count = Number(page.resultValue('Number of blocks'));
    expect(count).toBeLessThanOrEqual(6);
    const svg = page.el.querySelector('sw-angle-stack-drawing svg');
    expect(svg?.querySelectorAll('path.block')).toHaveLength(count);
    expect(svg?.querySelectorAll('path.block.reversed').length).toBeGreaterThan(0);
    expect(svg?.querySelector('title')?.textContent).toBe('Angle blocks wrung together, making 17°35′');
  });

  it('should find 3° − 1° for 2° as the user types', async () => {
    await page.open();
    await page.type('angle', '2');
    // REFERENCE.md §6 [DER]: 2° = 3° − 1°, two blocks.
    expect(page.resultValue('Blocks')).toBe('3° − 1°');
    expect(page.resultValue('Number of blocks')).toBe('2');
  });

  it('should put the angle reader’s message under a bad angle', async () => {
    await page.open();
    await page.type('angle', '17°75');
    expect(page.fieldErrors()).toContain('Minutes must be below 60');
    expect(page.el.querySelector('.no-results')).not.toBeNull();
  });

  it('should total a combination from the URL, drawing reversed blocks reversed', async () => {
    await page.open(`/angle-blocks?mode=total&combination=${encodeURIComponent('41° − 27° + 3°')}`);
    // REFERENCE.md §6 [DER]: 41 − 27 + 3 = 17°.
    expect(page.resultValue('Angle the blocks make')).toBe(`17°00'00"`);
    expect(page.el.querySelectorAll('sw-angle-stack-drawing path.block.reversed')).toHaveLength(1);
  });

  it('should say blocks that cancel make 0°, not that the reversed ones outweigh the rest', async () => {
    await page.open(`/angle-blocks?mode=total&set=angle-16&combination=${encodeURIComponent('45° − 30° − 15°')}`);
    // 45 − 30 − 15 = 0° (lab sheet rule, REFERENCE.md §6).
    expect(page.resultValue('Angle the blocks make')).toBe(`0°00'00"`);
    expect(page.el.textContent).toContain('The reversed blocks cancel the added ones: the combination makes 0°, a level face.');
    expect(page.el.textContent).not.toContain('outweigh');
  });

  it('should copy found blocks into the combination box', async () => {
    await page.open();
    const button = Array.from(page.el.querySelectorAll('button')).find((b) => b.textContent?.includes('Check or change these blocks')) as HTMLButtonElement;
    button.click();
    await page.settle();
    const box = page.el.querySelector('input[formcontrolname="combination"]') as HTMLInputElement;
    expect(box.value).toMatch(/^27° − /);
    expect(page.resultValue('Angle the blocks make')).toBe(`17°35'00"`);
  });

  describe('angleBlocksRequest', () => {
    it('should name the combination field when the sum cannot be read', () => {
      const r = angleBlocksRequest({ mode: 'total', set: 'angle-13-npl', angle: '', combination: '27° −' });
      expect(r).toMatchObject({ ok: false, fields: { combination: expect.stringContaining('sign with no block') } });
    });

    it('should refuse a block the set does not hold', () => {
      const r = angleBlocksRequest({ mode: 'total', set: 'angle-13-npl', angle: '', combination: '41° + 5°' });
      expect(r).toMatchObject({ ok: false, fields: { 'combination.1.angle': expect.stringContaining('is not in the set, or is marked missing or damaged') } });
    });
  });

  describe('with one of the team\'s boxes', () => {
    let http: HttpTestingController;
    afterEach(() => http.verify());

    async function openWithBox(missing1: number, url: string): Promise<void> {
      await page.open(url, { signedIn: true });
      http = TestBed.inject(HttpTestingController);
      http.expectOne('/api/inventories/angle-sets/2').flush(box(missing1));
      http.expectOne('/api/inventories').flush({ gaugeSets: [], angleSets: [{ ...box(missing1), blocks: undefined }] });
      await page.settle();
    }

    it('should make 17° from the blocks in the box: 15° + 3° − 1° (derived)', async () => {
      await openWithBox(0, `/angle-blocks?set=box:2&angle=17`);
      expect(page.resultValue('Blocks')).toBe('15° + 3° − 1°');
      expect(page.resultValue('Error')).toBe('0.00');
      expect(page.el.textContent).toContain('3 of 3 blocks usable');
    });

    it('should leave the missing 1° block out and give the nearest the box can make, 18° (derived)', async () => {
      await openWithBox(1, `/angle-blocks?set=box:2&angle=17`);
      expect(page.resultValue('Blocks')).toBe('15° + 3°');
      expect(page.resultValue('Angle the blocks make')).toBe(`18°00'00"`);
      expect(page.el.textContent).toContain('2 of 3 blocks usable (1 missing)');
    });

    it('should say so when the box named is not the team\'s, and name the set used instead', async () => {
      await page.open('/angle-blocks?set=box:9&angle=17', { signedIn: true });
      http = TestBed.inject(HttpTestingController);
      http.expectOne('/api/inventories/angle-sets/9').flush({ error: 'No block set with that id in your team.' }, { status: 404, statusText: 'Not Found' });
      http.expectOne('/api/inventories').flush({ gaugeSets: [], angleSets: [] });
      await page.settle();
      expect(page.fixture.componentInstance['form'].controls.set.value).toBe('angle-13-npl');
      const set = ANGLE_BLOCK_SETS.find((s) => s.id === 'angle-13-npl')!.name;
      expect(page.el.textContent).toContain(`The angle-block box this page was opened with (no. 9) is not in your team's inventory: it was deleted or belongs to another team. The blocks below are worked out from the ${set} instead.`);
      // Choosing a set ends the note.
      page.fixture.componentInstance['form'].controls.set.setValue('box:2');
      http.expectOne('/api/inventories/angle-sets/2').flush(box(0));
      await page.settle();
      expect(page.el.textContent).not.toContain('(no. 9)');
    });

    it('should refuse a typed combination that uses the missing block', async () => {
      await openWithBox(1, `/angle-blocks?set=box:2&mode=total&combination=${encodeURIComponent('15° + 3° − 1°')}`);
      expect(page.fieldErrors()).toContain('is not in the set, or is marked missing or damaged');
    });
  });
});
