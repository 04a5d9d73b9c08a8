import { calculateAngleBlocks } from '../../shared/calc/angle-blocks';
import { calculateGaugeStack } from '../../shared/calc/gauge-stack';
import { calculateLatheTaper } from '../../shared/calc/lathe-taper';
import { calculateOverPins } from '../../shared/calc/over-pins';
import { calculateSineBar } from '../../shared/calc/sine-bar';
import type { CalcResult, Step } from '../../shared/calc/step';
import { calculateTaper } from '../../shared/calc/taper';
import { sheetCautions } from './setup-sheet';
import { fontRuns, pdfText } from './sheet-fonts';

describe("pdfText (what the sheet's font, IBM Plex Sans, can print)", () => {
  it('should print Greek letters and the signs the font has, and spell out those it lacks', () => {
    // The font's parts and their characters: @fontsource/ibm-plex-sans unicode.json.
    expect(pdfText('tan(α/2) = |M₂ − M₁| / (2 · ΔH)')).toBe('tan(α/2) = |M2 − M1| / (2 · ΔH)');
    expect(pdfText('n = ⌈h / depth per pass⌉')).toBe('n = ceil(h / depth per pass)');
    expect(pdfText('θ = Σ added − Σ reversed')).toBe('θ = Σ added − Σ reversed');
    expect(pdfText('11.5 × 10⁻⁶ K⁻¹')).toBe('11.5 × 10^-6 K^-1');
    expect(pdfText('T = √(Σ te²)')).toBe('T = sqrt(Σ te²)');
    expect(pdfText('7°30′00″ ≤ 90°')).toBe('7°30′00″ <= 90°');
  });

  it('should keep names in Latin, Greek and Cyrillic scripts and mark what the font lacks with "?"', () => {
    expect(pdfText('Café — 0.5 µm ± 2 °C “quoted”')).toBe('Café — 0.5 µm ± 2 °C “quoted”');
    expect(pdfText('Łukasz Żółć, Dvořák, Ελένη, Сергей, Nguyễn')).toBe('Łukasz Żółć, Dvořák, Ελένη, Сергей, Nguyễn');
    expect(pdfText('日本 🔧')).toBe('?? ?');
    expect(pdfText('line one\nline two')).toBe('line one\nline two');
  });

  it('should write each run in the part of the font that has its characters', () => {
    expect(fontRuns('Żółć 2 mm', 'regular')).toEqual([
      { font: 'plex-latin-ext-400', text: 'Ż' },
      { font: 'plex-latin-400', text: 'ó' },
      { font: 'plex-latin-ext-400', text: 'łć' },
      { font: 'plex-latin-400', text: ' 2 mm' },
    ]);
    expect(fontRuns('α = 7°', 'bold')).toEqual([
      { font: 'plex-greek-600', text: 'α' },
      { font: 'plex-latin-600', text: ' = 7°' },
    ]);
    expect(fontRuns('', 'regular')).toEqual([{ font: 'plex-latin-400', text: '' }]);
  });

  // Every derivation the engine writes, for a set-up of each area and each pins-and-rolls kind, prints
  // without a "?" standing for a symbol the fonts lack.
  const runs: Array<[string, CalcResult<{ steps: Step[] }>]> = [
    ['taper', calculateTaper({ unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250', depthPerPass: '0.040', fluteLength: '0.750' })],
    ['sine-bar', calculateSineBar({ unit: 'in', barLength: '5', angle: "14°30'", set: 'inch-81' })],
    ['gauge-blocks', calculateGaugeStack({ target: '3.9762', set: 'inch-81', grade: '0', temperature: '23' })],
    ['angle-blocks', calculateAngleBlocks({ angle: "14°30'", set: 'angle-13-npl' })],
    ['lathe-taper', calculateLatheTaper({ unit: 'in', taperPerFoot: '0.60235', workLength: '6' })],
    ['dovetail', calculateOverPins({ kind: 'dovetail', side: 'male', unit: 'in', angle: '60', width: '1.250', rollDiameter: '0.375', depth: '0.375' })],
    ['v-groove', calculateOverPins({ kind: 'v-groove', unit: 'in', includedAngle: '90', pinDiameter: '0.500', grooveWidth: '1.000' })],
    ['dovetail-angle', calculateOverPins({ kind: 'dovetail-angle', side: 'male', unit: 'in', rollDiameter1: '0.375', measurement1: '2.2745', rollDiameter2: '0.500', measurement2: '2.6160' })],
    ['taper-two-heights', calculateOverPins({ kind: 'taper-two-heights', unit: 'in', measurement1: '0.745', measurement2: '0.620', heightDifference: '1' })],
    ['taper-discs', calculateOverPins({ kind: 'taper-discs', unit: 'in', largeDisc: '1', smallDisc: '0.5', reference: 'side', centreDistance: '3' })],
    ['taper-balls', calculateOverPins({ kind: 'taper-balls', unit: 'in', largeBall: '1', smallBall: '0.5', largeBallDepth: '0.25', smallBallDepth: '2' })],
  ];
  it.each(runs)('should print every step of a %s derivation', (_name, result) => {
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.steps.length).toBeGreaterThan(0);
    for (const s of result.value.steps) {
      for (const text of Object.values(s).filter((v): v is string => typeof v === 'string')) {
        expect({ text, printed: pdfText(text).includes('?') }).toEqual({ text, printed: text.includes('?') });
      }
    }
  });
});

describe('sheetCautions', () => {
  const taper = calculateTaper({ unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' });
  const own = taper.ok ? taper.value.cautions : [];

  it('should not repeat a general caution whose topic the calculation\'s own cautions cover', () => {
    // The taper's own cautions speak of clamping and of eye protection already.
    expect(own.some((c) => /^Clamp the work/.test(c)) && own.some((c) => /eye protection/.test(c))).toBe(true);
    expect(sheetCautions('taper', own)).toEqual([...own, "Your shop rules, local regulations and the machine maker's instructions come first; this sheet does not replace them."]);
  });

  it('should give a stack of gauge blocks no cutting cautions of its own', () => {
    const list = sheetCautions('gauge-blocks', ['Wring blocks clean and dry; never leave them wrung.']);
    expect(list).toEqual(['Wring blocks clean and dry; never leave them wrung.', "Your shop rules, local regulations and the machine maker's instructions come first; this sheet does not replace them."]);
    expect(sheetCautions('taper', []).some((c) => /^Clamp the work/.test(c))).toBe(true);
  });
});
