import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { SetupDto } from '../../../shared/api/setup';
import { Auth, type AuthUser } from '../core/auth';
import SetupDetailPage from './setup-detail-page';

const MACHINIST: AuthUser = { id: 7, email: 'm@example.test', name: 'Ines', role: 'machinist' };
const CHECK = { key: 'end-thickness', label: 'End thickness', unit: 'in' as const, nominal: '0.5854', plus: '0.0010', minus: '0.0010' };
const TAPER = { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' };

function setup(patch: Partial<SetupDto> = {}): SetupDto {
  return {
    id: 5, name: 'Fixture wedge', kind: 'taper', inputs: TAPER, notes: '', job: 'KL-1', status: 'draft', version: 1, checks: [CHECK], ownerId: 7, ownerName: 'Ines',
    releasedAt: null, releasedByName: null, releasedVersion: null, createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z', ...patch,
  };
}

@Component({ template: 'list' })
class ListStub {}

describe('SetupDetailPage', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  const el = () => harness.routeNativeElement as HTMLElement;

  /** Opens /library/5 (with the navigation state given) and answers the page's requests. */
  async function open(dto: SetupDto, opts: { user?: AuthUser; state?: unknown; runs?: unknown[] } = {}): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'library/:id', component: SetupDetailPage }, { path: 'library', component: ListStub }, { path: 'batches/:id', component: ListStub }], withComponentInputBinding()),
        provideHttpClient(), provideHttpClientTesting(),
        { provide: Auth, useValue: { user: signal(opts.user ?? MACHINIST) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    const done = TestBed.inject(Router).navigateByUrl('/library/5', opts.state ? { state: opts.state } : {});
    await done;
    harness.detectChanges();
    http.expectOne('/api/setups/5').flush(dto);
    http.expectOne('/api/setups/5/revisions').flush({ revisions: [] });
    http.expectOne('/api/setups/5/attachments').flush({ attachments: [] });
    http.expectOne((r) => r.url === '/api/batches').flush({ batches: opts.runs ?? [] });
    harness.detectChanges();
    await harness.fixture.whenStable();
  }

  afterEach(() => http.verify());

  const button = (text: string) => Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes(text));
  const pairs = () => Array.from(el().querySelectorAll('#inputs-h + dl dt')).map((dt) => [dt.textContent?.trim(), dt.nextElementSibling?.textContent?.trim()]);

  it('should lead back to the list as it was opened (filters, sort, page), handed over by the list', async () => {
    await open(setup(), { state: { libraryList: { q: 'wedge', sort: 'name', dir: 'asc', page: '2', size: '10', junk: 'x' } } });
    const back = el().querySelector('a.back') as HTMLAnchorElement;
    expect(back.getAttribute('href')).toBe('/library?q=wedge&sort=name&dir=asc&page=2&size=10');
  });

  it('should lead back to the plain list when opened from elsewhere', async () => {
    await open(setup());
    expect((el().querySelector('a.back') as HTMLAnchorElement).getAttribute('href')).toBe('/library');
  });

  describe('starting a batch run', () => {
    const released = () => setup({ status: 'released', version: 2, releasedVersion: 2, releasedAt: '2026-12-01T11:00:00.000Z', releasedByName: 'Lea' });

    async function typeParts(text: string): Promise<void> {
      const input = el().querySelector('input[name="partCount"]') as HTMLInputElement;
      input.value = text;
      input.dispatchEvent(new Event('input'));
      harness.detectChanges();
      button('Start a batch run')!.click();
      harness.detectChanges();
      await harness.fixture.whenStable();
    }
    const fieldError = () => el().querySelector('#part-count-error')?.textContent?.trim();

    it.each([
      ['0', 'Part count must be at least 1.'],
      ['-5', 'Part count must be at least 1.'],
      ['100000', 'Part count must be at most 500.'],
      ['2.5', 'Part count must be a whole number.'],
      ['', 'Say how many parts the batch has.'],
      ['abc', 'Say how many parts the batch has.'],
    ])('should say under the field why %j parts cannot be run, before sending anything', async (text, message) => {
      await open(released());
      await typeParts(text);
      expect(fieldError()).toBe(message);
      http.expectNone('/api/batches');
    });

    it("should show the server's message for the part count under the field", async () => {
      await open(released());
      await typeParts('12');
      const req = http.expectOne((r) => r.url === '/api/batches' && r.method === 'POST');
      expect(req.request.body).toEqual({ setupId: 5, partCount: 12 });
      req.flush({ error: 'Some fields are not valid.', fields: { partCount: 'Part count must be at most 10 here.' } }, { status: 400, statusText: 'Bad Request' });
      harness.detectChanges();
      expect(fieldError()).toBe('Part count must be at most 10 here.');
      expect(el().querySelector('.start + .error')).toBeNull();
    });
  });

  describe('deleting a draft', () => {
    it("should offer the owner's never-released draft for deletion, ask first, and go back to the list", async () => {
      await open(setup(), { state: { libraryList: { page: '3' } } });
      const confirm = jest.spyOn(window, 'confirm').mockReturnValue(true);
      button('Delete draft')!.click();
      expect(confirm).toHaveBeenCalledWith(expect.stringMatching(/^Delete the draft "Fixture wedge"\?/));
      const req = http.expectOne('/api/setups/5');
      expect(req.request.method).toBe('DELETE');
      req.flush(null, { status: 204, statusText: 'No Content' });
      await harness.fixture.whenStable();
      expect(TestBed.inject(Router).url).toBe('/library?page=3');
      confirm.mockRestore();
    });

    it('should delete nothing when the confirm is declined, and say why a refusal came', async () => {
      await open(setup());
      const confirm = jest.spyOn(window, 'confirm').mockReturnValueOnce(false).mockReturnValueOnce(true);
      button('Delete draft')!.click();
      http.expectNone('/api/setups/5');
      button('Delete draft')!.click();
      http.expectOne('/api/setups/5').flush({ error: 'This set-up is released, so it cannot be deleted. Archive it instead (a lead or an admin archives set-ups).' }, { status: 409, statusText: 'Conflict' });
      harness.detectChanges();
      expect(el().querySelector('[role="alert"]')?.textContent).toContain('The set-up was not deleted: This set-up is released');
      confirm.mockRestore();
    });

    it.each([
      ['a released set-up', setup({ status: 'released', releasedVersion: 1 }), MACHINIST],
      ['a draft revising a released version', setup({ status: 'draft', version: 3, releasedVersion: 2 }), MACHINIST],
      ['an archived set-up', setup({ status: 'archived' }), { ...MACHINIST, role: 'lead' as const }],
      ["someone else's draft", setup({ ownerId: 9, ownerName: 'Teodor' }), MACHINIST],
    ])('should not offer %s for deletion', async (_what, dto, user) => {
      await open(dto, { user });
      expect(button('Delete draft')).toBeUndefined();
    });
  });

  describe('a set-up saved with one of the team\'s boxes', () => {
    const form = { unit: 'in', target: '0.2507', set: 'box:12', missing: '', wearBlocks: '', grade: '', temperature: '' };

    it("should name the box, and list no empty inputs", async () => {
      await open(setup({ kind: 'gauge-blocks', inputs: form, checks: [] }));
      http.expectOne('/api/inventories/gauge-sets/12').flush({
        id: 12, type: 'gauge-blocks', name: 'Crib box', unit: 'in', grade: null, wearBlockSize: null, wearBlockCount: 0, notes: '', version: 1,
        blocks: [{ id: 1, size: '0.1007', count: 1, missing: 0, damaged: 0, available: 1, note: '' }, { id: 2, size: '0.150', count: 1, missing: 0, damaged: 0, available: 1, note: '' }],
      });
      harness.detectChanges();
      expect(pairs()).toEqual([['Target', '0.2507 in'], ['Unit', 'in'], ['Set', 'Our box: Crib box']]);
    });

    it('should say when the box is gone, and that the set-up does not compute', async () => {
      await open(setup({ kind: 'gauge-blocks', inputs: form, checks: [] }), { user: { ...MACHINIST, role: 'lead' } });
      http.expectOne('/api/inventories/gauge-sets/12').flush({ error: 'No gauge-block set with that id in your team.' }, { status: 404, statusText: 'Not Found' });
      harness.detectChanges();
      expect(pairs()).toContainEqual(['Set', 'a box since deleted (no. 12)']);
      expect(pairs().map(([k]) => k)).not.toContain('Missing');
      expect(el().querySelector('#results-h + .error')?.textContent).toMatch(/no longer in the team's inventory/);
      expect((button('Release') as HTMLButtonElement).disabled).toBe(true);
    });
  });
});
