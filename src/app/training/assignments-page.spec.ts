import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { AssignmentDto, ScoreTableDto } from '../../../shared/api/training';
import { Auth } from '../core/auth';
import AssignmentsPage from './assignments-page';
import { localTimeText, localZoneText } from './due-text';

const DUE = '2026-12-04T05:00:00.000Z';
const summary = { userId: 4, name: 'Sam Okafor', status: 'in-progress' as const, correct: 2, closed: 2, total: 3, score: 67, completedAt: null };
const ASSIGNMENT: AssignmentDto = {
  id: 8, title: 'Tonight: one sine stack', instructions: '', items: [{ type: 'sine-stack', count: 1 }],
  dueAt: DUE, createdAt: '2026-12-01T08:00:00.000Z', createdBy: 'Lead', work: [summary],
};
const SCORES: ScoreTableDto = {
  assignments: [{ id: 8, title: ASSIGNMENT.title, dueAt: DUE }],
  rows: [{ userId: 4, name: 'Sam Okafor', role: 'apprentice', active: true, cells: [{ assignmentId: 8, assigned: true, summary }] }],
};

describe('AssignmentsPage', () => {
  let fixture: ComponentFixture<AssignmentsPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function settle(): Promise<void> {
    for (let i = 0; i < 3; i++) {
      await new Promise((resolve) => setTimeout(resolve));
      await fixture.whenStable();
    }
  }

  const SAM = { id: 4, email: 'sam@example.test', name: 'Sam Okafor', role: 'apprentice', active: true, createdAt: DUE };
  const RIA = { id: 6, email: 'ria@example.test', name: 'Ria Venn', role: 'apprentice', active: true, createdAt: DUE };

  async function open(role: 'lead' | 'apprentice', members: object[] = [SAM]): Promise<void> {
    const user = { id: role === 'lead' ? 2 : 4, email: 'x@example.test', name: 'X', role };
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal(user), ready: () => Promise.resolve(user) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AssignmentsPage);
    el = fixture.nativeElement as HTMLElement;
    await settle();
    http.expectOne('/api/training/assignments').flush({ assignments: [ASSIGNMENT] });
    await settle();
    if (role === 'lead') {
      http.expectOne('/api/training/scores').flush(SCORES);
      await settle();
      http.expectOne('/api/team/members').flush({ members });
      await settle();
    }
  }

  /** Answers the lead's reload after a change: the list, the score table and the members. */
  async function flushReload(assignments: AssignmentDto[], members: object[]): Promise<void> {
    http.expectOne('/api/training/assignments').flush({ assignments });
    await settle();
    http.expectOne('/api/training/scores').flush(SCORES);
    await settle();
    http.expectOne('/api/team/members').flush({ members });
    await settle();
  }

  afterEach(() => http.verify());

  it('should put the score table in its own focusable scroll box, with due times on the reader\'s clock', async () => {
    await open('lead');
    const wrap = el.querySelector('.table-wrap') as HTMLElement;
    expect(wrap.getAttribute('tabindex')).toBe('0');
    expect(wrap.getAttribute('role')).toBe('region');
    expect(wrap.getAttribute('aria-label')).toMatch(/scrolls sideways/);
    expect(el.querySelector('.scroll-note')!.textContent).toContain('scrolls sideways');
    expect(el.querySelector('th[scope=row] .name')!.textContent).toBe('Sam Okafor');
    const header = el.querySelectorAll('thead th')[1]!.textContent!;
    expect(header).toContain(`due ${localTimeText(DUE, { short: true })}`);
    expect(el.querySelector('.table-note')!.textContent).toContain(`Due times on your clock (${localZoneText(DUE)})`);
    expect(header).not.toContain('due 2026-12-04');
    expect(el.querySelector('.list .due')!.textContent).toContain(`due ${localTimeText(DUE)}`);
  });

  it('should send the browser\'s time zone with a new assignment and outline every refused count', async () => {
    await open('lead');
    const countInput = (title: string) => Array.from(el.querySelectorAll('mat-form-field')).find((f) => f.textContent!.includes(title))!;
    const type = async (field: Element, value: string) => {
      const input = field.querySelector('input') as HTMLInputElement;
      input.value = value;
      input.dispatchEvent(new Event('input'));
      await settle();
    };
    await type(countInput('Depth to stop on an angle block'), '2.5');
    await type(countInput('Sine-bar stack for an angle'), '11');
    (el.querySelector('mat-checkbox input') as HTMLInputElement).click();
    await settle();
    (el.querySelector('form.new-form button[type=submit]') as HTMLButtonElement).click();
    await settle();
    const req = http.expectOne('/api/training/assignments');
    expect(req.request.body.timeZone).toBe(Intl.DateTimeFormat().resolvedOptions().timeZone);
    expect(req.request.body.dueAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:00\.000Z$/);
    expect(req.request.body.items).toEqual([{ type: 'taper-depth', count: 2.5 }, { type: 'sine-stack', count: 11 }]);
    req.flush(
      { error: 'Some fields are not valid.', fields: { 'items.0.count': 'Count must be a whole number.', 'items.1.count': 'Count must be at most 10.' } },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    for (const title of ['Depth to stop on an angle block', 'Sine-bar stack for an angle']) {
      const field = countInput(title);
      expect(field.classList).toContain('mat-form-field-invalid');
      expect(field.querySelector('.field-error')!.textContent).toMatch(/whole number|at most 10/);
    }
    // A count nobody refused is not outlined.
    expect(countInput('Tail-stock offset').classList).not.toContain('mat-form-field-invalid');
  });

  it('should move the due date of a sent assignment and say who was told', async () => {
    await open('lead');
    (el.querySelector('button[aria-label="Change the due date of Tonight: one sine stack"]') as HTMLButtonElement).click();
    await settle();
    const input = el.querySelector('.due-form input') as HTMLInputElement;
    input.value = '2026-12-10T16:00';
    input.dispatchEvent(new Event('input'));
    await settle();
    (el.querySelector('.due-form button[type=submit]') as HTMLButtonElement).click();
    await settle();
    const req = http.expectOne('/api/training/assignments/8');
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({ dueAt: new Date('2026-12-10T16:00').toISOString(), timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone });
    req.flush({ ...ASSIGNMENT, dueAt: new Date('2026-12-10T16:00').toISOString(), mailSent: 1 });
    await settle();
    await flushReload([ASSIGNMENT], []);
    expect(el.querySelector('[role=status]')!.textContent).toContain(`"Tonight: one sine stack" is now due ${localTimeText(new Date('2026-12-10T16:00').toISOString())}; 1 e-mail notice sent`);
    expect(el.querySelector('.due-form')).toBeNull();
  });

  it('should show a refused due date under its box, outlined', async () => {
    await open('lead');
    (el.querySelector('button[aria-label="Change the due date of Tonight: one sine stack"]') as HTMLButtonElement).click();
    await settle();
    (el.querySelector('.due-form button[type=submit]') as HTMLButtonElement).click();
    await settle();
    http.expectOne('/api/training/assignments/8').flush({ error: 'Some fields are not valid.', fields: { dueAt: 'The due date has passed: choose a time from now on.' } }, { status: 400, statusText: 'Bad Request' });
    await settle();
    const field = el.querySelector('.due-form mat-form-field')!;
    expect(field.classList).toContain('mat-form-field-invalid');
    expect(field.textContent).toContain('The due date has passed');
  });

  it('should offer "Add apprentices" only while an active apprentice lacks the assignment, and tick only those', async () => {
    await open('lead');
    expect(el.querySelector('button[aria-label="Add apprentices to Tonight: one sine stack"]')).toBeNull();
    fixture.destroy();
    TestBed.resetTestingModule();
    await open('lead', [SAM, RIA, { ...RIA, id: 7, name: 'Gone Apprentice', active: false }]);
    (el.querySelector('button[aria-label="Add apprentices to Tonight: one sine stack"]') as HTMLButtonElement).click();
    await settle();
    const form = el.querySelector('.add-form')!;
    expect(Array.from(form.querySelectorAll('mat-checkbox')).map((c) => c.textContent!.trim())).toEqual(['Ria Venn']);
    // Nothing ticked: said by the box, nothing sent.
    (form.querySelector('button[type=submit]') as HTMLButtonElement).click();
    await settle();
    http.expectNone('/api/training/assignments/8/assignees');
    expect(form.querySelector('[role=alert]')!.textContent).toContain('Tick at least one apprentice');
    (form.querySelector('mat-checkbox input') as HTMLInputElement).click();
    await settle();
    (form.querySelector('button[type=submit]') as HTMLButtonElement).click();
    await settle();
    const req = http.expectOne('/api/training/assignments/8/assignees');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ assigneeIds: [6], timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone });
    req.flush({ ...ASSIGNMENT, work: [summary, { ...summary, userId: 6, name: 'Ria Venn', status: 'not-started' }], mailSent: 1 });
    await settle();
    await flushReload([{ ...ASSIGNMENT, work: [summary, { ...summary, userId: 6, name: 'Ria Venn' }] }], [SAM, RIA]);
    expect(el.querySelector('[role=status]')!.textContent).toContain('"Tonight: one sine stack" given to Ria Venn; 1 e-mail notice sent.');
    expect(el.querySelector('.add-form')).toBeNull();
    // Both have it now: the button is gone.
    expect(el.querySelector('button[aria-label="Add apprentices to Tonight: one sine stack"]')).toBeNull();
  });

  it('should show a refusal of the server in the add box and reload the list', async () => {
    await open('lead', [SAM, RIA]);
    (el.querySelector('button[aria-label="Add apprentices to Tonight: one sine stack"]') as HTMLButtonElement).click();
    await settle();
    (el.querySelector('.add-form mat-checkbox input') as HTMLInputElement).click();
    await settle();
    (el.querySelector('.add-form button[type=submit]') as HTMLButtonElement).click();
    await settle();
    http.expectOne('/api/training/assignments/8/assignees').flush({ error: 'Ria Venn already has this assignment; choose only apprentices who do not.' }, { status: 409, statusText: 'Conflict' });
    await settle();
    await flushReload([ASSIGNMENT], [SAM, RIA]);
    expect(el.querySelector('.add-form [role=alert]')!.textContent).toContain('Ria Venn already has this assignment');
  });

  it('should show an apprentice their due times on their own clock', async () => {
    await open('apprentice');
    expect(el.querySelector('mat-card-subtitle')!.textContent).toContain(`Due ${localTimeText(DUE)} · from Lead`);
  });
});
