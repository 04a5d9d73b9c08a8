import { normalDecimalText, setupCheckSchema } from './setup';

/** Check values as typed at the bench: leading dots and plus signs are how tolerances are written (common practice). */
describe('setup check schema', () => {
  const check = (patch: Record<string, unknown>) => setupCheckSchema.safeParse({ key: 'end', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.001', minus: '0.001', ...patch });
  const messages = (patch: Record<string, unknown>) => {
    const r = check(patch);
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };

  it.each([
    ['.002', '0.002'],
    ['+.002', '0.002'],
    ['+0.002', '0.002'],
    [' 0.0010 ', '0.0010'],
    ['-.5', '-0.5'],
    ['abc', 'abc'],
    ['+', '+'],
  ])('should write %p as %p', (typed, kept) => {
    expect(normalDecimalText(typed)).toBe(kept);
  });

  it('should keep tolerances typed with a leading dot or a plus sign, in the form 0.002', () => {
    const r = check({ nominal: '.5854', plus: '+.002', minus: '.0015' });
    expect(r.success).toBe(true);
    expect(r.data).toMatchObject({ nominal: '0.5854', plus: '0.002', minus: '0.0015' });
  });

  it('should say a minus tolerance is typed without its sign, with the figure to type', () => {
    expect(messages({ minus: '-0.002' })).toEqual(['minus: Minus tolerance must be 0 or more: it is how far under nominal a part may be, so type it without a minus sign (0.002, not -0.002).']);
    expect(messages({ plus: '-.001' })).toEqual(['plus: Plus tolerance must be 0 or more: it is how far over nominal a part may be, so type it without a minus sign (0.001, not -0.001).']);
  });

  it('should give one message for text that is not a number, even with a minus sign', () => {
    expect(messages({ plus: '-abc' })).toEqual(['plus: Plus tolerance must be a decimal number such as 0.750 (at most 6 decimals).']);
    expect(messages({ plus: '0.1234567' })).toEqual(['plus: Plus tolerance must be a decimal number such as 0.750 (at most 6 decimals).']);
  });

  it('should refuse a negative nominal but keep 0 (flatness, runout)', () => {
    expect(messages({ nominal: '-.5854' })[0]).toMatch(/^nominal: Nominal must be 0 or more/);
    expect(messages({ nominal: '0', unit: 'in' })).toEqual([]);
  });
});
