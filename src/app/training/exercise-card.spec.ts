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

    it('should emit the typed answer on Check answer and clear the box', async () => {
      const input = el.querySelector('input') as HTMLInputElement;
      input.value = ' 0.2615 ';
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      await fixture.whenStable();
      expect(fixture.componentInstance.answers).toEqual(['0.2615']);
      expect((el.querySelector('input') as HTMLInputElement).value).toBe('');
    });

    it('should emit a hint request', () => {
      (el.querySelector('button[type=button]') as HTMLButtonElement).click();
      expect(fixture.componentInstance.hints).toBe(1);
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
  template: `<sw-exercise-card [problem]="problem()" (answered)="answers.push($event)" (hint)="hints = hints + 1" />`,
})
class Host {
  readonly problem = signal<ProblemView>(OPEN);
  answers: string[] = [];
  hints = 0;
}
