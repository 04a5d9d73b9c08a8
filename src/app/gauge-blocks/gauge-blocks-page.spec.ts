import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

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
