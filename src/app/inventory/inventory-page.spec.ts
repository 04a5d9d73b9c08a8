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

  /** Opens the page as a role with the set given (instead of SET). */
  async function openWith(role: string, set: InventorySetDto): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal({ id: 1, email: 'x@example.test', name: 'X', role }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(InventoryPage);
    fixture.detectChanges();
    http.expectOne('/api/inventories/standard-sets').flush({ sets: [] });
    http.expectOne('/api/inventories').flush({ gaugeSets: [{ ...set, blocks: undefined }], angleSets: [] });
    http.expectOne(`/api/inventories/gauge-sets/${set.id}`).flush(set);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function open(role: string): Promise<void> {
    await openWith(role, SET);
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

  it("should add a box of the shop's own gauge blocks from a typed list, saying a wrong line before sending", async () => {
    await open('lead');
    (el().querySelector('form.create .mat-mdc-select-trigger') as HTMLElement).click();
    fixture.detectChanges();
    const option = Array.from(document.querySelectorAll('mat-option')).find((o) => o.textContent?.includes('Our own gauge blocks')) as HTMLElement;
    option.click();
    fixture.detectChanges();
    await fixture.whenStable();
    const type = (selector: string, value: string) => {
      const field = el().querySelector(selector) as HTMLInputElement | HTMLTextAreaElement;
      field.value = value;
      field.dispatchEvent(new Event('input'));
      fixture.detectChanges();
    };
    const submit = () => (el().querySelector('form.create button[type="submit"]') as HTMLButtonElement).click();
    type('form.create textarea', '0.1001\n0.1o02');
    expect(el().querySelector('form.create mat-hint')?.textContent).toContain('Line 2 ("0.1o02"): not a size');
    submit();
    fixture.detectChanges();
    expect(el().querySelector('form.create [role="alert"]')?.textContent).toContain('Give the set a name');
    type('form.create input[name="name"]', 'Long blocks, cabinet 3');
    submit();
    fixture.detectChanges();
    // Said once, under the list; nothing sent.
    expect(el().querySelector('form.create [role="alert"]')).toBeNull();
    expect(el().querySelector('form.create mat-hint')?.textContent).toContain('Line 2');
    Array.from(el().querySelectorAll('form.create mat-button-toggle button')).find((b) => b.textContent?.includes('mm'))!.dispatchEvent(new Event('click'));
    type('form.create textarea', '100 to 500 by 100\n125 x 2');
    expect(el().querySelector('form.create mat-hint')?.textContent).toContain('6 sizes, 7 blocks, 100 mm to 500 mm');
    submit();
    const req = http.expectOne('/api/inventories/gauge-sets');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({
      name: 'Long blocks, cabinet 3',
      unit: 'mm',
      blocks: [
        { size: '100', count: 1 },
        { size: '125', count: 2 },
        { size: '200', count: 1 },
        { size: '300', count: 1 },
        { size: '400', count: 1 },
        { size: '500', count: 1 },
      ],
    });
    req.flush({ ...SET, id: 9, name: 'Long blocks, cabinet 3', unit: 'mm', standardSet: null });
    http.expectOne('/api/inventories').flush({ gaugeSets: [{ ...SET, blocks: undefined }], angleSets: [] });
    fixture.detectChanges();
    expect(el().querySelector('.detail h2')?.textContent).toContain('Long blocks, cabinet 3');
    // The form starts over: no list left to add twice.
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el().querySelector('form.create textarea')).toBeNull();
    expect((el().querySelector('form.create input[name="name"]') as HTMLInputElement).value).toBe('');
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

  it('should say why marking a block was refused and show the set as it is now', async () => {
    await open('lead');
    (el().querySelector('button[aria-label="Mark a 0.200 in block damaged"]') as HTMLButtonElement).click();
    http
      .expectOne('/api/inventories/gauge-sets/4/blocks/11')
      .flush({ error: 'Missing and damaged together cannot exceed the 1 block(s) of this size in the set.' }, { status: 400, statusText: 'Bad Request' });
    // Someone else marked it missing meanwhile: the page reloads the set.
    const now = { ...SET, blocks: [SET.blocks![0]!, { ...SET.blocks![1]!, missing: 1, available: 0 }] };
    http.expectOne('/api/inventories/gauge-sets/4').flush(now);
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('[role="alert"]')?.textContent).toContain('0.200 in: Missing and damaged together cannot exceed the 1 block(s)');
    expect(Array.from(el().querySelectorAll('tbody tr')).map((r) => r.classList.contains('short'))).toEqual([true, true]);
  });

  it('should clear an old answer and ask for a height when the field is emptied', async () => {
    await open('machinist');
    const input = el().querySelector('form.answer input') as HTMLInputElement;
    input.value = '0.2000';
    input.dispatchEvent(new Event('input'));
    (el().querySelector('form.answer button') as HTMLButtonElement).click();
    http.expectOne((r) => r.url === '/api/inventories/gauge-sets/4/stack').flush({ blocks: ['0.200'], count: 1, total: '0.2000', excluded: [] });
    fixture.detectChanges();
    input.value = '  ';
    input.dispatchEvent(new Event('input'));
    (el().querySelector('form.answer button') as HTMLButtonElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('.result')).toBeNull();
    expect(el().querySelector('[role="alert"]')?.textContent).toContain('Type the stack height, e.g. 1.2505 (in).');
  });

  it('should build between the wear blocks only when asked, and name the field in words when refused', async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal({ id: 1, email: 'x@example.test', name: 'X', role: 'machinist' }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(InventoryPage);
    fixture.detectChanges();
    const worn = { ...SET, wearBlockSize: '0.050', wearBlockCount: 2 };
    http.expectOne('/api/inventories/standard-sets').flush({ sets: [] });
    http.expectOne('/api/inventories').flush({ gaugeSets: [{ ...worn, blocks: undefined }], angleSets: [] });
    http.expectOne('/api/inventories/gauge-sets/4').flush(worn);
    fixture.detectChanges();
    await fixture.whenStable();
    const input = el().querySelector('form.answer input[name="wanted"]') as HTMLInputElement;
    input.value = '0.2000';
    input.dispatchEvent(new Event('input'));
    const ask = () => (el().querySelector('form.answer button[type="submit"]') as HTMLButtonElement).click();
    ask();
    expect(http.expectOne((r) => r.url.endsWith('/stack')).request.params.get('wear')).toBe('no');
    (el().querySelector('mat-checkbox input') as HTMLInputElement).click();
    fixture.detectChanges();
    ask();
    const req = http.expectOne((r) => r.url.endsWith('/stack'));
    expect(req.request.params.get('wear')).toBe('yes');
    req.flush(
      { error: 'Gauge stack: wearBlocks make 0.1 in together, which leaves nothing to build for the target; try without the wear blocks', fields: { wearBlocks: 'make 0.1 in together, which leaves nothing to build for the target; try without the wear blocks' } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('[role="alert"]')?.textContent?.trim()).toBe('Wear blocks make 0.1 in together, which leaves nothing to build for the target; try without the wear blocks.');
  });

  it('should let a lead edit the set\'s details against the version shown, and say a name that is taken', async () => {
    await open('lead');
    expect(el().querySelector('.danger')).toBeNull();
    (Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes('Edit details')) as HTMLButtonElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    const name = el().querySelector('input[name="setName"]') as HTMLInputElement;
    expect(name.value).toBe('Inch 81, cabinet 2');
    name.value = 'Inch 81, cabinet 3';
    name.dispatchEvent(new Event('input'));
    const wear = el().querySelector('input[name="wearBlockSize"]') as HTMLInputElement;
    wear.value = '0.050';
    wear.dispatchEvent(new Event('input'));
    const count = el().querySelector('input[name="wearBlockCount"]') as HTMLInputElement;
    count.value = '2';
    count.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    (el().querySelector('form.details button[type="submit"]') as HTMLButtonElement).click();
    const taken = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/inventories/gauge-sets/4');
    expect(taken.request.body).toEqual({ name: 'Inch 81, cabinet 3', grade: '0', wearBlockSize: '0.050', wearBlockCount: 2, notes: '', version: 1 });
    taken.flush({ error: 'Your team already has a set with that name.', fields: { name: 'Choose another name.' } }, { status: 409, statusText: 'Conflict' });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('form.details')?.textContent).toContain('Choose another name.');
    expect(el().querySelector('[role="alert"]')?.textContent).toContain('Your team already has a set with that name.');

    name.value = 'Inch 81, bench drawer';
    name.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    (el().querySelector('form.details button[type="submit"]') as HTMLButtonElement).click();
    const saved = { ...SET, name: 'Inch 81, bench drawer', wearBlockSize: '0.050', wearBlockCount: 2, version: 2 };
    http.expectOne((r) => r.method === 'PUT').flush(saved);
    http.expectOne('/api/inventories/gauge-sets/4').flush(saved);
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('form.details')).toBeNull();
    expect(el().querySelector('.set-head h2')?.textContent).toBe('Inch 81, bench drawer');
    expect(el().querySelector('.set strong')?.textContent).toBe('Inch 81, bench drawer');
    expect(el().textContent).toContain('2 wear blocks of 0.050 in');
  });

  it.each([0, 1])('should not offer the wear blocks, nor count them, when the set keeps %i with a thickness', async (wearBlockCount) => {
    await openWith('machinist', { ...SET, wearBlockSize: '0.050', wearBlockCount });
    expect(el().querySelector('mat-checkbox')).toBeNull();
    expect(el().textContent).not.toMatch(/\d wear blocks? of 0\.050 in/);
    expect(el().textContent).toContain('wear blocks not used');
    const input = el().querySelector('form.answer input[name="wanted"]') as HTMLInputElement;
    input.value = '1.2011';
    input.dispatchEvent(new Event('input'));
    (el().querySelector('form.answer button[type="submit"]') as HTMLButtonElement).click();
    expect(http.expectOne((r) => r.url.endsWith('/stack')).request.params.get('wear')).toBe('no');
  });

  it('should say the wear-block rule before sending: a pair with a thickness, or none', async () => {
    await open('lead');
    (Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes('Edit details')) as HTMLButtonElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    const type = (name: string, value: string) => {
      const input = el().querySelector(`input[name="${name}"]`) as HTMLInputElement;
      input.value = value;
      input.dispatchEvent(new Event('input'));
      fixture.detectChanges();
    };
    const save = async () => {
      (el().querySelector('form.details button[type="submit"]') as HTMLButtonElement).click();
      fixture.detectChanges();
      await fixture.whenStable();
    };
    type('wearBlockSize', '0.050');
    type('wearBlockCount', '1');
    await save();
    expect(el().querySelector('form.details')?.textContent).toContain('Wear blocks come as a pair, one for each end of the stack: 0 or 2.');
    type('wearBlockCount', '0');
    await save();
    expect(el().querySelector('form.details')?.textContent).toContain('A thickness is given, so say 2 wear blocks, or clear the thickness.');
    type('wearBlockSize', '');
    type('wearBlockCount', '2');
    await save();
    expect(el().querySelector('form.details')?.textContent).toContain('Give the thickness of the two wear blocks');
    http.expectNone((r) => r.method === 'PUT');
    type('wearBlockSize', '0.050');
    await save();
    http.expectOne((r) => r.method === 'PUT').flush({ error: 'x' }, { status: 400, statusText: 'Bad Request' });
  });

  it('should let a lead write a note on a block and show it saved', async () => {
    await open('lead');
    (el().querySelector('button[aria-label="Write a note on 0.200 in"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    await fixture.whenStable();
    const input = el().querySelector('form.note-edit input') as HTMLInputElement;
    expect(input.getAttribute('maxlength')).toBe('200');
    input.value = ' nicked face ';
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    (el().querySelector('form.note-edit button[type="submit"]') as HTMLButtonElement).click();
    const req = http.expectOne((r) => r.method === 'PATCH' && r.url === '/api/inventories/gauge-sets/4/blocks/11');
    expect(req.request.body).toEqual({ note: 'nicked face' });
    req.flush({ ...SET, version: 2, blocks: [SET.blocks![0]!, { ...SET.blocks![1]!, note: 'nicked face' }] });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('form.note-edit')).toBeNull();
    expect(Array.from(el().querySelectorAll('td.note')).map((td) => td.textContent?.replace(/edit_note/g, '').trim())).toEqual(['lost', 'nicked face']);
  });

  it('should not offer a machinist the note editor', async () => {
    await open('machinist');
    expect(el().querySelector('td.note button')).toBeNull();
    expect(el().querySelector('td.note')?.textContent?.trim()).toBe('lost');
  });

  it('should bring a tapped set\'s details into view when they are below the list', async () => {
    await open('lead');
    const scroll = jest.fn();
    Object.defineProperty(HTMLElement.prototype, 'scrollIntoView', { value: scroll, configurable: true });
    const rect = jest.spyOn(HTMLElement.prototype, 'getBoundingClientRect').mockReturnValue({ top: 2000, bottom: 2400, left: 0, right: 390, width: 390, height: 400, x: 0, y: 2000, toJSON: () => ({}) });
    try {
      (el().querySelector('button.set') as HTMLButtonElement).click();
      http.expectOne('/api/inventories/gauge-sets/4').flush(SET);
      fixture.detectChanges();
      await fixture.whenStable();
      expect(scroll).toHaveBeenCalledWith({ behavior: 'smooth', block: 'start' });
      expect(scroll.mock.contexts[0]).toBe(el().querySelector('.detail'));
    } finally {
      rect.mockRestore();
      delete (HTMLElement.prototype as { scrollIntoView?: unknown }).scrollIntoView;
    }
  });

  it('should say in the delete question what happens to set-ups that use the set, and show the refusal', async () => {
    await open('admin');
    const ask = jest.spyOn(window, 'confirm').mockReturnValue(true);
    (el().querySelector('button.danger') as HTMLButtonElement).click();
    expect(ask.mock.calls[0]![0]).not.toContain('keep their figures');
    expect(ask.mock.calls[0]![0]).toContain('A set that saved set-ups use (archived ones too) is not deleted');
    const refusal = '2 saved set-ups use this set ("Stack A", "Stack B") and would lose their stacks. Save them with another set, or delete them, first (archived set-ups count too).';
    http.expectOne((r) => r.method === 'DELETE').flush({ error: refusal }, { status: 409, statusText: 'Conflict' });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('[role="alert"]')?.textContent).toContain(refusal);
    ask.mockRestore();
  });

  it('should let an admin delete a set after asking', async () => {
    await open('admin');
    const ask = jest.spyOn(window, 'confirm').mockReturnValueOnce(false).mockReturnValueOnce(true);
    const del = () => (el().querySelector('button.danger') as HTMLButtonElement).click();
    del();
    http.expectNone((r) => r.method === 'DELETE');
    del();
    expect(ask.mock.calls[1]![0]).toMatch(/^Delete the set "Inch 81, cabinet 2"/);
    http.expectOne((r) => r.method === 'DELETE' && r.url === '/api/inventories/gauge-sets/4').flush(null, { status: 204, statusText: 'No Content' });
    http.expectOne('/api/inventories').flush({ gaugeSets: [], angleSets: [] });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().textContent).toContain('No sets yet.');
    ask.mockRestore();
  });
});
