import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import AngleBlocksPage, { angleBlocksRequest } from './angle-blocks-page';

describe('AngleBlocksPage', () => {
  let fixture: ComponentFixture<AngleBlocksPage>;

  async function create(url = '/angle-blocks'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'angle-blocks', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(AngleBlocksPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should make 17°35′ exactly with no more blocks than the hand combination, and draw them', async () => {
    await create();
    // REFERENCE.md §6 [DER]: 17°35′ by hand with the 13-piece set takes six blocks.
    expect(resultValue('Angle the blocks make')).toBe(`17°35'00"`);
    expect(resultValue('Error')).toBe('0.00');
    const count = Number(resultValue('Number of blocks'));
    expect(count).toBeLessThanOrEqual(6);
    const svg = el().querySelector('sw-angle-stack-drawing svg');
    expect(svg?.querySelectorAll('path.block')).toHaveLength(count);
    expect(svg?.querySelectorAll('path.block.reversed').length).toBeGreaterThan(0);
    expect(svg?.querySelector('title')?.textContent).toBe('Angle blocks wrung together, making 17°35′');
  });

  it('should find 3° − 1° for 2° as the user types', async () => {
    await create();
    await type('angle', '2');
    // REFERENCE.md §6 [DER]: 2° = 3° − 1°, two blocks.
    expect(resultValue('Blocks')).toBe('3° − 1°');
    expect(resultValue('Number of blocks')).toBe('2');
  });

  it('should put the angle reader’s message under a bad angle', async () => {
    await create();
    await type('angle', '17°75');
    expect(fieldErrors()).toContain('Minutes must be below 60');
    expect(el().querySelector('.no-results')).not.toBeNull();
  });

  it('should total a combination from the URL, drawing reversed blocks reversed', async () => {
    await create(`/angle-blocks?mode=total&combination=${encodeURIComponent('41° − 27° + 3°')}`);
    // REFERENCE.md §6 [DER]: 41 − 27 + 3 = 17°.
    expect(resultValue('Angle the blocks make')).toBe(`17°00'00"`);
    expect(el().querySelectorAll('sw-angle-stack-drawing path.block.reversed')).toHaveLength(1);
  });

  it('should copy found blocks into the combination box', async () => {
    await create();
    const button = Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes('Check or change these blocks')) as HTMLButtonElement;
    button.click();
    await settle();
    const box = el().querySelector('input[formcontrolname="combination"]') as HTMLInputElement;
    expect(box.value).toMatch(/^27° − /);
    expect(resultValue('Angle the blocks make')).toBe(`17°35'00"`);
  });

  describe('angleBlocksRequest', () => {
    it('should name the combination field when the sum cannot be read', () => {
      const r = angleBlocksRequest({ mode: 'total', set: 'angle-13-npl', angle: '', combination: '27° −' });
      expect(r).toMatchObject({ ok: false, fields: { combination: expect.stringContaining('sign with no block') } });
    });

    it('should refuse a block the set does not hold', () => {
      const r = angleBlocksRequest({ mode: 'total', set: 'angle-13-npl', angle: '', combination: '41° + 5°' });
      expect(r).toMatchObject({ ok: false, fields: { 'combination.1.angle': expect.stringContaining('not (or no longer) in the set') } });
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
