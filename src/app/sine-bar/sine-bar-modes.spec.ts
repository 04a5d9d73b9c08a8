import { SINE_BAR_DEFAULTS, type SineBarFormValues } from './sine-bar-form';
import { SCREEN_TABLE_ROWS, compoundAxisScene, outcomeItems, runSineBar, sineBarMode, tableRowCount, tableRowScene } from './sine-bar-modes';

const values = (over: Partial<SineBarFormValues>): SineBarFormValues => ({ ...SINE_BAR_DEFAULTS, ...over });
const item = (items: { label: string; value: string }[], label: string) => items.find((i) => i.label === label)?.value;
const sumTenThousandths = (blocks: readonly string[]) => blocks.reduce((t, b) => t + Math.round(Number(b) * 10_000), 0);

describe('sine-bar modes', () => {
  it('should read an unknown mode as a stack for an angle', () => {
    expect(sineBarMode('table')).toBe('table');
    expect(sineBarMode('nonsense')).toBe('angle');
  });

  describe('tableRowCount', () => {
    it('should count both ends of the range', () => expect(tableRowCount('10', '20', "0°30'")).toBe(21));
    it('should count a step of one minute without losing the last row', () => expect(tableRowCount('0', '1', "0°1'")).toBe(61));
    it('should leave bad bounds to the engine', () => {
      expect(tableRowCount('abc', '20', '1')).toBeNull();
      expect(tableRowCount('20', '10', '1')).toBeNull();
      expect(tableRowCount('10', '20', '0')).toBeNull();
    });
  });

  describe('table of stacks', () => {
    // Demo 5 in plate, 10° to 20° by 30′ with the 81-piece set. H = L·sin θ (REFERENCE.md §2.1, derived):
    // 5·sin 10° = 0.86824, 5·sin 14.5° = 1.25190, 5·sin 20° = 1.71010.
    const r = runSineBar(values({ mode: 'table' }));
    if (!r.ok || r.value.mode !== 'table') throw new Error('the demo table should work');
    const t = r.value.table;

    it('should list every step with its stack at 0.0001 in', () => {
      expect(t.rows.length).toBe(21);
      expect(t.rows[0]).toMatchObject({ angleDms: '10°00\'00"', stackHeight: '0.8682' });
      expect(t.rows[9]).toMatchObject({ angleDms: '14°30\'00"', stackHeight: '1.2519' });
      expect(t.rows[20]).toMatchObject({ angleDms: '20°00\'00"', stackHeight: '1.7101' });
    });

    it('should give each row the fewest blocks that make its stack', () => {
      for (const row of t.rows) {
        expect(row.blocks).not.toBeNull();
        expect(sumTenThousandths(row.blocks ?? [])).toBe(Math.round(Number(row.stackHeight) * 10_000));
        expect(row.count).toBe(row.blocks?.length);
      }
    });

    it('should sum up the table in the results', () => {
      const items = outcomeItems(r.value);
      expect(item(items, 'Rows')).toBe('21');
      expect(item(items, 'Stacks rounded to')).toBe('0.0001');
    });

    it('should draw a row at the angle its stack makes', () => {
      const scene = tableRowScene(t, t.rows[9]);
      expect(scene).toMatchObject({ barLength: 5, stackHeight: 1.2519, labels: { stackHeight: 'H 1.2519 in', angle: '14°30\'00"' } });
      expect(scene.blocks.map((b) => b.label)).toEqual(t.rows[9].blocks);
    });

    it('should refuse more rows than the page lists, on the step', () => {
      const many = runSineBar(values({ mode: 'table', tableFrom: '0', tableTo: '89', tableStep: '0.01' }));
      expect(many.ok).toBe(false);
      if (!many.ok) expect(many.fields['tableStep']).toBe(`gives 8901 rows; the page lists at most ${SCREEN_TABLE_ROWS}: use a larger step or a shorter range`);
    });

    it('should name the bound that is wrong', () => {
      const back = runSineBar(values({ mode: 'table', tableFrom: '20', tableTo: '10' }));
      expect(back.ok).toBe(false);
      if (!back.ok) expect(back.fields['to']).toBe('must not be below from');
      const steep = runSineBar(values({ mode: 'table', tableTo: '90' }));
      expect(steep.ok).toBe(false);
      if (!steep.ok) expect(steep.fields['to']).toContain('less than 90°');
    });
  });

  describe('compound plate', () => {
    it('should give two stacks, their blocks and the resultant tilt from two angles', () => {
      // Demo: A 14°30′, B 10° on 5 in plates: HA = 1.2519, HB = 0.8682 (derived, H = L·sin θ);
      // cos φ = cos 14.5° · cos 10° (derived: rotations about perpendicular axes).
      const r = runSineBar(values({ mode: 'compound' }));
      if (!r.ok || r.value.mode !== 'compound') throw new Error('the demo compound plate should work');
      const items = outcomeItems(r.value);
      expect(item(items, 'Stack A')).toBe('1.2519');
      expect(item(items, 'Stack B')).toBe('0.8682');
      expect(sumTenThousandths(r.value.blocksA ?? [])).toBe(12_519);
      expect(sumTenThousandths(r.value.blocksB ?? [])).toBe(8_682);
      const phi = (Math.acos(Math.cos((14.5 * Math.PI) / 180) * Math.cos((10 * Math.PI) / 180)) * 180) / Math.PI;
      expect(Number(r.value.compound.resultantTiltDeg)).toBeCloseTo(phi, 3);
      const b = compoundAxisScene(r.value.compound, 'B', r.value.blocksB);
      expect(b).toMatchObject({ barLength: 5, stackHeight: 0.8682, labels: { barLength: 'LB 5.0000 in', stackHeight: 'HB 0.8682 in' } });
    });

    it('should give the two stacks different blocks, as both stand under the plate at once', () => {
      // 14°30' on both axes of the 5 in plate: 1.2519 in each (derived); the 81-piece set has one block of each size.
      const r = runSineBar(values({ mode: 'compound', angleB: "14°30'" }));
      if (!r.ok || r.value.mode !== 'compound') throw new Error('the compound plate should work');
      const [a, b] = [r.value.blocksA ?? [], r.value.blocksB ?? []];
      expect([sumTenThousandths(a), sumTenThousandths(b)]).toEqual([12_519, 12_519]);
      expect(new Set([...a, ...b]).size).toBe(a.length + b.length);
      expect(r.value.warnings).toEqual([]);
      const items = outcomeItems(r.value);
      expect(item(items, 'Blocks A')).not.toBe(item(items, 'Blocks B'));
    });

    it('should say so, and list no block twice, when the set less its missing blocks cannot make both stacks at once', () => {
      // With 0.1001–0.1008 missing only 0.1009 gives the last digit 9, and both 1.2519 in stacks need it (by hand).
      const r = runSineBar(values({ mode: 'compound', angleB: "14°30'", missing: '0.1001 0.1002 0.1003 0.1004 0.1005 0.1006 0.1007 0.1008' }));
      if (!r.ok || r.value.mode !== 'compound') throw new Error('the compound plate should work');
      expect(r.value.blocksA).toEqual(['1.000', '0.101', '0.1009', '0.050']);
      expect(r.value.blocksB).toBeNull();
      expect(item(outcomeItems(r.value), 'Blocks B')).toBeUndefined();
      expect(r.value.warnings).toEqual([expect.stringMatching(/^The box cannot make both stacks at once: /)]);
    });

    it('should put a missing list that does not read on its own box', () => {
      const r = runSineBar(values({ mode: 'compound', missing: 'abc' }));
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.fields['missing.0']).toBe('must be a decimal number such as 0.750, got "abc"');
    });

    it('should give two angles from two stacks', () => {
      // asin(2.5 / 5) = 30° on each axis; cos φ = 0.75 → φ = 41°24′35″ (derived).
      const r = runSineBar(values({ mode: 'compound', compoundBy: 'stacks', stackHeight: '2.5', stackB: '2.5', set: '' }));
      if (!r.ok || r.value.mode !== 'compound') throw new Error('two stacks should work');
      const items = outcomeItems(r.value);
      expect(item(items, 'Angle A')).toBe('30°00\'00"');
      expect(item(items, 'Angle B')).toBe('30°00\'00"');
      expect(item(items, 'Resultant tilt')).toBe('41°24\'35"');
      expect(r.value.blocksA).toBeNull();
    });

    it('should put the engine message on the control that holds the field', () => {
      const r = runSineBar(values({ mode: 'compound', compoundBy: 'stacks', stackHeight: '6', stackB: '1' }));
      expect(r.ok).toBe(false);
      if (!r.ok) expect(Object.keys(r.fields)).toEqual(['stackA']);
    });
  });
});

describe('sine-bar empty boxes', () => {
  it.each([
    [{ mode: 'angle', angle: '' }, 'angle', "is required: type an angle, e.g. 14°30'"],
    [{ mode: 'stack', stackHeight: ' ' }, 'stackHeight', 'is required: type the stack height'],
    [{ mode: 'table', tableStep: '' }, 'tableStep', "is required: type an angle, e.g. 10 or 10°30'"],
    [{ mode: 'compound', compoundBy: 'stacks', stackHeight: '1', stackB: '' }, 'stackB', 'is required: type the stack height'],
    [{ mode: 'compound', angleB: '' }, 'angleB', "is required: type an angle, e.g. 14°30'"],
  ] as const)('should name the empty box %#', (over, field, message) => {
    const r = runSineBar(values(over));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fields).toEqual({ [field]: message });
  });

  it('should leave an out-of-range last angle to the engine, on its own box', () => {
    const r = runSineBar(values({ mode: 'table', tableTo: '99999999' }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fields['to']).toBe('must be at least 0° and less than 90°');
  });
});
