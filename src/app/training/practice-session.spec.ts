import { generateExercise } from '../../../shared/training/generators';
import { PracticeSession } from './practice-session';

describe('PracticeSession', () => {
  it('should reproduce the problem of its seed', () => {
    const session = new PracticeSession('sine-stack', 42);
    expect(session.exercise()).toEqual(generateExercise('sine-stack', 42));
    expect(session.view().closed).toBe(false);
  });

  it('should reveal hints one at a time, never more than the steps', () => {
    const session = new PracticeSession('taper-depth', 7);
    const steps = session.exercise().steps.length;
    for (let i = 0; i < steps + 2; i++) session.revealHint();
    expect(session.view().hints).toHaveLength(steps);
    expect(session.view().hints[steps - 1]!.value).toBe('?');
  });

  it('should close with the worked solution on the first readable answer', () => {
    const session = new PracticeSession('taper-depth', 7);
    session.answer('0');
    expect(session.view()).toMatchObject({ closed: true, correct: false });
    expect(session.view().solution!.answer).toBe(session.exercise().answer);
  });

  it('should accept the right answer', () => {
    const session = new PracticeSession('lathe-half-angle', 9);
    session.answer(session.exercise().exact);
    expect(session.view()).toMatchObject({ closed: true, correct: true });
  });

  it('should keep the problem open on unreadable text, with a message', () => {
    const session = new PracticeSession('taper-depth', 7);
    session.answer('a bit');
    expect(session.view().closed).toBe(false);
    expect(session.error()).toMatch(/number/);
  });

  it('should start a fresh problem on next()', () => {
    const session = new PracticeSession('taper-depth', 7);
    session.answer('0');
    session.next(8);
    expect(session.view().closed).toBe(false);
    expect(session.exercise()).toEqual(generateExercise('taper-depth', 8));
  });
});
