import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { ReviewProblemDto, WorkReviewDto } from '../../../shared/api/training';
import { Auth } from '../core/auth';
import { localTimeText } from './due-text';
import WorkReviewPage from './work-review-page';

const step = (label: string, value: string) => ({ label, formula: 'h = L · sin α', substituted: '1.5 · sin 10°', value, unit: 'in' });

/** A problem as the API would send it; values are test data, not a calculation check. */
function problem(position: number, extra: Partial<ReviewProblemDto>): ReviewProblemDto {
  return {
    position,
    type: 'taper-depth',
    title: 'Depth to stop on an angle block',
    prompt: 'How deep is the stop?',
    givens: [{ label: 'Taper length L', value: '1.500', unit: 'in' }],
    answerLabel: 'Depth to stop h',
    unit: 'in',
    tolerance: '0.0005',
    attempts: [],
    attemptsLeft: 3,
    hintsAvailable: 2,
    hints: [],
    closed: false,
    correct: false,
    grade: null,
    cautions: [],
    hintsUsed: 0,
    solution: { answer: '0.2605', exact: '0.26047', steps: [step('Sine of the angle', '0.17365'), step('Depth to stop h', '0.2605')] },
    ...extra,
  };
}

const WORK: WorkReviewDto = {
  assignment: {
    id: 7, title: 'Tapers on the mill', instructions: '', items: [{ type: 'taper-depth', count: 2 }],
    dueAt: '2026-12-20T16:00:00.000Z', createdAt: '2026-12-01T08:00:00.000Z', createdBy: 'Lead',
    work: [{ userId: 4, name: 'Sam Okafor', status: 'in-progress', correct: 1, closed: 1, total: 2, score: 50, completedAt: null }],
  },
  apprentice: { id: 4, name: 'Sam Okafor' },
  problems: [
    problem(1, {
      closed: true, correct: true, attemptsLeft: 0,
      attempts: [
        { answer: '0.3000', correct: false, at: '2026-12-02T09:10:00.000Z' },
        { answer: '0.2605', correct: true, at: '2026-12-02T09:12:00.000Z' },
      ],
    }),
    problem(2, { hintsUsed: 1, hints: [step('Sine of the angle', '0.17365')] }),
  ],
};

