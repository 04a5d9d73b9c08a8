import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { SetupDto, SetupPageDto } from '../../../shared/api/setup';
import { Auth, type AuthUser } from '../core/auth';
import LibraryPage from './library-page';

const ME: AuthUser = { id: 7, email: 'm@example.test', name: 'Ines', role: 'machinist' };

function setup(id: number, name: string, status: SetupDto['status'] = 'released'): SetupDto {
  return {
    id, name, kind: 'taper', inputs: {}, notes: '', job: 'KL-1', status, version: 1, checks: [], ownerId: 7, ownerName: 'Ines',
    releasedAt: null, releasedByName: null, releasedVersion: null, createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z',
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
    http.expectOne('/api/setups/owners').flush({ owners: [{ id: 7, name: 'Ines', count: 2 }, { id: 9, name: 'Teodor', count: 3 }] });
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

  /** Opens the Owner select; its options render in the overlay. */
  async function openOwnerSelect(): Promise<void> {
    const field = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === 'Owner')!;
    (field.querySelector('.mat-mdc-select-trigger') as HTMLElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
  }

  /** Opens the Owner select and picks the option with this text. */
  async function pickOwner(text: string): Promise<void> {
    await openOwnerSelect();
    const option = Array.from(document.querySelectorAll('mat-option')).find((o) => o.textContent?.trim() === text) as HTMLElement | undefined;
    expect(option).toBeDefined();
    option!.click();
    fixture.detectChanges();
  }

  it('should offer anyone, me and the other owners with their counts', async () => {
    await answer({ total: 5 });
    await openOwnerSelect();
    // The signed-in member (id 7) is "Me", not listed again by name.
    expect(Array.from(document.querySelectorAll('mat-option')).map((o) => o.textContent?.trim())).toEqual(['Anyone', 'Me', 'Teodor (3)']);
  });

  it('should send search, filters and the owner to the server and go back to page 1', async () => {
    await answer({ total: 60 });
    const input = (fixture.nativeElement as HTMLElement).querySelector('input[type=search]') as HTMLInputElement;
    input.value = 'wedge';
    input.dispatchEvent(new Event('input'));
    await pickOwner('Me');
    const params = await answer({ setups: [setup(1, 'Fixture wedge')], total: 1 });
    expect(params.get('q')).toBe('wedge');
    expect(params.get('ownerId')).toBe('7');
    expect(params.get('page')).toBe('1');
    expect(rows()).toEqual(['Fixture wedge']);
    await pickOwner('Teodor (3)');
    expect((await answer({ total: 0 })).get('ownerId')).toBe('9');
    await pickOwner('Anyone');
    expect((await answer({ total: 60 })).has('ownerId')).toBe(false);
  });

  it('should mark a draft that revises a released set-up with the version it revises', async () => {
    await answer({ setups: [{ ...setup(3, 'Revised wedge', 'draft'), releasedVersion: 2 }, setup(4, 'New wedge', 'draft')], total: 2 });
    const statuses = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('td.mat-column-status')).map((td) => td.textContent?.trim());
    expect(statuses).toEqual(['Draftrevising v2', 'Draft']);
  });

  it('should say so when nothing matches', async () => {
    await answer({ setups: [], total: 0 });
    expect((fixture.nativeElement as HTMLElement).querySelector('.empty')?.textContent).toContain('No set-ups match these filters.');
  });
});

