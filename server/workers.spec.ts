import { workerCount } from './workers';

describe('workerCount (WORKERS)', () => {
  it('runs one process when WORKERS is unset, empty or blank', () => {
    expect(workerCount(undefined, 8)).toBe(1);
    expect(workerCount('', 8)).toBe(1);
    expect(workerCount('  ', 8)).toBe(1);
  });

  it('runs one worker per core for "auto", and at least one', () => {
    expect(workerCount('auto', 2)).toBe(2);
    expect(workerCount('auto', 12)).toBe(12);
    expect(workerCount(' auto ', 3)).toBe(3);
    expect(workerCount('auto', 0)).toBe(1);
  });

  it('takes a whole number as given', () => {
    expect(workerCount('3', 2)).toBe(3);
    expect(workerCount('1', 8)).toBe(1);
    expect(workerCount('64', 2)).toBe(64);
  });

  it.each(['0', '-1', '1.5', 'abc', '65', '0x2', '1e1'])('rejects WORKERS=%s with a message naming the setting and the value', (value) => {
    expect(() => workerCount(value, 4)).toThrow(`WORKERS must be a whole number from 1 to 64, or "auto" (got "${value}").`);
  });
});