describe('WorkReviewPage', () => {
  let fixture: ComponentFixture<WorkReviewPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function open(role = 'lead', ownId = 1): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Auth, useValue: { user: signal({ id: ownId, email: 'x@example.test', name: 'X', role }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(WorkReviewPage);
    fixture.componentRef.setInput('id', '7');
    fixture.componentRef.setInput('userId', '4');
    el = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  /** Lets the page's awaited request settle and re-render. */
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  }

  /** Types the reason in the open grade form and saves it. */
  async function giveReason(text: string): Promise<void> {
    const reason = el.querySelector('form.grade-form textarea') as HTMLTextAreaElement;
    reason.value = text;
    reason.dispatchEvent(new Event('input'));
    await settle();
    (el.querySelector('form.grade-form button[type=submit]') as HTMLButtonElement).click();
    await settle();
  }

  afterEach(() => http.verify());

  it('should show every answer in order, marked right or wrong in words, with the hints used', async () => {
    await open();
    http.expectOne('/api/training/assignments/7/work/4').flush(WORK);
    await settle();
    expect(el.querySelector('h1')!.textContent).toContain('Sam Okafor: Tapers on the mill');
    expect(el.textContent).toContain('In progress');
    expect(el.textContent).toContain('1 of 2 right (50%)');
    const answers = Array.from(el.querySelectorAll('[aria-label="Answers to problem 1"] li')).map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
    // Times on the reader's own clock (the test runs in the machine's zone), never bare UTC.
    expect(answers).toEqual([
      `cancel 0.3000 in — Wrong · ${localTimeText('2026-12-02T09:10:00.000Z')}`.replace(/\s+/g, ' '),
      `check_circle 0.2605 in — Right · ${localTimeText('2026-12-02T09:12:00.000Z')}`.replace(/\s+/g, ' '),
    ]);
    expect(el.querySelector('.meta')!.textContent).toContain(`Due ${localTimeText('2026-12-20T16:00:00.000Z')}`);
    expect(el.querySelector('[aria-label="Answers to problem 2"]')!.textContent).toContain('No answer yet.');
    const subtitles = Array.from(el.querySelectorAll('mat-card-subtitle')).map((s) => s.textContent!.replace(/\s+/g, ' ').trim());
    expect(subtitles[0]).toBe('Closed · answered right · hints used 0 of 2');
    expect(subtitles[1]).toBe('Open · 3 tries left · hints used 1 of 2');
  });

  it('should offer the worked solution and exact answer of an open problem in a panel', async () => {
    await open();
    http.expectOne('/api/training/assignments/7/work/4').flush(WORK);
    await settle();
    const panel = el.querySelectorAll('mat-expansion-panel')[1]!;
    expect(panel.querySelector('mat-expansion-panel-header')!.textContent).toContain('Worked solution');
    (panel.querySelector('mat-expansion-panel-header') as HTMLElement).click();
    await settle();
    expect(panel.textContent).toContain('Sine of the angle');
    expect(panel.textContent).toContain('Depth to stop h = 0.2605 in');
    expect(panel.textContent).toContain('exact 0.26047');
  });

  it('should print an angle answer and its worked solution with one degree sign', async () => {
    await open();
    const angle = problem(1, {
      type: 'taper-angle', unit: '°', tolerance: '0.01', answerLabel: 'Angle α', closed: true, correct: true, attemptsLeft: 0,
      attempts: [{ answer: '35°', correct: true, at: '2026-12-02T09:10:00.000Z' }, { answer: '34.99', correct: true, at: '2026-12-02T09:11:00.000Z' }],
      solution: { answer: '34.9920° (34°59\'31")', exact: '34.99203', steps: [{ label: 'Angle', formula: 'α = atan(d / L)', substituted: 'α = atan(0.7000 / 1.0000)', value: '34.9920', unit: '°' }] },
    });
    http.expectOne('/api/training/assignments/7/work/4').flush({ ...WORK, problems: [angle] });
    await settle();
    const text = el.querySelector('.problems')!.textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('35° — Right');
    expect(text).toContain('34.99° — Right');
    expect(text).toContain('answer 34.9920° (34°59\'31")');
    expect(text).toContain('= 34.9920°');
    expect(text).toContain('answers within ±0.01° are right');
    expect(text).not.toMatch(/°\s*°|"\)\s*°| °/);
  });

  it('should grade a closed problem by hand with a reason, and show the new score', async () => {
    await open();
    http.expectOne('/api/training/assignments/7/work/4').flush(WORK);
    await settle();
    // Only the closed problem offers it.
    expect(el.querySelector('button[aria-label="Grade by hand: problem 2"]')).toBeNull();
    (el.querySelector('button[aria-label="Grade by hand: problem 1"]') as HTMLButtonElement).click();
    await settle();
    const form = el.querySelector('form.grade-form')!;
    // It opens on the other grade: problem 1 was answered right, so "Counts as wrong" is chosen.
    expect(form.querySelector('mat-button-toggle.mat-button-toggle-checked')!.textContent).toContain('Counts as wrong');
    // No reason: said by the box, nothing sent.
    (form.querySelector('button[type=submit]') as HTMLButtonElement).click();
    await settle();
    http.expectNone((r) => r.url.endsWith('/grade'));
    expect(form.textContent).toContain('Say why the grade changes');
    await giveReason('The depth was for the wrong corner.');
    const req = http.expectOne('/api/training/assignments/7/work/4/problems/1/grade');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ correct: false, note: 'The depth was for the wrong corner.' });
    const graded = { ...WORK.problems[0]!, correct: false, grade: { correct: false, note: 'The depth was for the wrong corner.', by: 'Teodor Vance', at: '2026-12-04T10:00:00.000Z' } };
    req.flush(graded);
    await settle();
    http.expectOne('/api/training/assignments/7/work/4').flush({
      ...WORK,
      assignment: { ...WORK.assignment, work: [{ ...WORK.assignment.work[0]!, correct: 0, score: 0 }] },
      problems: [graded, WORK.problems[1]!],
    });
    await settle();
    expect(el.querySelector('form.grade-form')).toBeNull();
    expect(el.textContent).toContain('0 of 2 right (0%)');
    expect(el.textContent).toContain('counted wrong by hand');
    expect(el.querySelector('.grade')!.textContent!.replace(/\s+/g, ' ')).toContain(`Teodor Vance counted it wrong on ${localTimeText('2026-12-04T10:00:00.000Z')}: “The depth was for the wrong corner.”`);
  });

  it("should show the server's refusal of a grade in the form", async () => {
    await open();
    http.expectOne('/api/training/assignments/7/work/4').flush(WORK);
    await settle();
    (el.querySelector('button[aria-label="Grade by hand: problem 1"]') as HTMLButtonElement).click();
    await settle();
    await giveReason('Counted right after all.');
    http.expectOne('/api/training/assignments/7/work/4/problems/1/grade').flush({ error: 'This problem is still open: the apprentice is still working it.' }, { status: 409, statusText: 'Conflict' });
    await settle();
    expect(el.querySelector('form.grade-form [role=alert]')!.textContent).toContain('This problem is still open');
  });

  it("should show the server's message when the lead may not read the work (404)", async () => {
    await open();
    http.expectOne('/api/training/assignments/7/work/4').flush({ error: 'No work for that apprentice on this assignment.' }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('No work for that apprentice on this assignment.');
    expect(el.querySelector('mat-card')).toBeNull();
  });

  it("should tell an apprentice who opened the lead's view of their own work where their page is (403)", async () => {
    await open('apprentice', 4);
    http.expectOne('/api/training/assignments/7/work/4').flush({ error: 'Only lead or admin members may do this.' }, { status: 403, statusText: 'Forbidden' });
    await settle();
    expect(el.querySelector('[role=alert]')!.textContent).toContain("This is the lead hand's view of your work");
    expect(el.querySelector('a[href="/training/assignments/7"]')!.textContent).toContain('Open your own work on this assignment');
    expect(el.querySelector('mat-card')).toBeNull();
  });

  it("should tell a machinist what the page is, without a link to someone else's work (403)", async () => {
    await open('machinist', 9);
    http.expectOne('/api/training/assignments/7/work/4').flush({ error: 'Only lead or admin members may do this.' }, { status: 403, statusText: 'Forbidden' });
    await settle();
    expect(el.querySelector('[role=alert]')!.textContent).toContain("shows an apprentice's answers to their lead hand");
    expect(el.querySelector('a[href="/training/assignments/7"]')).toBeNull();
  });
});
