import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { AssignmentDto, ProblemDto } from '../../../shared/api/training';
import AssignmentWorkPage from './assignment-work-page';
import { localTimeText } from './due-text';

const CAUTION = 'Clamp the work before cutting (test caution).';
const step = { label: 'Depth to stop h', formula: 'h = L · sin α', substituted: 'h = 1.5000 · sin 10°', value: '0.2605', unit: 'in' };

/** A problem as the API would send it; values are test data, not a calculation check. */
function problem(position: number, extra: Partial<ProblemDto> = {}): ProblemDto {
  return {
    position, type: 'taper-depth', title: 'Depth to stop on an angle block', prompt: `Problem text ${position}`,
    givens: [{ label: 'Taper length L', value: '1.500', unit: 'in' }], answerLabel: 'Depth to stop h', unit: 'in', tolerance: '0.0005',
    attempts: [], attemptsLeft: 3, hintsAvailable: 2, hints: [], closed: false, correct: false, cautions: [CAUTION], solution: null, grade: null,
    ...extra,
  };
}

function assignment(correct: number, closed: number): AssignmentDto {
  return {
    id: 7, title: 'Tapers on the mill', instructions: '', items: [{ type: 'taper-depth', count: 2 }],
    dueAt: '2026-12-04T05:00:00.000Z', createdAt: '2026-12-01T08:00:00.000Z', createdBy: 'Lead',
    work: [{ userId: 4, name: 'Sam Okafor', status: 'in-progress', correct, closed, total: 2, score: correct * 50, completedAt: null }],
  };
}

describe('AssignmentWorkPage', () => {
  let fixture: ComponentFixture<AssignmentWorkPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  async function settle(): Promise<void> {
    for (let i = 0; i < 3; i++) {
      await new Promise((resolve) => setTimeout(resolve));
      await fixture.whenStable();
    }
  }

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AssignmentWorkPage);
    fixture.componentRef.setInput('id', '7');
    el = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  it('should show the due time on the reader\'s clock and the cautions once for the page', async () => {
    http.expectOne('/api/training/assignments/7/work').flush({ assignment: assignment(0, 0), problems: [problem(1), problem(2)] });
    await settle();
    expect(el.querySelector('.meta')!.textContent).toContain(`Due ${localTimeText('2026-12-04T05:00:00.000Z')}`);
    expect(el.querySelector('.meta')!.textContent).not.toContain('2026-12-04 05:00 UTC');
    expect(el.querySelectorAll('sw-exercise-card')).toHaveLength(2);
    expect(el.querySelectorAll('sw-cautions')).toHaveLength(1);
    expect(el.querySelector('sw-cautions')!.textContent).toContain(CAUTION);
  });

  it('should say why a hint was refused and read the page again when the problem was closed elsewhere (409)', async () => {
    http.expectOne('/api/training/assignments/7/work').flush({ assignment: assignment(0, 0), problems: [problem(1), problem(2)] });
    await settle();
    (el.querySelectorAll('sw-exercise-card')[1]!.querySelector('button[type=button]') as HTMLButtonElement).click();
    await settle();
    http.expectOne('/api/training/assignments/7/problems/2/hints').flush({ error: 'This problem is closed; its worked solution is shown.' }, { status: 409, statusText: 'Conflict' });
    await settle();
    // Answered right on another device meanwhile: the page reads the work again.
    const closed = problem(2, { closed: true, correct: true, attemptsLeft: 0, attempts: [{ answer: '0.2605', correct: true, at: '2026-12-03T20:00:00.000Z' }], solution: { answer: '0.2605', steps: [step] } });
    http.expectOne('/api/training/assignments/7/work').flush({ assignment: assignment(1, 1), problems: [problem(1), closed] });
    await settle();
    const card = el.querySelectorAll('sw-exercise-card')[1]!;
    expect(card.querySelector('[role=alert]')!.textContent).toContain('This problem is closed; its worked solution is shown.');
    expect(card.querySelector('.solution')!.textContent).toContain('The answer is 0.2605 in');
    expect(card.textContent).not.toContain('tries left');
    expect(el.querySelector('.meta')!.textContent).toContain('1 of 2 right (50%)');
  });

  it('should read the page again when an answer comes too late (409), showing the solution and the new score', async () => {
    http.expectOne('/api/training/assignments/7/work').flush({ assignment: assignment(0, 0), problems: [problem(1), problem(2)] });
    await settle();
    const input = el.querySelector('sw-exercise-card input') as HTMLInputElement;
    input.value = '4';
    input.dispatchEvent(new Event('input'));
    await settle();
    (el.querySelector('sw-exercise-card button[type=submit]') as HTMLButtonElement).click();
    await settle();
    http.expectOne('/api/training/assignments/7/problems/1/attempts').flush({ error: 'This problem is closed; no more answers are taken.' }, { status: 409, statusText: 'Conflict' });
    await settle();
    const closed = problem(1, { closed: true, correct: true, attemptsLeft: 0, solution: { answer: '0.2605', steps: [step] } });
    http.expectOne('/api/training/assignments/7/work').flush({ assignment: assignment(1, 1), problems: [closed, problem(2)] });
    await settle();
    const card = el.querySelector('sw-exercise-card')!;
    expect(card.querySelector('[role=alert]')!.textContent).toContain('This problem is closed; no more answers are taken.');
    expect(card.querySelector('.solution')).not.toBeNull();
    expect(el.querySelector('.meta')!.textContent).toContain('1 of 2 right (50%)');
  });

  it("should show the server's word when the assignment is gone (withdrawn by the lead)", async () => {
    const gone = 'This assignment no longer exists: your lead may have withdrawn it. Your other work is under My assignments.';
    http.expectOne('/api/training/assignments/7/work').flush({ error: gone }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(el.querySelector('[role=alert]')!.textContent).toContain(gone);
    expect(el.textContent).not.toContain('not one of yours');
  });
});
