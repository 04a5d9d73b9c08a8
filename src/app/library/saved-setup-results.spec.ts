import { type SetupResults, listedInputs, setupResults } from '../../../shared/library/setup-results';
import { ANGLE_BLOCKS_DEFAULTS, type AngleBlocksForm, angleBlocksRequest } from '../angle-blocks/angle-blocks-page';
import { GAUGE_BLOCKS_DEFAULTS, type GaugeBlocksFormValues, runGaugeBlocks } from '../gauge-blocks/gauge-blocks-form';
import { LATHE_DEFAULTS, type LatheTapersForm, latheCalc } from '../lathe-tapers/lathe-tapers-page';
import { SINE_BAR_DEFAULTS, type SineBarFormValues } from '../sine-bar/sine-bar-form';
import { runSineBar } from '../sine-bar/sine-bar-modes';
import { TAPER_DEFAULTS, type TaperFormValues } from '../taper/taper-form';
import { runTaper } from '../taper/taper-page';

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
    it.each([['table'], ['compound']])('should send a %s set-up to its page rather than answer something else', (mode) => {
      const r = saved('sine-bar', { ...SINE_BAR_DEFAULTS, mode });
      expect(r.ok).toBe(false);
      expect(r.ok ? '' : r.error).toMatch(/open the set-up in its calculator/);
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
    it('should name the combination when it cannot be read', () => {
      const r = saved('angle-blocks', { ...ANGLE_BLOCKS_DEFAULTS, mode: 'total', combination: '27° + banana' });
      expect(r.ok ? '' : r.error).toMatch(/^Angle blocks: combination/);
    });
  });
});
