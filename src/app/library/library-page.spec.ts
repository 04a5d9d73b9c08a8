import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { SetupDto, SetupPageDto } from '../../../shared/api/setup';
import { Auth, type AuthUser } from '../core/auth';
import LibraryPage from './library-page';

const ME: AuthUser = { id: 7, email: 'm@example.test', name: 'Ines', role: 'machinist' };

function setup(id: number, name: string, status: SetupDto['status'] = 'released'): SetupDto {
  return {
    id, name, kind: 'taper', inputs: {}, notes: '', job: 'KL-1', status, version: 1, checks: [], ownerId: 7, ownerName: 'Ines',
    releasedAt: null, releasedByName: null, createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z',
  };
}

describe('LibraryPage', () => {
  let fixture: ComponentFixture<LibraryPage>;
  let http: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]), provideHttpClient(), provideHttpClientTesting(),
        { provide: Auth, useValue: { user: signal(ME), signedIn: signal(true) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(LibraryPage);
    fixture.detectChanges();
  });

  afterEach(() => http.verify());

  /** Waits out the page's debounce and answers the list request. */
  async function answer(page: Partial<SetupPageDto>): Promise<URLSearchParams> {
    await new Promise((r) => setTimeout(r, 300));
    const req = http.expectOne((r) => r.url === '/api/setups');
    expect(req.request.method).toBe('GET');
    const params = new URLSearchParams(req.request.params.toString());
    req.flush({ setups: [], total: 0, page: 1, pageSize: 25, ...page });
    fixture.detectChanges();
    await fixture.whenStable();
    return params;
  }

  const rows = () => Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('tr.mat-mdc-row a.name')).map((a) => a.textContent?.trim());

  it('should ask for the first page, newest first, and list the set-ups', async () => {
    const params = await answer({ setups: [setup(1, 'Fixture wedge'), setup(2, 'Dovetail slide', 'draft')], total: 2 });
    expect(Object.fromEntries(params)).toEqual({ sort: 'updatedAt', dir: 'desc', page: '1', pageSize: '25' });
    expect(rows()).toEqual(['Fixture wedge', 'Dovetail slide']);
    expect((fixture.nativeElement as HTMLElement).querySelector('.status-draft')?.textContent).toBe('Draft');
    expect((fixture.nativeElement as HTMLElement).querySelector('.mat-mdc-paginator-range-label')?.textContent?.trim()).toBe('1 – 2 of 2');
  });

  it('should send search, filters and "only mine" to the server and go back to page 1', async () => {
    await answer({ total: 60 });
    const input = (fixture.nativeElement as HTMLElement).querySelector('input[type=search]') as HTMLInputElement;
    input.value = 'wedge';
    input.dispatchEvent(new Event('input'));
    const toggle = (fixture.nativeElement as HTMLElement).querySelector('mat-slide-toggle button') as HTMLButtonElement;
    toggle.click();
    fixture.detectChanges();
    const params = await answer({ setups: [setup(1, 'Fixture wedge')], total: 1 });
    expect(params.get('q')).toBe('wedge');
    expect(params.get('ownerId')).toBe('7');
    expect(params.get('page')).toBe('1');
    expect(rows()).toEqual(['Fixture wedge']);
  });

  it('should say so when nothing matches', async () => {
    await answer({ setups: [], total: 0 });
    expect((fixture.nativeElement as HTMLElement).querySelector('.empty')?.textContent).toContain('No set-ups match these filters.');
  });
});
