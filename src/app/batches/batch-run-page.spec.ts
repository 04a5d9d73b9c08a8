import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { BatchRunDto } from '../../../shared/api/batch';
import { checkStats } from '../../../shared/batch/batch-stats';
import { Auth, type AuthUser } from '../core/auth';
import BatchRunPage from './batch-run-page';

const ME: AuthUser = { id: 7, email: 'm@example.test', name: 'Ines', role: 'machinist' };
const CHECK = { key: 'end-thickness', label: 'End thickness', unit: 'in' as const, nominal: '0.5854', plus: '0.0010', minus: '0.0010' };

function run(parts: Array<[number, string, boolean]>, status: 'open' | 'closed' = 'open'): BatchRunDto {
  const p = parts.map(([partNo, value, pass]) => ({ id: partNo, partNo, touchOff: null, droAtStop: null, values: { 'end-thickness': value }, pass, outOfBand: pass ? [] : ['end-thickness'], operatorId: 7, operatorName: 'Ines', measuredAt: '2026-12-01T10:00:00.000Z', note: '', correctedAt: null, correctedByName: null, firstRecorded: null, revision: `r${partNo}` }));
  return {
    id: 3, setupId: 1, setupName: 'Fixture wedge', setupVersion: 2, label: 'Lot A', partCount: 3, status, checks: [CHECK],
    startedById: 7, startedByName: 'Ines', closedAt: null, closedByName: null, version: 1,
    summary: { entered: p.length, passed: p.filter((x) => x.pass).length, failed: p.filter((x) => !x.pass).length },
    createdAt: '2026-12-01T09:00:00.000Z', updatedAt: '2026-12-01T09:00:00.000Z',
    parts: p, stats: checkStats([CHECK], p.map((x) => ({ partNo: x.partNo, values: x.values }))),
  };
}

