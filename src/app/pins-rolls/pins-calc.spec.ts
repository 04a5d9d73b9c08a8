import { setupResults } from '../../../shared/library/setup-results';
import { type DiscGiven, PINS_DEFAULTS, type PinsRollsForm, type RollKind, pinsCalc } from './pins-calc';

/**
 * A set-up saved from this page keeps the whole form as its inputs; its results (library detail
 * and printed sheet) must be the page's own answer, whatever kind the form is on.
 */
describe('pins-and-rolls form saved as a set-up', () => {
  const kinds: RollKind[] = ['dovetail', 'v-groove', 'dovetail-angle', 'taper-two-heights', 'taper-discs', 'taper-balls'];
  const forms: Array<{ what: string; form: PinsRollsForm }> = [
    ...kinds.map((kind) => ({ what: kind, form: { ...PINS_DEFAULTS, kind } })),
    ...(['taperPerFoot', 'includedAngle'] as DiscGiven[]).map((discGiven) => ({ what: `taper-discs from ${discGiven}`, form: { ...PINS_DEFAULTS, kind: 'taper-discs' as const, discGiven } })),
    { what: 'taper-discs, one side square', form: { ...PINS_DEFAULTS, kind: 'taper-discs', reference: 'side' } },
    { what: 'female dovetail in mm', form: { ...PINS_DEFAULTS, kind: 'dovetail', side: 'female', unit: 'mm', width: '60', rollDiameter: '8', depth: '10' } },
  ];

  it.each(forms)('should give the page\'s answer on the set-up for $what', ({ form }) => {
    const page = pinsCalc(form);
    expect(page.ok).toBe(true);
    const saved = setupResults('pins-rolls', form as unknown as Record<string, unknown>);
    expect(saved.ok).toBe(true);
    if (!page.ok || !saved.ok) return;
    expect(saved.value['values']).toEqual(page.value.main.values);
    expect(saved.value['dms']).toEqual(page.value.main.dms);
    // The set-up lists only the figures of its kind, not every field of the form.
    expect(Object.keys(saved.input)).not.toContain('mode');
    expect(Object.keys(saved.input)).not.toContain('discGiven');
  });

  it('should read a two-height taper saved from the page from its two readings, not the dovetail-angle fields', () => {
    // REFERENCE.md §5.2 published example (hobby-machinist): .745 and .620 in, 1 in apart → 3°34'35" a side.
    const form: PinsRollsForm = { ...PINS_DEFAULTS, kind: 'taper-two-heights', lowerReading: '0.745', upperReading: '0.620', heightDifference: '1' };
    const saved = setupResults('pins-rolls', form as unknown as Record<string, unknown>);
    expect(saved.ok).toBe(true);
    if (!saved.ok) return;
    expect(saved.input).toEqual({ kind: 'taper-two-heights', unit: 'in', measurement1: '0.745', measurement2: '0.620', heightDifference: '1' });
    expect(saved.lines).toContainEqual({ label: 'Half angle (DMS)', value: "3°34'35\"" });
  });

  it('should take the reading to stop at for a dovetail saved while checking, as the page\'s target', () => {
    const form: PinsRollsForm = { ...PINS_DEFAULTS, kind: 'dovetail', mode: 'check', reading: '2.2900' };
    const page = pinsCalc(form);
    const saved = setupResults('pins-rolls', form as unknown as Record<string, unknown>);
    expect(page.ok && saved.ok).toBe(true);
    if (!page.ok || !saved.ok) return;
    expect(saved.value['values']).toEqual(page.value.target!.values);
  });

  it('should work back from the reading for a dovetail saved while checking with no drawing size', () => {
    const form: PinsRollsForm = { ...PINS_DEFAULTS, kind: 'dovetail', mode: 'check', reading: '2.2900', width: '' };
    const page = pinsCalc(form);
    const saved = setupResults('pins-rolls', form as unknown as Record<string, unknown>);
    expect(page.ok && saved.ok).toBe(true);
    if (!page.ok || !saved.ok) return;
    expect(saved.value['values']).toEqual(page.value.main.values);
  });

  it('should start a measured reading empty, not with a reading made up for one side', () => {
    expect(PINS_DEFAULTS.reading).toBe('');
    const r = pinsCalc({ ...PINS_DEFAULTS, mode: 'check', side: 'female' });
    expect(r.ok || r.fields).toEqual({ reading: 'is required: type the reading you measured' });
  });

  it('should have the engine refuse a kind no page offers instead of failing on it', () => {
    const r = pinsCalc({ ...PINS_DEFAULTS, kind: 'foo' as RollKind });
    expect(r.ok || Object.keys(r.fields)).toEqual(['kind']);
    const saved = setupResults('pins-rolls', { ...PINS_DEFAULTS, kind: 'foo' } as unknown as Record<string, unknown>);
    expect(saved.ok).toBe(false);
  });
});
