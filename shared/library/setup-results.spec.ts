import { labelOf, setupResults } from './setup-results';

describe('setupResults', () => {
  it('should flatten a taper answer into labelled lines with the unit', () => {
    const r = setupResults('taper', { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const line = (label: string) => r.lines.find((l) => l.label === label)?.value;
    // h = L·sin α = 1.250 · sin 7°30′ = 0.16316 → 0.1632 in; t = T − L·tan α = 0.750 − 0.16457 = 0.5854 in (REFERENCE.md §1, derived).
    expect(line('Depth to stop')).toBe('0.1632 in');
    expect(line('End thickness')).toBe('0.5854 in');
    expect(line('Angle (DMS)')).toBe("7°30'00\"");
    expect(r.steps.length).toBeGreaterThan(0);
    expect(r.cautions.length).toBeGreaterThan(0);
  });

  it('should pass on the engine\'s message for inputs without an answer', () => {
    const r = setupResults('taper', { unit: 'in', thickness: '-1' });
    expect(r).toMatchObject({ ok: false });
    expect(r.ok ? '' : r.error).toMatch(/thickness/);
  });

  it('should say so for a kind without an engine', () => {
    expect(setupResults('knurling', {})).toMatchObject({ ok: false, error: expect.stringMatching(/No calculation/) });
  });

  it('should turn field names into labels', () => {
    expect(labelOf('achievedAngleDeg')).toBe('Achieved angle (°)');
    expect(labelOf('tableTravel')).toBe('Table travel');
  });
});