describe('BatchRunPage', () => {
  let fixture: ComponentFixture<BatchRunPage>;
  let http: HttpTestingController;
  const el = () => fixture.nativeElement as HTMLElement;

  async function open(dto: BatchRunDto, user: AuthUser = ME): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal(user) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(BatchRunPage);
    fixture.componentRef.setInput('id', 3);
    fixture.detectChanges();
    http.expectOne('/api/batches/3').flush(dto);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  async function type(label: string, value: string): Promise<void> {
    const field = Array.from(el().querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.includes(label));
    const input = field?.querySelector('input') as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should close the run only after asking, and show it closed', async () => {
    await open(run([[1, '0.5856', true]]));
    const closeButton = () => Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes('Close run')) as HTMLButtonElement;
    const ask = jest.spyOn(window, 'confirm').mockReturnValueOnce(false);
    closeButton().click();
    expect(ask).toHaveBeenCalledWith(expect.stringMatching(/^Close run ".+" with 1 of \d+ parts recorded\? A closed run is kept as it is/));
    http.expectNone('/api/batches/3/close');
    ask.mockReturnValueOnce(true);
    closeButton().click();
    http.expectOne('/api/batches/3/close').flush(run([[1, '0.5856', true]], 'closed'));
    fixture.detectChanges();
    await fixture.whenStable();
    expect(closeButton()).toBeUndefined();
    ask.mockRestore();
  });

  it('should show the run as it is when someone else closed it first', async () => {
    await open(run([[1, '0.5856', true]]));
    const ask = jest.spyOn(window, 'confirm').mockReturnValue(true);
    (Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes('Close run')) as HTMLButtonElement).click();
    http.expectOne('/api/batches/3/close').flush({ error: 'This batch run is already closed.' }, { status: 409, statusText: 'Conflict' });
    http.expectOne('/api/batches/3').flush(run([[1, '0.5856', true]], 'closed'));
    fixture.detectChanges();
    await fixture.whenStable();
    expect(Array.from(el().querySelectorAll('button')).some((b) => b.textContent?.includes('Close run'))).toBe(false);
    ask.mockRestore();
  });

  it('should show each part with a pass or fail chip, the spread and a chart', async () => {
    await open(run([[1, '0.5856', true], [2, '0.5870', false]]));
    expect(Array.from(el().querySelectorAll('.verdict')).map((v) => v.textContent)).toEqual(['Pass', 'Fail']);
    // 0.5870 − 0.5856 = 0.0014 (derived).
    expect(el().querySelector('.figures')?.textContent).toContain('0.0014');
    expect(el().querySelectorAll('app-batch-chart circle')).toHaveLength(2);
    expect(el().querySelectorAll('app-batch-chart circle.fail')).toHaveLength(1);
  });

  it('should tell live whether a typed value is in band, then post the part', async () => {
    await open(run([[1, '0.5856', true]]));
    expect(el().querySelector('form h2')?.textContent).toBe('Part 2');
    await type('End thickness', '0.5899');
    expect(el().querySelector('mat-form-field.fail')).not.toBeNull();
    await type('End thickness', '0.5855');
    expect(el().querySelector('mat-form-field.pass')).not.toBeNull();
    await type('DRO at stop', '-0.1632');
    (el().querySelector('button[type=submit]') as HTMLButtonElement).click();
    const req = http.expectOne('/api/batches/3/parts');
    expect(req.request.method).toBe('POST');
    // The request names the part the form showed, so a part recorded meanwhile elsewhere is not renumbered silently.
    expect(req.request.body).toEqual({ partNo: 2, touchOff: null, droAtStop: '-0.1632', values: { 'end-thickness': '0.5855' }, note: undefined });
    req.flush({ part: {}, run: run([[1, '0.5856', true], [2, '0.5855', true]]) });
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el().querySelector('form h2')?.textContent).toBe('Part 3');
    await settle();
    // The fresh form for part 3 shows no box as wrong before anything is typed or sent.
    expect(el().querySelectorAll('mat-form-field.mat-form-field-invalid')).toHaveLength(0);
    expect(field('End thickness').value).toBe('');
    // The cursor waits in the next part's first reading.
    expect(document.activeElement).toBe(field('End thickness'));
  });

  it('should show a closed run read-only', async () => {
    await open(run([[1, '0.5856', true]], 'closed'));
    expect(el().querySelector('form')).toBeNull();
    expect(Array.from(el().querySelectorAll('button')).some((b) => b.textContent?.includes('Close run'))).toBe(false);
  });

  const button = (text: string) => Array.from(el().querySelectorAll('button')).find((b) => b.textContent?.includes(text)) as HTMLButtonElement | undefined;
  const field = (label: string) =>
    Array.from(el().querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.includes(label))?.querySelector('input') as HTMLInputElement;
  async function settle(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should load a recorded part into the form, put the corrected readings and go back to the next part', async () => {
    await open(run([[1, '0.5856', true], [2, '0.5780', false]]));
    el().querySelector<HTMLButtonElement>('button[aria-label="Correct part 2"]')!.click();
    await settle();
    expect(el().querySelector('form h2')?.textContent).toBe('Correct part 2');
    expect(field('End thickness').value).toBe('0.5780');
    await type('End thickness', '0.5860');
    await type('Note', 'first reading mistyped');
    button('Save part 2')!.click();
    const req = http.expectOne('/api/batches/3/parts/2');
    expect(req.request.method).toBe('PUT');
    // The correction carries the revision of the part it was based on.
    expect(req.request.body).toEqual({ touchOff: null, droAtStop: null, values: { 'end-thickness': '0.5860' }, note: 'first reading mistyped', revision: 'r2' });
    req.flush({ part: { partNo: 2 }, run: run([[1, '0.5856', true], [2, '0.5860', true]]) });
    await settle();
    expect(el().querySelector('form h2')?.textContent).toBe('Part 3');
    expect(field('End thickness').value).toBe('');
    expect(el().querySelector('[role=status]')?.textContent).toBe('Part 2 corrected.');
    expect(Array.from(el().querySelectorAll('.verdict')).map((v) => v.textContent)).toEqual(['Pass', 'Pass']);
  });

  it('should let a full run be corrected, show a refused reading beside its box, and cancel without saving', async () => {
    await open(run([[1, '0.5856', true], [2, '0.5857', true], [3, '0.5858', true]]));
    expect(el().querySelector('form')).toBeNull();
    el().querySelector<HTMLButtonElement>('button[aria-label="Correct part 3"]')!.click();
    await settle();
    expect(el().querySelector('form h2')?.textContent).toBe('Correct part 3');
    await type('End thickness', '0,5858');
    button('Save part 3')!.click();
    http
      .expectOne('/api/batches/3/parts/3')
      .flush({ error: 'End thickness must be a decimal number such as 0.1645.', fields: { 'values.end-thickness': 'Must be a decimal number such as 0.1645.' } }, { status: 400, statusText: 'Bad Request' });
    await settle();
    expect(el().querySelector('form mat-hint.error')?.textContent).toContain('Must be a decimal number');
    // Put right, the reading is no longer marked wrong.
    await type('End thickness', '0.5858');
    expect(el().querySelector('form mat-hint.error')).toBeNull();
    button('Cancel')!.click();
    await settle();
    expect(el().querySelector('form')).toBeNull();
    expect(el().querySelector('.caution')?.textContent).toContain('All 3 parts are recorded');
  });

  it('should offer no correction to an apprentice', async () => {
    await open(run([[1, '0.5856', true]]), { id: 9, email: 'a@example.test', name: 'Sam', role: 'apprentice' });
    expect(el().querySelector('form')).toBeNull();
    expect(button('Correct')).toBeUndefined();
  });

  it('should offer no correction on a closed run', async () => {
    await open(run([[1, '0.5856', true]], 'closed'));
    expect(button('Correct')).toBeUndefined();
  });

  it('should show who corrected a part, and its readings as first recorded', async () => {
    const dto = run([[1, '0.5850', true]]);
    dto.parts![0] = {
      ...dto.parts![0]!, correctedAt: '2026-12-01T11:30:00.000Z', correctedByName: 'Teodor',
      firstRecorded: { touchOff: '0.0000', droAtStop: null, values: { 'end-thickness': '0.5805' } },
    };
    await open(dto);
    const text = el().querySelector('tbody .corrected')?.textContent?.replace(/\s+/g, ' ').trim();
    expect(text).toMatch(/^corrected by Teodor, 1 Dec, \d\d:30; first recorded End thickness 0\.5805, touch-off 0\.0000$/);
  });

  const conflict = { status: 409, statusText: 'Conflict' };

  it('should keep a correction made from a stale form, say someone changed the part, and show the part as it is now', async () => {
    await open(run([[1, '0.5856', true], [2, '5854', false]]));
    el().querySelector<HTMLButtonElement>('button[aria-label="Correct part 2"]')!.click();
    await settle();
    await type('End thickness', '0.5860');
    button('Save part 2')!.click();
    const now = run([[1, '0.5856', true], [2, '0.5854', true]]);
    now.parts![1] = { ...now.parts![1]!, correctedAt: '2026-12-01T11:30:00.000Z', correctedByName: 'Teodor', revision: 'r2-teodor' };
    const stale = http.expectOne('/api/batches/3/parts/2');
    expect(stale.request.body.revision).toBe('r2');
    stale.flush({ error: 'Someone changed part 2 while you were correcting it; nothing was saved.', run: now, part: now.parts![1] }, conflict);
    await settle();
    expect(el().querySelector('form h2')?.textContent).toBe('Correct part 2');
    expect(field('End thickness').value).toBe('0.5860');
    expect(el().querySelector('form p.error')?.textContent).toMatch(/^Someone changed part 2 while you were correcting it; nothing was saved\. Part 2 now reads End thickness 0\.5854 \(corrected by Teodor, 1 Dec, \d\d:30\)\. Your readings are still in the form/);
    expect(Array.from(el().querySelectorAll('tbody tr')).map((r) => r.querySelectorAll('td')[2]?.textContent)).toEqual(['0.5856', '0.5854']);
    // Saving again replaces the part as it is now, knowingly.
    button('Save part 2')!.click();
    const again = http.expectOne('/api/batches/3/parts/2');
    expect(again.request.body).toMatchObject({ values: { 'end-thickness': '0.5860' }, revision: 'r2-teodor' });
    again.flush({ part: { partNo: 2 }, run: run([[1, '0.5856', true], [2, '0.5860', true]]) });
    await settle();
    expect(el().querySelector('[role=status]')?.textContent).toBe('Part 2 corrected.');
  });

  it('should say who closed the run and keep the typed readings in view when recording on a run closed meanwhile', async () => {
    await open(run([[1, '0.5856', true]]));
    await type('End thickness', '0.5855');
    await type('DRO at stop', '-0.1632');
    button('Record part 2')!.click();
    const closed = { ...run([[1, '0.5856', true]], 'closed'), closedAt: '2026-12-01T12:05:00.000Z', closedByName: 'Teodor' };
    http.expectOne('/api/batches/3/parts').flush({ error: 'This batch run was closed by Teodor and is read-only; nothing was saved.', run: closed }, conflict);
    await settle();
    expect(el().querySelector('form')).toBeNull();
    const notice = el().querySelector('.notice')?.textContent ?? '';
    expect(notice).toMatch(/^Not saved: this run was closed by Teodor on 1 Dec 2026, \d\d:05, so part 2 was not recorded\. Your readings were: End thickness 0\.5855, DRO at stop -0\.1632\. Note them down/);
    expect(el().querySelector('.notice')?.getAttribute('role')).toBe('alert');
  });

  it('should not renumber a part silently when a stale tab records a part recorded meanwhile', async () => {
    await open(run([[1, '0.5856', true]]));
    await type('End thickness', '0.5855');
    button('Record part 2')!.click();
    const req = http.expectOne('/api/batches/3/parts');
    expect(req.request.body.partNo).toBe(2);
    req.flush({ error: 'Part 2 is already recorded, by Ines; your readings were not saved.', fields: { partNo: 'Already recorded.' }, run: run([[1, '0.5856', true], [2, '0.5850', true]]) }, conflict);
    await settle();
    expect(el().querySelector('form h2')?.textContent).toBe('Part 3');
    expect(field('End thickness').value).toBe('0.5855');
    expect(el().querySelector('form p.error')?.textContent).toBe('Part 2 is already recorded, by Ines; your readings were not saved. The form now shows part 3; your readings are still in it. Check which part you measured before recording.');
    expect(el().querySelectorAll('tbody tr')).toHaveLength(2);
  });

  it('should keep the readings in view when the run filled up meanwhile', async () => {
    await open(run([[1, '0.5856', true], [2, '0.5857', true]]));
    await type('End thickness', '0.5855');
    button('Record part 3')!.click();
    http.expectOne('/api/batches/3/parts').flush({ error: 'Part 3 is already recorded, by Ines; your readings were not saved.', run: run([[1, '0.5856', true], [2, '0.5857', true], [3, '0.5858', true]]) }, conflict);
    await settle();
    expect(el().querySelector('form')).toBeNull();
    expect(el().querySelector('.notice')?.textContent).toBe('Part 3 is already recorded, by Ines; your readings were not saved. Your readings were: End thickness 0.5855. Note them down.');
  });

  it('should read ".5855" as a reading and flag one far from the nominal, sending it only when confirmed', async () => {
    await open(run([[1, '0.5856', true]]));
    await type('End thickness', '.5855');
    expect(el().querySelector('mat-form-field.pass')).not.toBeNull();
    expect(el().querySelector('mat-checkbox')).toBeNull();
    await type('End thickness', '5854');
    expect(el().querySelector('mat-form-field.fail mat-hint')?.textContent).toContain('far from the nominal: check the decimal point');
    button('Record part 2')!.click();
    const first = http.expectOne('/api/batches/3/parts');
    expect(first.request.body.confirm).toBeUndefined();
    first.flush(
      { error: 'Some readings are not valid.', fields: { 'values.end-thickness': 'End thickness 5854 is far from the nominal 0.5854 in: check the decimal point.' } },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(el().querySelector('form mat-hint.error')?.textContent).toContain('5854 is far from the nominal');
    (el().querySelector('mat-checkbox input') as HTMLInputElement).click();
    await settle();
    button('Record part 2')!.click();
    const second = http.expectOne('/api/batches/3/parts');
    expect(second.request.body).toMatchObject({ partNo: 2, values: { 'end-thickness': '5854' }, confirm: true });
    second.flush({ part: { partNo: 2 }, run: run([[1, '0.5856', true], [2, '5854', false]]) });
    await settle();
    expect(el().querySelector('[role=status]')?.textContent).toBe('Part 2 recorded.');
  });

  it('should state the resolution of the figures', async () => {
    await open(run([[1, '0.5856', true]]));
    expect(el().querySelector('.resolution')?.textContent).toBe('All figures to 5 decimals (in).');
  });
});
