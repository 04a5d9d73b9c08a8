import demo from '../../fixtures/demo.json';
import { findGaugeSet } from '../data/gauge-sets';
import { inputRows, inputText, labelOf, listedInputs, setupResults } from './setup-results';
import type { TeamBox } from './team-boxes';

describe('setupResults', () => {
  it('should list inputs in words, with sets, standard tapers and holdings by their names', () => {
    const lathe = { unit: 'in', define: 'standard', standard: 'morse-3', taperPerFoot: '', includedAngle: '', largeDiameter: '', smallDiameter: '', length: '', workLength: '8', method: 'offset', stations: '0.5, 1' };
    const rows = inputRows('lathe-taper', lathe, setupResults('lathe-taper', lathe));
    expect(rows).toContainEqual({ label: 'Standard', value: 'Morse No. 3' });
    expect(rows).toContainEqual({ label: 'Work length', value: '8 in' });
    expect(rows).toContainEqual({ label: 'Stations', value: '0.5, 1' });
    const pins = { kind: 'dovetail-angle', unit: 'in', side: 'male', rollDiameter1: '0.25', measurement1: '2.1830127', rollDiameter2: '0.5', measurement2: '2.8660254' };
    expect(inputRows('pins-rolls', pins, setupResults('pins-rolls', pins)).map((r) => r.label)).toContain('Roll diameter 1');
    const boxed = { unit: 'in', target: '2.0084', set: 'box:12', missing: '', wearBlocks: '', grade: '', temperature: '' };
    expect(inputRows('gauge-blocks', boxed, setupResults('gauge-blocks', boxed))).toContainEqual({ label: 'Set', value: "the team's own box (no. 12)" });
    const plain = { ...boxed, set: 'inch-81' };
    expect(inputRows('gauge-blocks', plain, setupResults('gauge-blocks', plain))).toContainEqual({ label: 'Set', value: 'Inch 81-piece set' });
  });

  it("should call a chamfer's legs by their names, give lengths their unit and name the set in the results", () => {
    const chamfer = { unit: 'mm', shape: 'chamfer', given: 'length-end', thickness: '20', angle: '', taperLength: '12', endThickness: '15', faceLength: '' };
    const results = setupResults('taper', chamfer);
    expect(results.ok).toBe(true);
    if (!results.ok) return;
    const rows = inputRows('taper', chamfer, results);
    expect(rows).toContainEqual({ label: 'Shape', value: 'Chamfer or bevel on an edge' });
    expect(rows).toContainEqual({ label: 'Leg on the top face', value: '12 mm' });
    expect(rows).toContainEqual({ label: 'Leg on the end face', value: '15 mm' });
    expect(rows).toContainEqual({ label: 'Thickness', value: '20 mm' });
    expect(results.lines.map((l) => l.label)).toEqual(expect.arrayContaining(['Leg on the top face', 'Leg on the end face']));
    expect(results.lines.map((l) => l.label)).not.toContain('Taper length');
    const stack = setupResults('gauge-blocks', { target: '2.3456', set: 'inch-81' });
    expect(stack.ok && stack.lines.find((l) => l.label === 'Set')?.value).toBe('Inch 81-piece set');
    const angle = setupResults('angle-blocks', { angle: '17.5', set: 'angle-16' });
    expect(angle.ok && angle.lines.find((l) => l.label === 'Set')?.value).toBe('16-piece set');
  });

  it('should tell a set-up answered only on its page from one that does not compute', () => {
    const table = { unit: 'in', mode: 'table', barLength: '5', angle: '', stackHeight: '', set: '', missing: '', tableFrom: '0', tableTo: '10', tableStep: '1', compoundBy: 'angles', angleB: '', stackB: '', lengthB: '' };
    const page = setupResults('sine-bar', table);
    expect(page.ok || page.pageOnly).toBe(true);
    const bad = setupResults('taper', { unit: 'in', thickness: '-5', angle: 'abc', taperLength: '1.250' });
    expect(bad.ok || bad.pageOnly).toBeUndefined();
  });

  describe('a compound sine plate saved from its page', () => {
    // 14°30' on both axes of a 5 in plate: 5 · sin 14.5° = 1.2519 in each (derived). Both stacks stand
    // under the plate at once, so no block of the box may be listed under both.
    const form = {
      unit: 'in', mode: 'compound', barLength: '5', angle: "14°30'", stackHeight: '', set: 'inch-81', missing: '', tableFrom: '', tableTo: '', tableStep: '',
      compoundBy: 'angles', angleB: "14°30'", stackB: '', lengthB: '',
    };
    const blocksOf = (r: ReturnType<typeof setupResults>, name: 'A' | 'B') => (r.ok ? r.lines.find((l) => l.label === `Blocks ${name}`)?.value : undefined);
    const sumOf = (text: string | undefined) => (text ?? '').split(' + ').reduce((t, b) => t + Math.round(Number(b) * 10_000), 0);

    it('should list two stacks that share no block of the 81-piece set (one block of each size)', () => {
      const r = setupResults('sine-bar', form);
      const [a, b] = [blocksOf(r, 'A'), blocksOf(r, 'B')];
      expect([sumOf(a), sumOf(b)]).toEqual([12_519, 12_519]);
      const all = [...(a ?? '').split(' + '), ...(b ?? '').split(' + ')];
      expect(new Set(all).size).toBe(all.length);
      expect(r.ok && r.warnings).toEqual([]);
    });

    it('should say so when the set with its missing blocks cannot make both stacks at once', () => {
      // With 0.1001–0.1008 missing only 0.1009 gives the last digit 9, and both stacks need it (by hand).
      const r = setupResults('sine-bar', { ...form, missing: '0.1001, 0.1002, 0.1003, 0.1004, 0.1005, 0.1006, 0.1007, 0.1008' });
      expect(blocksOf(r, 'A')).toBe('1.000 + 0.101 + 0.1009 + 0.050');
      expect(blocksOf(r, 'B')).toBeUndefined();
      expect(r.ok && r.warnings).toEqual([expect.stringMatching(/^The box cannot make both stacks at once: with stack A \(1\.2519 in\) built from 1\.000 \+ 0\.101 \+ 0\.1009 \+ 0\.050/)]);
    });

    it("should pick both stacks from the team's box without sharing a block", () => {
      const set = findGaugeSet('inch-81');
      if (!set) throw new Error('inch-81 missing from the standard sets');
      // The team's box lacks 0.1009, so the last digit 9 must come from two blocks under each stack.
      const box: TeamBox = {
        id: 4, type: 'gauge-blocks', name: 'Cabinet 1', unit: 'in', grade: null, wearBlockSize: null, wearBlockCount: 0,
        blocks: set.blocks.map((b) => ({ size: b.size, available: Number(b.size) === 0.1009 ? 0 : b.count })),
      };
      const r = setupResults('sine-bar', { ...form, set: 'box:4' }, new Map([[4, box]]));
      const [a, b] = [blocksOf(r, 'A'), blocksOf(r, 'B')];
      expect([sumOf(a), sumOf(b)]).toEqual([12_519, 12_519]);
      const all = [...(a ?? '').split(' + '), ...(b ?? '').split(' + ')];
      expect(new Set(all).size).toBe(all.length);
      expect(all).not.toContain('0.1009');
    });

    it('should say in words why no blocks are listed for a missing list that does not read', () => {
      const r = setupResults('sine-bar', { ...form, missing: 'abc' });
      expect(blocksOf(r, 'A')).toBeUndefined();
      expect(r.ok && r.warnings).toEqual(['No blocks are listed: the blocks missing from the box must be a decimal number such as 0.750, got "abc".']);
    });
  });

  describe('the holding plan of a taper saved from its page', () => {
    const form = {
      unit: 'in', shape: 'taper', given: 'angle-length', thickness: '0.75', angle: "7°30'", taperLength: '2.5', endThickness: '', faceLength: '',
      partLength: '4', depthPerPass: '0.1', fluteLength: '1', cutterDiameter: '0.75', holding: 'angle-block', angleSet: 'angle-16', plateLength: '5', plateSet: 'inch-81',
    };
    it('should plan a sine plate: a stack of H = L · sin α under the free roll', () => {
      const r = setupResults('taper', { ...form, holding: 'sine-plate' });
      if (!r.ok || !r.holding?.ok) throw new Error('expected a holding plan');
      // H = 5 · sin 7°30′ = 5 · 0.1305262 = 0.6526 in (REFERENCE.md §2.1; sin 7.5° from Math.sin, a reference library).
      expect((5 * Math.sin((7.5 * Math.PI) / 180)).toFixed(4)).toBe('0.6526');
      expect(r.holding.plan.heading).toBe('Set-up on a sine plate');
      expect(r.holding.plan.instructions[0]).toMatch(/^Wring a 0\.6526 in stack: .+ \(H = L · sin α for the 5\.0000 in plate\)\.$/);
      expect(r.holding.plan.drawing).toMatchObject({ kind: 'sine-plate', plateLength: 5, stackLabel: '0.6526 in stack' });
    });
    it('should plan angle blocks whose angles add up to the taper angle', () => {
      const r = setupResults('taper', form);
      if (!r.ok || !r.holding?.ok) throw new Error('expected a holding plan');
      expect(r.holding.plan.heading).toBe('Set-up on angle blocks');
      // 7°30' from a 16-piece set: 5° + 3° − 30' (common practice: reversed blocks subtract).
      expect(r.holding.plan.instructions[0]).toContain("= 7°30'00\"");
      expect(r.holding.plan.instructions.at(-1)).toContain('feed down 0.3263 in');
    });
    it('should plan a tilted vise and say what a vise scale cannot do', () => {
      const r = setupResults('taper', { ...form, holding: 'tilted-vise' });
      if (!r.ok || !r.holding?.ok) throw new Error('expected a holding plan');
      expect(r.holding.plan.instructions[0]).toBe("Tilt the vise body to 7°30'00\" on its scale and lock it.");
    });
    it('should say why there is no plan when the holding figures are wrong, and give none to a set-up without a holding', () => {
      const r = setupResults('taper', { ...form, holding: 'sine-plate', plateLength: 'abc' });
      if (!r.ok || !r.holding || r.holding.ok) throw new Error('expected a failed holding plan');
      expect(r.holding.error).toMatch(/^Sine plate/);
      expect(r.holding.error).toContain('abc');
      const plain = setupResults('taper', { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' });
      expect(plain.ok && plain.holding).toBeNull();
    });
  });

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

  it('should keep the passes of a taper with the DRO reading after each, as the taper page lists them', () => {
    const r = setupResults('taper', { unit: 'in', thickness: '0.875', angle: "12°15'", taperLength: '1.75', depthPerPass: '0.06' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // h = 1.75 · sin 12°15′ = 0.37131 → 0.3713 in; ⌈0.3713 / 0.06⌉ = 7 passes, six of 0.0600 and a last of 0.0113 (derived).
    expect(r.lines.find((l) => l.label === 'Passes')?.value).toBe('7, each with its DRO reading below');
    expect(r.passes).toHaveLength(7);
    expect(r.passes![0]).toEqual({ pass: 1, cut: '0.0600', reading: '0.0600' });
    expect(r.passes![6]).toEqual({ pass: 7, cut: '0.0113', reading: '0.3713' });
    expect(setupResults('taper', { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' })).toMatchObject({ ok: true, passes: null });
  });

  it("should list a gauge stack's grade tolerance and its length at the blocks' temperature", () => {
    const r = setupResults('gauge-blocks', { target: '2.3456', set: 'inch-81', grade: '1', temperature: '23.5' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const line = (label: string) => r.lines.find((l) => l.label === label)?.value;
    // The same figures the engine gives the gauge-block page.
    const v = r.value as { tolerance: { worstCase: string; worstCaseUm: string; rss: string }; temperature: { lengthAtTemperature: string; change: string } };
    expect(line('Tolerance, worst case (grade 1)')).toBe(`±${v.tolerance.worstCase} in (±${v.tolerance.worstCaseUm} µm)`);
    expect(line('Tolerance, root-sum-square')).toContain(`±${v.tolerance.rss} in`);
    // ΔL = L·α·(t − 20 °C) = 2.3456 · 11.5e-6 · 3.5 = 0.0000944 in (20 °C reference: ISO 1, REFERENCE.md §3.1; 11.5e-6 /K for gauge-block steel: ISO 3650, from memory; derived).
    expect(v.temperature.change).toMatch(/^0\.00009(4|44)/);
    expect(line('Length at 23.5 °C')).toBe(`${v.temperature.lengthAtTemperature} in (change ${v.temperature.change} in from 20 °C)`);
  });

  it('should list the figures of a pins-and-rolls answer, angles in degrees and in DMS, with their units', () => {
    // REFERENCE.md §5.2 published example (hobby-machinist): M₁ .745, M₂ .620 in, 1 in apart →
    // 3°34'35" a side; included 2 · 3.57633° = 7.15267° (7°09'10"); TPF = 24 · tan(α/2) = 24 · 0.0625 = 1.5 in/ft.
    const r = setupResults('pins-rolls', { kind: 'taper-two-heights', unit: 'in', measurement1: '0.745', measurement2: '0.620', heightDifference: '1' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const line = (label: string) => r.lines.find((l) => l.label === label)?.value;
    expect(line('Half angle (°)')).toBe('3.5763');
    expect(line('Half angle (DMS)')).toBe("3°34'35\"");
    expect(line('Included angle (DMS)')).toBe("7°09'10\"");
    expect(line('Taper per foot')).toBe('1.50000 in/ft');
    expect(r.warnings).toEqual([expect.stringMatching(/narrows/)]);
  });

  it('should give a pins-and-rolls length in the set-up\'s unit', () => {
    // REFERENCE.md §5.1 (Machinery's Handbook, "Measuring dovetail slides"): x = a + D·(1 + cot(α/2));
    // check value 60°, D 0.500 in, a 2.000 in → x = 3.3660 in.
    const r = setupResults('pins-rolls', { kind: 'dovetail', side: 'male', unit: 'in', width: '2.000', angle: '60', rollDiameter: '0.500' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.lines).toEqual(expect.arrayContaining([{ label: 'Measurement', value: '3.3660 in' }, { label: 'Width', value: '2.0000 in' }, { label: 'Angle (DMS)', value: "60°00'00\"" }]));
  });

  it('should answer every demo set-up (fixtures/demo.json), so each opens with its results', () => {
    for (const s of demo.setups) {
      const r = setupResults(s.kind, s.inputs);
      expect({ name: s.name, error: r.ok ? null : r.error }).toEqual({ name: s.name, error: null });
    }
  });

  it('should give tapers as the lathe page does: per foot and per inch for inch work, a ratio and per mm of length for mm work', () => {
    // REFERENCE.md §4.2 (Machinery's Handbook "Morse Taper Shanks"): MT3 0.60235 in/ft; k = TPF/12 = 0.050196.
    const inch = setupResults('lathe-taper', { unit: 'in', taperPerFoot: '0.60235', workLength: '6' });
    const mm = setupResults('lathe-taper', { unit: 'mm', taperPerFoot: '0.60235', workLength: '150' });
    expect(inch.ok && mm.ok).toBe(true);
    if (!inch.ok || !mm.ok) return;
    expect(inch.lines).toEqual(expect.arrayContaining([{ label: 'Taper per foot', value: '0.60235 in/ft' }, { label: 'Taper per inch', value: '0.050196 in/in' }]));
    // 1/k = 1/0.050196 = 19.922 (derived): the ratio as the engine writes it, and k per mm of length.
    expect(mm.lines).toEqual(expect.arrayContaining([{ label: 'Taper ratio', value: mm.value['ratio'] }, { label: 'Taper per mm of length', value: '0.050196 mm/mm' }]));
    expect(mm.value['ratio']).toMatch(/^1:19\.92/);
    expect(mm.lines.map((l) => l.label)).not.toEqual(expect.arrayContaining(['Taper per foot']));
    expect(mm.lines.map((l) => l.label)).not.toContain('Taper per inch');
    expect(mm.lines.map((l) => l.value).join(' ')).not.toMatch(/in\/ft/);
  });

  it('should name wear blocks in the stack as the gauge-block page does, keeping the sizes for the sketch', () => {
    // 2.1 in from the 81-piece set between two 0.050 wear blocks: 2.000 in left for the set's own blocks (derived).
    const r = setupResults('gauge-blocks', { unit: 'in', target: '2.1', set: 'inch-81', missing: '', wearBlocks: '0.050', grade: '', temperature: '' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.stack?.[0]).toBe('0.050 wear');
    expect(r.stack?.at(-1)).toBe('0.050 wear');
    expect(r.value['blocks']).toEqual(expect.arrayContaining(['0.050']));
    expect((r.value['blocks'] as string[]).every((b) => /^\d+\.\d+$/.test(b))).toBe(true);
    expect(r.lines.map((l) => l.label)).not.toContain('Labels');
  });

  it('should not compute a set-up whose team box is gone, naming the box so; with no boxes at hand it is left to the page', () => {
    const boxed = { unit: 'in', target: '1.2011', set: 'box:12', missing: '', wearBlocks: '', grade: '', temperature: '' };
    const gone = setupResults('gauge-blocks', boxed, new Map());
    expect(gone).toEqual({ ok: false, boxGone: true, error: "Gauge blocks: the team's box it was saved with (no. 12) is no longer in the team's inventory, so its blocks cannot be picked" });
    expect(inputRows('gauge-blocks', boxed, gone)).toContainEqual({ label: 'Set', value: 'a box since deleted (no. 12)' });
    // A box of that number of the wrong kind is not it either.
    const angles: TeamBox = { id: 12, type: 'angle-blocks', name: 'Angles', unit: 'deg', grade: null, wearBlockSize: null, wearBlockCount: 0, blocks: [] };
    expect(setupResults('gauge-blocks', boxed, new Map([[12, angles]]))).toMatchObject({ ok: false, boxGone: true });
    expect(setupResults('angle-blocks', { mode: 'find', set: 'box:3', angle: '10', combination: '' }, new Map())).toMatchObject({ ok: false, error: expect.stringMatching(/^Angle blocks: the team's box .*no\. 3/) });
    const sine = setupResults('sine-bar', { unit: 'in', mode: 'angle', barLength: '5', angle: '10', stackHeight: '', set: 'box:12', missing: '' }, new Map());
    expect(sine).toMatchObject({ ok: false, boxGone: true });
    // Not loaded (no boxes given): answered on the page only, as before.
    expect(setupResults('gauge-blocks', boxed)).toMatchObject({ ok: false, pageOnly: true });
  });

  it('should leave empty inputs out of the list', () => {
    const boxed = { unit: 'in', target: '1.2011', set: 'box:12', missing: '', wearBlocks: '', grade: '', temperature: '' };
    const labels = inputRows('gauge-blocks', boxed, setupResults('gauge-blocks', boxed)).map((r) => r.label);
    expect(labels).toEqual(expect.arrayContaining(['Target', 'Set']));
    expect(labels).not.toEqual(expect.arrayContaining(['Missing']));
    expect(labels.filter((l) => /Missing|Wear|Temperature|Grade/.test(l))).toEqual([]);
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

  it('should list the figures a saved lathe form used, without empty ones, lists comma-separated', () => {
    const form = { unit: 'in', define: 'tpf', standard: 'morse-3', taperPerFoot: '0.60235', includedAngle: '3°', largeDiameter: '0.938', smallDiameter: '', length: '3.1875', workLength: '8', method: 'offset', stations: '0.5, 1, 2' };
    const listed = listedInputs('lathe-taper', form, setupResults('lathe-taper', form));
    expect(listed.map(([k]) => k).sort()).toEqual(['largeDiameter', 'length', 'stations', 'taperPerFoot', 'unit', 'workLength']);
    expect(inputText(Object.fromEntries(listed)['stations'])).toBe('0.5, 1, 2');
    expect(inputText({ a: 1 })).toBe('{"a":1}');
    expect(inputText([{ angle: '27°', reversed: false }, { angle: '9°', reversed: true }, { angle: "27'", reversed: false }])).toBe("27° − 9° + 27'");
    expect(inputText(null)).toBe('');
  });
});
