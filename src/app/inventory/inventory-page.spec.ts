import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';

import type { InventorySetDto } from '../../../shared/api/inventory';
import { Auth } from '../core/auth';
import InventoryPage from './inventory-page';

const SET: InventorySetDto = {
  id: 4, type: 'gauge-blocks', name: 'Inch 81, cabinet 2', unit: 'in', standardSet: 'inch-81', grade: '0', wearBlockSize: null, wearBlockCount: 0, notes: '', version: 1,
  totals: { sizes: 2, blocks: 2, missing: 1, damaged: 0, available: 1 },
  blocks: [
    { id: 10, size: '0.1007', label: '0.1007 in', count: 1, missing: 1, damaged: 0, available: 0, note: 'lost' },
    { id: 11, size: '0.2', label: '0.200 in', count: 1, missing: 0, damaged: 0, available: 1, note: '' },
  ],
  createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z',
};

describe('InventoryPage', () => {
  let fixture: ComponentFixture<InventoryPage>;
  let http: HttpTestingController;
  const el = () => fixture.nativeElement as HTMLElement;

  async function open(role: string): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal({ id: 1, email: 'x@example.test', name: 'X', role }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(InventoryPage);
    fixture.detectChanges();
    http.expectOne('/api/inventories/standard-sets').flush({ sets: [] });
    http.expectOne('/api/inventories').flush({ gaugeSets: [{ ...SET, blocks: undefined }], angleSets: [] });
    http.expectOne('/api/inventories/gauge-sets/4').flush(SET);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  it('should show the blocks with the short ones marked, and let a lead mark another missing', async () => {
    await open('lead');
    const rows = Array.from(el().querySelectorAll('tbody tr'));
    expect(rows.map((r) => r.classList.contains('short'))).toEqual([true, false]);
    (el().querySelector('button[aria-label="Mark a 0.200 in block missing"]') as HTMLButtonElement).click();
    const req = http.expectOne('/api/inventories/gauge-sets/4/blocks/11');
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({ missing: 1 });
    req.flush(SET);
  });

  it('should not offer the marking buttons to a machinist', async () => {
    await open('machinist');
    expect(el().querySelector('button[aria-label^="Mark a"]')).toBeNull();
  });

  it('should ask the server for a stack from the box and show it', async () => {
    await open('machinist');
    const input = el().querySelector('form.answer input') as HTMLInputElement;
    input.value = '0.2000';
    input.dispatchEvent(new Event('input'));
    (el().querySelector('form.answer button') as HTMLButtonElement).click();
    const req = http.expectOne((r) => r.url === '/api/inventories/gauge-sets/4/stack');
    expect(req.request.params.get('target')).toBe('0.2000');
    req.flush({ blocks: ['0.200'], count: 1, total: '0.2000', excluded: [] });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('.result')?.textContent).toContain('0.2000 in');
  });
});
