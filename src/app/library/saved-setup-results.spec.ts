import { type SetupResults, listedInputs, setupResults } from '../../../shared/library/setup-results';
import { ANGLE_BLOCKS_DEFAULTS, type AngleBlocksForm, angleBlocksRequest } from '../angle-blocks/angle-blocks-page';
import { GAUGE_BLOCKS_DEFAULTS, type GaugeBlocksFormValues, runGaugeBlocks } from '../gauge-blocks/gauge-blocks-form';
import { LATHE_DEFAULTS, type LatheTapersForm, latheCalc } from '../lathe-tapers/lathe-tapers-page';
import { SINE_BAR_DEFAULTS, type SineBarFormValues } from '../sine-bar/sine-bar-form';
import { runSineBar } from '../sine-bar/sine-bar-modes';
import { TAPER_DEFAULTS, type TaperFormValues } from '../taper/taper-form';
import { runTaper } from '../taper/taper-page';
import { PINS_DEFAULTS, pinsCalc } from '../pins-rolls/pins-calc';
import { pickControlValues } from '../workbench/query-state';
import { savedFormFields } from '../../../shared/library/saved-request';
import { type TeamBox, type TeamBoxes } from '../../../shared/library/team-boxes';
import { boxBlockAngles } from '../../../shared/forms/angle-blocks-form';
import { findGaugeSet } from '../../../shared/data/gauge-sets';
import { inputRows } from '../../../shared/library/setup-results';

/** The standard inch 81-piece set as a team box with one 0.1007 missing and the 0.137 damaged (the demo box). */
function gaugeBox(id: number): TeamBox {
  const set = findGaugeSet('inch-81')!;
  const gone = new Set(['0.1007', '0.137']);
  return {
    id, type: 'gauge-blocks', name: 'Inch 81-piece set, cabinet 2', unit: 'in', grade: '0', wearBlockSize: '0.050', wearBlockCount: 2,
    blocks: set.blocks.map((b) => ({ size: b.size, available: gone.has(b.size) ? b.count - 1 : b.count })),
  };
}
const boxes = (...list: TeamBox[]): TeamBoxes => new Map(list.map((b) => [b.id, b]));
/** Sum of block sizes in ten-thousandths of an inch. */
const tenThousandths = (blocks: unknown) => (blocks as string[]).reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0);

/**
 * Every calculator page saves its whole form as the set-up's inputs (each field, the mode, what is
 * given — with whatever the other modes' fields still hold). The set-up's results, on its library
 * page and its printed sheet, must be the page's own answer for that form.
 */
const saved = (kind: string, form: object): SetupResults => setupResults(kind, form as Record<string, unknown>);
const value = (r: SetupResults) => {
  expect(r.ok ? null : r.error).toBeNull();
  return r.ok ? r.value : null;
};

