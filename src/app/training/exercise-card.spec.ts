import { Component, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import { ExerciseCard, type ProblemView } from './exercise-card';

const OPEN: ProblemView = {
  title: 'Depth to stop on an angle block',
  prompt: 'How far down do you feed?',
  givens: [{ label: 'Taper length L', value: '3.000', unit: 'in' }, { label: 'Angle α', value: '5', unit: '°' }],
  answerLabel: 'Depth to stop h',
  unit: 'in',
  tolerance: '0.0005',
  hints: [{ label: 'Stock removed at the end', formula: 'd = L · tan α', substituted: 'd = 3.0000 · tan 5°', value: '?', unit: 'in' }],
  hintsAvailable: 4,
  attempts: [{ answer: '0.3000', correct: false }],
  attemptsLeft: 2,
  closed: false,
  correct: false,
  solution: null,
  cautions: [],
};

describe('ExerciseCard', () => {
  let fixture: ComponentFixture<Host>;
  let el: HTMLElement;

  beforeEach(async () => {
    fixture = TestBed.createComponent(Host);
    el = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  describe('an open problem', () => {
    it('should show the prompt, the givens, the hints shown so far and the tolerance', () => {
      expect(el.textContent).toContain('How far down do you feed?');
      expect(el.querySelectorAll('.givens dd')[0]!.textContent).toContain('3.000 in');
      expect(el.querySelectorAll('.hints li')).toHaveLength(1);
      expect(el.textContent).toContain('Checked to ±0.0005 in · 2 tries left');
      expect(el.textContent).toContain('Hint 1/4');
    });

    it('should mark a wrong answer as outside the tolerance', () => {
      expect(el.querySelector('.attempts .wrong')!.textContent).toContain('not within ±0.0005 in');
    });

    it('should emit the typed answer on Check answer, keep it while it is not graded, and clear the box once it is', async () => {
      const input = el.querySelector('input') as HTMLInputElement;
      input.value = ' 0.2615 in. ';
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      await fixture.whenStable();
      expect(fixture.componentInstance.answers).toEqual(['0.2615 in.']);
      // Refused without grading (a unit slip, a typo): the text stays to be corrected.
      fixture.componentInstance.error.set('Answer in inches (in), or as a plain number.');
      await fixture.whenStable();
      expect((el.querySelector('input') as HTMLInputElement).value).toBe(' 0.2615 in. ');
      // Graded: one more attempt on the problem, and the box is empty for the next try.
      fixture.componentInstance.problem.set({ ...OPEN, attempts: [...OPEN.attempts, { answer: '0.2615', correct: false }], attemptsLeft: 1 });
      await fixture.whenStable();
      expect((el.querySelector('input') as HTMLInputElement).value).toBe('');
    });

    it('should keep its controls focusable while the server answers, so keyboard focus is not lost', async () => {
      const input = el.querySelector('input') as HTMLInputElement;
      const hint = el.querySelector('button[type=button]') as HTMLButtonElement;
      hint.focus();
      fixture.componentInstance.busy.set(true);
      await fixture.whenStable();
      // Not disabled (a disabled control drops the focus to the page); marked unavailable instead.
      expect(hint.disabled).toBe(false);
      expect(hint.getAttribute('aria-disabled')).toBe('true');
      expect(document.activeElement).toBe(hint);
      expect(input.disabled).toBe(false);
      expect(input.readOnly).toBe(true);
      // A press while busy asks for nothing.
      hint.click();
      expect(fixture.componentInstance.hints).toBe(0);
    });

    it('should move focus to the verdict when its answer closes the problem', async () => {
      const input = el.querySelector('input') as HTMLInputElement;
      input.value = '0.2615';
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      input.focus();
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      fixture.componentInstance.problem.set({
        ...OPEN, closed: true, correct: true, attemptsLeft: 0, attempts: [...OPEN.attempts, { answer: '0.2615', correct: true }],
        solution: { answer: '0.2615', steps: [] },
      });
      await fixture.whenStable();
      expect(document.activeElement).toBe(el.querySelector('.verdict'));
    });

    it('should emit a hint request', () => {
      (el.querySelector('button[type=button]') as HTMLButtonElement).click();
      expect(fixture.componentInstance.hints).toBe(1);
    });

    it('should show its cautions unless the page shows them once for every problem', async () => {
      fixture.componentInstance.problem.set({ ...OPEN, cautions: ['Clamp the work before cutting (test caution).'] });
      await fixture.whenStable();
      expect(el.querySelector('sw-cautions')!.textContent).toContain('Clamp the work');
      fixture.componentInstance.showCautions.set(false);
      await fixture.whenStable();
      expect(el.querySelector('sw-cautions')).toBeNull();
    });
  });

  describe('a closed problem', () => {
    it('should show the answer and the worked solution instead of the answer box', async () => {
      fixture.componentInstance.problem.set({
        ...OPEN,
        closed: true,
        correct: true,
        attemptsLeft: 0,
        solution: { answer: '0.2615', steps: [{ label: 'Depth to stop', formula: 'h = L · sin α', substituted: 'h = 3.0000 · sin 5°', value: '0.2615', unit: 'in' }] },
      });
      await fixture.whenStable();
      expect(el.querySelector('form')).toBeNull();
      expect(el.querySelector('.solution')!.textContent).toContain('The answer is 0.2615');
      expect(el.querySelector('.steps')!.textContent).toContain('h = L · sin α');
    });

    it("should say who graded it by hand and why, and call it counted right rather than correct", async () => {
      fixture.componentInstance.problem.set({
        ...OPEN,
        closed: true,
        correct: true,
        attemptsLeft: 0,
        solution: { answer: '0.2615', steps: [] },
        grade: { correct: true, note: 'Right to the thousandth.', by: 'Teodor Vance', at: '2026-12-04T10:00:00.000Z' },
      });
      await fixture.whenStable();
      const solution = el.querySelector('.solution')!.textContent!.replace(/\s+/g, ' ');
      expect(solution).toContain('Counted right. The answer is 0.2615');
      expect(solution).toContain('Teodor Vance counted this right: “Right to the thousandth.”');
    });

    it('should show why a late answer was refused beside the worked solution (closed meanwhile elsewhere)', async () => {
      fixture.componentInstance.error.set('This problem is closed; no more answers are taken.');
      fixture.componentInstance.problem.set({ ...OPEN, closed: true, attemptsLeft: 0, solution: { answer: '0.2615', steps: [] } });
      await fixture.whenStable();
      expect(el.querySelector('[role=alert]')!.textContent).toContain('This problem is closed');
      expect(el.querySelector('.solution')).not.toBeNull();
    });

    it('should close up the degree sign of an angle step, and space other units', async () => {
      const angleStep = { label: 'Angle', formula: 'α = atan(d / L)', substituted: 'α = atan(0.5700 / 1.0000)', value: '29.6831', unit: '°' };
      const lengthStep = { label: 'Stock removed at the end', formula: 'd = T − t', substituted: 'd = 0.8750 − 0.3050', value: '0.5700', unit: 'in' };
      fixture.componentInstance.problem.set({
        ...OPEN, unit: '°', closed: true, attemptsLeft: 0, hints: [],
        solution: { answer: '29.6831° (29°40\'59")', steps: [lengthStep, angleStep] },
      });
      await fixture.whenStable();
      const steps = Array.from(el.querySelectorAll('.steps li')).map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
      expect(steps[0]).toMatch(/= 0\.5700 in$/);
      expect(steps[1]).toMatch(/= 29\.6831°$/);
    });

    it('should print an angle answer with its degree sign once and a count as blocks, checked exactly', async () => {
      fixture.componentInstance.problem.set({
        ...OPEN, unit: '°', tolerance: '0.01', closed: true, correct: false, attemptsLeft: 0,
        attempts: [{ answer: '19.5', correct: false }],
        solution: { answer: '19.4600° (19°27\'36")', steps: [] },
      });
      await fixture.whenStable();
      expect(el.querySelector('.verdict')!.textContent!.replace(/\s+/g, ' ')).toContain('The answer is 19.4600° (19°27\'36").');
      expect(el.querySelector('.verdict')!.textContent).not.toContain(') °');
      expect(el.querySelector('.attempts .wrong')!.textContent).toContain('19.5° — not within ±0.01°');

      fixture.componentInstance.problem.set({ ...OPEN, unit: 'blocks', tolerance: '0', attempts: [{ answer: '6', correct: false }] });
      await fixture.whenStable();
      expect(el.textContent).toContain('Counted exactly · 2 tries left');
      expect(el.querySelector('.attempts .wrong')!.textContent).toContain('6 blocks — not the number wanted');
      expect(el.textContent).not.toContain('±0 blocks');
    });
  });
});

@Component({
  imports: [ExerciseCard],
  template: `<sw-exercise-card [problem]="problem()" [busy]="busy()" [error]="error()" [showCautions]="showCautions()" (answered)="answers.push($event)" (hint)="hints = hints + 1" />`,
})
class Host {
  readonly problem = signal<ProblemView>(OPEN);
  readonly busy = signal(false);
  readonly error = signal<string | null>(null);
  readonly showCautions = signal(true);
  answers: string[] = [];
  hints = 0;
}
