import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { SetupDto } from '../../../shared/api/setup';
import { Auth, type AuthUser } from '../core/auth';
import BatchesPage from './batches-page';

const ME: AuthUser = { id: 7, email: 'm@example.test', name: 'Ines', role: 'machinist' };
const WEDGE: SetupDto = {
  id: 4, name: 'Fixture wedge', kind: 'taper', inputs: {}, notes: '', job: 'KL-1', status: 'released', version: 2, ownerId: 7, ownerName: 'Ines',
  checks: [{ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' }],
  releasedAt: null, releasedByName: null, releasedVersion: 1, createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z',
};

describe('BatchesPage', () => {
  let fixture: ComponentFixture<BatchesPage>;
  let http: HttpTestingController;
  const el = () => fixture.nativeElement as HTMLElement;
  const startButton = () => Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes('Start run')) as HTMLButtonElement;
  const partsInput = () => el().querySelector('input[name=parts]') as HTMLInputElement;

  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  }

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal(ME) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(BatchesPage);
    fixture.detectChanges();
    http.expectOne('/api/batches').flush({ batches: [] });
    http.expectOne((r) => r.url === '/api/setups').flush({ setups: [WEDGE], total: 1, page: 1, pageSize: 100 });
    await settle();
    // Choose the released set-up.
    (el().querySelector('mat-select .mat-mdc-select-trigger') as HTMLElement).click();
    await settle();
    (document.querySelector('mat-option') as HTMLElement).click();
    await settle();
  });

  afterEach(() => http.verify());

  async function typeParts(text: string): Promise<void> {
    partsInput().value = text;
    partsInput().dispatchEvent(new Event('input'));
    await settle();
  }

  it('should say under the Parts box why a count cannot be sent, as it is typed, and not send it', async () => {
    expect(startButton().disabled).toBe(false);
    for (const [typed, reason] of [
      ['0', 'Part count must be at least 1.'],
      ['-1', 'Part count must be at least 1.'],
      ['501', 'Part count must be at most 500.'],
      ['2.5', 'Part count must be a whole number.'],
      ['', 'Say how many parts the batch has.'],
    ] as const) {
      await typeParts(typed);
      expect(el().querySelector('#parts-error')?.textContent).toBe(reason);
      expect(startButton().disabled).toBe(true);
      el().querySelector('form')!.dispatchEvent(new Event('submit'));
      http.expectNone('/api/batches');
    }
    await typeParts('12');
    expect(el().querySelector('#parts-error')).toBeNull();
    expect(startButton().disabled).toBe(false);
    startButton().click();
    const req = http.expectOne((r) => r.method === 'POST' && r.url === '/api/batches');
    expect(req.request.body).toEqual({ setupId: 4, partCount: 12 });
  });

  it('should send the name given to the run, trimmed', async () => {
    const label = el().querySelector('input[name=label]') as HTMLInputElement;
    label.value = '  Lot 7, second shift ';
    label.dispatchEvent(new Event('input'));
    await settle();
    startButton().click();
    const req = http.expectOne((r) => r.method === 'POST' && r.url === '/api/batches');
    expect(req.request.body).toEqual({ setupId: 4, partCount: 8, label: 'Lot 7, second shift' });
  });
});