describe('a set-up saved from its calculator page', () => {
  describe('taper', () => {
    const forms: Array<[string, TaperFormValues]> = [
      ['angle and taper length', TAPER_DEFAULTS],
      ['angle and end thickness', { ...TAPER_DEFAULTS, given: 'angle-end', endThickness: '0.5' }],
      ['angle and face length', { ...TAPER_DEFAULTS, given: 'angle-face', faceLength: '2.5' }],
      ['taper length and end thickness', { ...TAPER_DEFAULTS, given: 'length-end', endThickness: '0.5' }],
      ['taper length and face length', { ...TAPER_DEFAULTS, given: 'length-face', faceLength: '2.6' }],
      ['end thickness and face length', { ...TAPER_DEFAULTS, given: 'end-face', endThickness: '0.5', faceLength: '2.6' }],
      ['a chamfer by angle and leg on the end', { ...TAPER_DEFAULTS, shape: 'chamfer', given: 'angle-end', endThickness: '0.1' }],
    ];
    it.each(forms)('should give the page\'s answer for %s', (_what, form) => {
      const page = runTaper(form);
      expect(page.ok).toBe(true);
      if (!page.ok) return;
      const { holding: _holding, ...engine } = page.value;
      expect(value(saved('taper', form))).toEqual(engine);
    });
    it('should list the figures given and how the work is held, not the sizes of other choices', () => {
      const form = { ...TAPER_DEFAULTS, given: 'angle-end', endThickness: '0.5' };
      const r = saved('taper', form);
      const keys = listedInputs('taper', form, r).map(([k]) => k);
      expect(keys).toEqual(expect.arrayContaining(['angle', 'endThickness', 'thickness', 'holding', 'angleSet', 'partLength']));
      expect(keys).not.toContain('taperLength');
      expect(keys).not.toContain('given');
      expect(keys).not.toContain('plateSet');
      const onPlate = { ...form, holding: 'sine-plate' };
      expect(listedInputs('taper', onPlate, saved('taper', onPlate)).map(([k]) => k)).toEqual(expect.arrayContaining(['plateLength', 'plateSet']));
    });
  });

  describe('sine bar', () => {
    const forms: Array<[string, SineBarFormValues]> = [
      ['an angle', SINE_BAR_DEFAULTS],
      ['a stack (the angle box still typed)', { ...SINE_BAR_DEFAULTS, mode: 'stack', stackHeight: '1.2519' }],
      ['an angle with missing blocks', { ...SINE_BAR_DEFAULTS, missing: '0.1001' }],
    ];
    it.each(forms)('should give the page\'s answer for %s', (_what, form) => {
      const page = runSineBar(form);
      expect(page.ok && (page.value.mode === 'angle' || page.value.mode === 'stack')).toBe(true);
      if (!page.ok || (page.value.mode !== 'angle' && page.value.mode !== 'stack')) return;
      expect(value(saved('sine-bar', form))).toEqual(page.value.single);
    });
    it('should give the stack for one of the team\'s boxes, as the page does before asking the inventory for blocks', () => {
      const form = { ...SINE_BAR_DEFAULTS, set: 'box:7', missing: '0.1001' };
      const page = runSineBar({ ...form, set: '', missing: '' });
      expect(page.ok).toBe(true);
      if (!page.ok || page.value.mode !== 'angle') return;
      expect(value(saved('sine-bar', form))).toEqual(page.value.single);
    });
    it('should pick the blocks of the stack from the team\'s box when the box is at hand', () => {
      const form = { ...SINE_BAR_DEFAULTS, mode: 'stack', stackHeight: '0.2507', set: 'box:7' };
      const r = setupResults('sine-bar', form, boxes(gaugeBox(7)));
      const v = value(r)!;
      // 0.2507 from the standard set is 0.1007 + 0.150; the box has no 0.1007 (derived by hand).
      expect(v['stackHeight']).toBe('0.2507');
      expect(tenThousandths(v['blocks'])).toBe(2_507);
      expect(v['blocks']).not.toContain('0.1007');
      expect(r.ok && r.stack).toEqual(v['blocks']);
      expect(r.ok && r.box).toEqual({ id: 7, name: 'Inch 81-piece set, cabinet 2' });
      expect(inputRows('sine-bar', form, r)).toContainEqual({ label: 'Set', value: 'Our box: Inch 81-piece set, cabinet 2' });
    });
    it('should say what to do when the team\'s box cannot make the stack', () => {
      // 5 in · sin 0.01° = 0.00087 in, rounded 0.0009 in (derived): no block that thin.
      const r = setupResults('sine-bar', { ...SINE_BAR_DEFAULTS, angle: '0.01', set: 'box:7' }, boxes(gaugeBox(7)));
      expect(r.ok && r.warnings).toContain('The box cannot make a 0.0009 in stack; raise both rolls on equal stacks and build the difference, or change the angle slightly.');
      expect(r.ok && r.stack).toBeNull();
    });
    it('should not pick blocks from a box of another kind or not named: the box it names is not in the inventory', () => {
      const angleBox: TeamBox = { ...gaugeBox(7), type: 'angle-blocks' };
      const r = setupResults('sine-bar', { ...SINE_BAR_DEFAULTS, set: 'box:7' }, boxes(angleBox, gaugeBox(8)));
      expect(r).toMatchObject({ ok: false, boxGone: true, error: expect.stringMatching(/no\. 7\) is no longer in the team's inventory/) });
    });
    it('should send a table set-up to its page rather than answer something else', () => {
      const r = saved('sine-bar', { ...SINE_BAR_DEFAULTS, mode: 'table' });
      expect(r.ok).toBe(false);
      expect(r.ok ? '' : r.error).toMatch(/open the set-up in its calculator/);
    });
    it('should answer a compound plate as its page does: both stacks, their blocks and the tilt of the top face', () => {
      const form: SineBarFormValues = { ...SINE_BAR_DEFAULTS, mode: 'compound' };
      const page = runSineBar(form);
      const r = saved('sine-bar', form);
      if (!page.ok || page.value.mode !== 'compound' || !r.ok) throw new Error('expected both to answer');
      const line = (label: string) => r.lines.find((l) => l.label === label)?.value;
      expect(line('Stack A')).toBe(`${page.value.compound.axisA.stackHeight} in`);
      expect(line('Stack B')).toBe(`${page.value.compound.axisB.stackHeight} in`);
      expect(line('Blocks A')).toBe(page.value.blocksA?.join(' + '));
      expect(line('Blocks B')).toBe(page.value.blocksB?.join(' + '));
      // cos φ = cos θA · cos θB with the angles the rounded stacks make: θA = asin(1.2519 / 5),
      // θB = asin(0.8682 / 5) → φ = 17.5526° (derived; Math.asin/cos/acos as the reference library).
      const made = (h: number) => Math.asin(h / 5);
      expect(((Math.acos(Math.cos(made(1.2519)) * Math.cos(made(0.8682))) * 180) / Math.PI).toFixed(4)).toBe('17.5526');
      expect(line('Resultant tilt (°)')).toBe(page.value.compound.resultantTiltDeg);
      expect(page.value.compound.resultantTiltDeg).toBe('17.5526');
    });
    it("should pick a compound plate's blocks from the team's box, without its missing block", () => {
      const r = setupResults('sine-bar', { ...SINE_BAR_DEFAULTS, mode: 'compound', set: 'box:7' }, boxes(gaugeBox(7)));
      if (!r.ok) throw new Error(r.error);
      const blocksA = (r.lines.find((l) => l.label === 'Blocks A')?.value ?? '').split(' + ');
      expect(tenThousandths(blocksA)).toBe(Math.round(Number((r.lines.find((l) => l.label === 'Stack A')?.value ?? '').split(' ')[0]) * 10_000));
      expect(blocksA).not.toContain('0.1007');
      expect(r.box).toEqual({ id: 7, name: 'Inch 81-piece set, cabinet 2' });
    });
  });

  describe('gauge blocks', () => {
    const forms: Array<[string, GaugeBlocksFormValues]> = [
      ['a standard set', GAUGE_BLOCKS_DEFAULTS],
      ['a set with missing blocks and wear blocks', { ...GAUGE_BLOCKS_DEFAULTS, missing: '0.1009', wearBlocks: '0.050' }],
      ['no grade', { ...GAUGE_BLOCKS_DEFAULTS, grade: '' }],
    ];
    it.each(forms)('should give the page\'s answer for %s', (_what, form) => {
      const page = runGaugeBlocks(form);
      expect(page.ok && page.value.source === 'engine').toBe(true);
      if (!page.ok || page.value.source !== 'engine') return;
      expect(value(saved('gauge-blocks', form))).toEqual(page.value.result);
    });
    it('should give the stack from the team\'s box when the box is at hand, without its missing blocks', () => {
      const form = { ...GAUGE_BLOCKS_DEFAULTS, target: '0.2507', set: 'box:4', grade: '' };
      const r = setupResults('gauge-blocks', form, boxes(gaugeBox(4)));
      const v = value(r)!;
      expect(tenThousandths(v['blocks'])).toBe(2_507);
      expect(v['blocks']).not.toContain('0.1007');
      // The box's own grade (0) when the form leaves it blank, as the inventory route does.
      expect(r.ok && listedInputs('gauge-blocks', form, r)).toEqual(expect.arrayContaining([['set', 'box:4'], ['grade', '0']]));
      expect(r.ok && Object.keys(r.input)).not.toContain('blocks');
    });
    it('should refuse a stack from a box whose blocks are all marked out of use', () => {
      const empty = { ...gaugeBox(4), blocks: gaugeBox(4).blocks.map((b) => ({ ...b, available: 0 })) };
      const r = setupResults('gauge-blocks', { ...GAUGE_BLOCKS_DEFAULTS, set: 'box:4' }, boxes(empty));
      expect(r.ok ? '' : r.error).toMatch(/every block marked missing or damaged/);
      expect(r.ok || r.pageOnly).toBeUndefined();
    });
    it('should send a stack from one of the team\'s boxes to its page', () => {
      const r = saved('gauge-blocks', { ...GAUGE_BLOCKS_DEFAULTS, set: 'box:4' });
      expect(r.ok ? '' : r.error).toMatch(/team's own gauge-block boxes: open the set-up in its calculator/);
    });
  });

  describe('lathe taper', () => {
    const forms: Array<[string, LatheTapersForm]> = [
      ['a standard taper', LATHE_DEFAULTS],
      ['a taper per foot and the large diameter and length', { ...LATHE_DEFAULTS, define: 'tpf', smallDiameter: '' }],
      ['an included angle and the large diameter, offset method', { ...LATHE_DEFAULTS, define: 'angle', method: 'offset', smallDiameter: '', length: '' }],
      ['two diameters and a length', { ...LATHE_DEFAULTS, define: 'diameters' }],
    ];
    it.each(forms)('should give the page\'s answer for %s', (_what, form) => {
      const page = latheCalc(form);
      expect(page.ok).toBe(true);
      if (!page.ok) return;
      expect(value(saved('lathe-taper', form))).toEqual(page.value);
    });
  });

  describe('angle blocks', () => {
    const forms: Array<[string, AngleBlocksForm]> = [
      ['the blocks for an angle', ANGLE_BLOCKS_DEFAULTS],
      ['the angle of a typed combination', { ...ANGLE_BLOCKS_DEFAULTS, mode: 'total' }],
    ];
    it.each(forms)('should give the page\'s answer for %s', (_what, form) => {
      const page = angleBlocksRequest(form);
      expect(page.ok).toBe(true);
      if (!page.ok) return;
      expect(value(saved('angle-blocks', form))).toEqual(page.value);
    });
    it.each(forms)('should give the page\'s answer from the team\'s box for %s', (_what, form) => {
      // A 13-block box in seconds of arc (1°, 3°, 9°, 27°, 41°; 1′, 3′, 9′, 27′; 3″, 6″, 18″, 30″) with its
      // 3° block marked missing; the page solves with the blocks the box holds.
      const sizes = [3_600, 10_800, 32_400, 97_200, 147_600, 60, 180, 540, 1_620, 3, 6, 18, 30];
      const blocks = sizes.map((size) => ({ size: String(size), available: size === 10_800 ? 0 : 1 }));
      const box: TeamBox = { id: 2, type: 'angle-blocks', name: 'Angle blocks, bench 3', unit: 'arcsec', grade: null, wearBlockSize: null, wearBlockCount: 0, blocks };
      const boxed = { ...form, set: 'box:2' };
      const page = angleBlocksRequest(boxed, new Map([[2, boxBlockAngles(blocks)]]));
      const r = setupResults('angle-blocks', boxed, boxes(box));
      expect(r.ok && r.box?.name).toBe('Angle blocks, bench 3');
      if (page.ok) expect(value(r)).toEqual(page.value);
      else expect(r.ok ? '' : r.error).toBe(page.error);
    });
    it('should send a combination from one of the team\'s boxes to its page', () => {
      const r = saved('angle-blocks', { ...ANGLE_BLOCKS_DEFAULTS, set: 'box:2' });
      expect(r.ok ? '' : r.error).toMatch(/team's own angle-block boxes: open the set-up in its calculator/);
    });

    it('should name the combination when it cannot be read', () => {
      const r = saved('angle-blocks', { ...ANGLE_BLOCKS_DEFAULTS, mode: 'total', combination: '27° + banana' });
      expect(r.ok ? '' : r.error).toMatch(/^Angle blocks: combination/);
    });
  });
});

/**
 * A set-up saved or imported through the API in the engine's own shape, opened on its page
 * ("Open in …", which patches the page's default form with the fields it names): the page must
 * make the same request, so it shows the set-up's own answer.
 */
describe('a set-up in the engine\'s shape opened on its calculator page', () => {
  const onPage = <T extends object>(kind: string, defaults: T, inputs: Record<string, unknown>): T =>
    ({ ...defaults, ...pickControlValues(savedFormFields(kind, inputs), Object.keys(defaults)) }) as T;
  const engine = (kind: string, inputs: Record<string, unknown>) => value(setupResults(kind, inputs));

  it.each<[string, Record<string, unknown>]>([
    ['angle and taper length', { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' }],
    ['angle and end thickness, with passes', { unit: 'in', thickness: '0.750', angle: '5', endThickness: '0.5', depthPerPass: '0.05' }],
    ['taper length and face length', { unit: 'mm', thickness: '20', taperLength: '40', faceLength: '40.5' }],
    ['a chamfer by its leg on the end', { unit: 'in', shape: 'chamfer', thickness: '0.5', angle: '45', removedAtEnd: '0.1' }],
  ])('taper: %s', (_what, inputs) => {
    const page = runTaper(onPage('taper', TAPER_DEFAULTS, inputs));
    expect(page.ok ? null : page.error).toBeNull();
    if (!page.ok) return;
    const { holding: _holding, ...answer } = page.value;
    expect(answer).toEqual(engine('taper', inputs));
  });

  it.each<[string, Record<string, unknown>]>([
    ['an angle and a set', { unit: 'in', barLength: '5', angle: "14°30'", set: 'inch-81' }],
    ['a stack and no set', { unit: 'mm', barLength: '100', stackHeight: '25' }],
    ['an angle with missing blocks', { unit: 'in', barLength: '10', angle: '30', set: 'inch-81', missing: ['0.1001', '0.125'] }],
  ])('sine bar: %s', (_what, inputs) => {
    const page = runSineBar(onPage('sine-bar', SINE_BAR_DEFAULTS, inputs));
    expect(page.ok ? null : page.error).toBeNull();
    if (!page.ok || (page.value.mode !== 'angle' && page.value.mode !== 'stack')) throw new Error('not a single-bar answer');
    expect(page.value.single).toEqual(engine('sine-bar', inputs));
  });

  it.each<[string, Record<string, unknown>]>([
    ['a target', { target: '3.9762', set: 'inch-81' }],
    ['missing blocks, wear blocks and a grade', { target: '1.2519', set: 'inch-81', missing: ['0.1009'], wearBlocks: '0.050', grade: '0' }],
  ])('gauge blocks: %s', (_what, inputs) => {
    const page = runGaugeBlocks(onPage('gauge-blocks', GAUGE_BLOCKS_DEFAULTS, inputs));
    if (!page.ok || page.value.source !== 'engine') throw new Error(page.ok ? 'box' : page.error);
    expect(page.value.result).toEqual(engine('gauge-blocks', inputs));
  });

  it.each<[string, Record<string, unknown>]>([
    ['a taper per foot and a work length (the demo set-up)', { unit: 'in', taperPerFoot: '0.60235', workLength: '6.000' }],
    ['a standard taper', { unit: 'in', standard: 'morse-2', workLength: '5' }],
    ['an included angle and the large diameter', { unit: 'mm', includedAngle: '5', largeDiameter: '30', stations: ['10', '20'] }],
    ['two diameters and a length', { unit: 'in', largeDiameter: '1', smallDiameter: '0.9', length: '2' }],
  ])('lathe taper: %s', (_what, inputs) => {
    const page = latheCalc(onPage('lathe-taper', LATHE_DEFAULTS, inputs));
    expect(page.ok ? null : page.error).toBeNull();
    if (!page.ok) return;
    expect(page.value).toEqual(engine('lathe-taper', inputs));
  });

  it.each<[string, Record<string, unknown>]>([
    ['an angle', { set: 'angle-13-npl', angle: "14°30'" }],
    ['a combination with reversed blocks', { set: 'angle-13-npl', combination: [{ angle: '27°', reversed: false }, { angle: '9°', reversed: true }, { angle: "27'", reversed: false }] }],
  ])('angle blocks: %s', (_what, inputs) => {
    const page = angleBlocksRequest(onPage('angle-blocks', ANGLE_BLOCKS_DEFAULTS, inputs));
    expect(page.ok ? null : page.error).toBeNull();
    if (!page.ok) return;
    expect(page.value).toEqual(engine('angle-blocks', inputs));
  });

  it.each<[string, Record<string, unknown>]>([
    ['a male dovetail (the demo set-up)', { kind: 'dovetail', side: 'male', unit: 'in', angle: '60', width: '1.250', rollDiameter: '0.375' }],
    ['a female dovetail read back from a measurement', { kind: 'dovetail', side: 'female', unit: 'in', angle: '60', rollDiameter: '0.5', measurement: '1.1340' }],
    ['a V-groove', { kind: 'v-groove', unit: 'in', includedAngle: '90', pinDiameter: '0.5', grooveWidth: '1' }],
    ['a V-groove read back from the pin height', { kind: 'v-groove', unit: 'in', includedAngle: '60', pinDiameter: '0.5', measurement: '0.2' }],
    ['a dovetail angle from two roll sizes', { kind: 'dovetail-angle', side: 'male', unit: 'in', rollDiameter1: '0.375', measurement1: '2.2745', rollDiameter2: '0.5', measurement2: '2.616' }],
    ['a taper from two heights', { kind: 'taper-two-heights', unit: 'in', measurement1: '0.745', measurement2: '0.620', heightDifference: '1' }],
    ['two discs by taper per foot', { kind: 'taper-discs', unit: 'in', largeDisc: '1', smallDisc: '0.5', reference: 'axis', taperPerFoot: '2' }],
    ['two discs by included angle, one side square', { kind: 'taper-discs', unit: 'in', largeDisc: '1', smallDisc: '0.5', reference: 'side', includedAngle: '9' }],
    ['two balls', { kind: 'taper-balls', unit: 'in', largeBall: '1', smallBall: '0.5', largeBallDepth: '0.25', smallBallDepth: '2' }],
  ])('pins and rolls: %s', (_what, inputs) => {
    const page = pinsCalc(onPage('pins-rolls', PINS_DEFAULTS, inputs));
    expect(page.ok ? null : page.error).toBeNull();
    if (!page.ok) return;
    const saved = engine('pins-rolls', inputs)!;
    expect(page.value.main.values).toEqual(saved['values']);
    expect(page.value.main.dms).toEqual(saved['dms']);
  });
});