describe('LibraryPage address', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;

  async function openAt(url: string): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'library', component: LibraryPage }]), provideHttpClient(), provideHttpClientTesting(),
        { provide: Auth, useValue: { user: signal(ME), signedIn: signal(true) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create(url);
    http.expectOne('/api/setups/owners').flush({ owners: [{ id: 7, name: 'Ines', count: 2 }] });
  }

  afterEach(() => http.verify());

  async function listParams(total = 120): Promise<Record<string, string>> {
    await new Promise((r) => setTimeout(r, 300));
    const req = http.expectOne((r) => r.url === '/api/setups');
    const params = Object.fromEntries(new URLSearchParams(req.request.params.toString()));
    req.flush({ setups: total > 0 ? [setup(1, 'Wedge')] : [], total, page: 1, pageSize: 25 });
    harness.detectChanges();
    await harness.fixture.whenStable();
    return params;
  }

  it('should show the list the address asks for, as after going back from a set-up', async () => {
    await openAt('/library?q=wedge&kind=taper&status=released&sort=name&dir=asc&page=3&size=10');
    expect(await listParams()).toEqual({ q: 'wedge', kind: 'taper', status: 'released', sort: 'name', dir: 'asc', page: '3', pageSize: '10' });
    const search = harness.routeNativeElement!.querySelector('input[type=search]') as HTMLInputElement;
    expect(search.value).toBe('wedge');
  });

  it('should go to the last page there is from a page past the end', async () => {
    await openAt('/library?page=99');
    // 24 set-ups on pages of 25: page 99 is empty, so the page asks for page 1 and puts it in the address.
    await new Promise((r) => setTimeout(r, 300));
    http.expectOne((r) => r.url === '/api/setups' && r.params.get('page') === '99').flush({ setups: [], total: 24, page: 99, pageSize: 25 });
    harness.detectChanges();
    await harness.fixture.whenStable();
    expect(await listParams(24)).toMatchObject({ page: '1' });
    await new Promise((r) => setTimeout(r, 300));
    expect(TestBed.inject(Router).url).not.toContain('page=99');
  });

  it('should put a changed filter in the address (page back to 1) and follow the plain menu address', async () => {
    await openAt('/library?kind=taper&page=2');
    expect((await listParams()).page).toBe('2');
    const search = harness.routeNativeElement!.querySelector('input[type=search]') as HTMLInputElement;
    search.value = 'dovetail';
    search.dispatchEvent(new Event('input'));
    expect(await listParams()).toMatchObject({ q: 'dovetail', kind: 'taper', page: '1' });
    await new Promise((r) => setTimeout(r, 300));
    await harness.fixture.whenStable();
    const router = TestBed.inject(Router);
    expect(router.url).toBe('/library?q=dovetail&kind=taper');
    await harness.navigateByUrl('/library');
    expect(await listParams()).toEqual({ sort: 'updatedAt', dir: 'desc', page: '1', pageSize: '25' });
    expect(search.value).toBe('');
    expect(router.url).toBe('/library');
  });

  it('should hand the list as it is to the set-up a row opens, for its link back', async () => {
    await openAt('/library?q=wedge&sort=name&dir=asc&page=2&size=10');
    await listParams();
    const router = TestBed.inject(Router);
    const go = jest.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    (harness.routeNativeElement!.querySelector('a.name') as HTMLAnchorElement).click();
    expect(go).toHaveBeenCalledWith(expect.anything(), expect.objectContaining({ state: { libraryList: { q: 'wedge', sort: 'name', dir: 'asc', page: '2', size: '10' } } }));
  });
});

describe('LibraryPage import', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'library', component: LibraryPage }, { path: 'library/:id', component: LibraryPage }]), provideHttpClient(), provideHttpClientTesting(),
        { provide: Auth, useValue: { user: signal(ME), signedIn: signal(true) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create('/library');
    http.expectOne('/api/setups/owners').flush({ owners: [] });
  });

  afterEach(() => {
    http.match(() => true).filter((r) => !r.cancelled).forEach((r) => r.flush({ setups: [], total: 0, page: 1, pageSize: 25 }));
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  /** Picks a file in the import input (its text as given). */
  async function pick(name: string, text: string): Promise<void> {
    const input = harness.routeNativeElement!.querySelector('input[type=file]') as HTMLInputElement;
    Object.defineProperty(input, 'files', { configurable: true, value: [{ name, text: () => Promise.resolve(text) }] });
    input.dispatchEvent(new Event('change'));
    await new Promise((r) => setTimeout(r, 0));
    harness.detectChanges();
  }
  const alert = () => harness.routeNativeElement!.querySelector('.import-error')?.textContent?.trim() ?? null;

  it('should say why an import failed until the next import, and confirm a successful one', async () => {
    await pick('notes.txt', 'not json');
    expect(alert()).toContain('Import of "notes.txt" failed: the file is not a set-up exported from Slantwise (not valid JSON).');
    await pick('old.json', '{"format":"other"}');
    http.expectOne('/api/setups/import').flush({ error: 'This is not a set-up export.' }, { status: 400, statusText: 'Bad Request' });
    harness.detectChanges();
    expect(alert()).toContain('Import of "old.json" failed: This is not a set-up export.');
    await pick('wedge.json', '{"format":"slantwise.setup/1"}');
    // The old message goes as soon as the next import starts.
    expect(alert()).toBeNull();
    http.expectOne('/api/setups/import').flush(setup(41, 'Imported wedge', 'draft'));
    await harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/library/41');
    expect(document.querySelector('.mat-mdc-snack-bar-label')?.textContent?.trim()).toMatch(/^Imported "Imported wedge" as a draft\./);
  });

  it('should let the failure message be dismissed', async () => {
    await pick('notes.txt', 'not json');
    (harness.routeNativeElement!.querySelector('.import-error button') as HTMLButtonElement).click();
    harness.detectChanges();
    expect(alert()).toBeNull();
  });
});
