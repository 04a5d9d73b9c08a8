import { pageSpec } from '../workbench/testing/page-spec-harness';
import LatheTapersPage, { LATHE_DEFAULTS, latheRequest, splitStations } from './lathe-tapers-page';

describe('LatheTapersPage', () => {
  const page = pageSpec(LatheTapersPage, 'lathe-tapers');

  it('should show the Morse No. 3 arbor’s compound setting and draw the work between centres', async () => {
    await page.open();
    // REFERENCE.md §4.2 (Machinery's Handbook "Morse Taper Shanks"; SCI catalogue): MT3 0.60235 in/ft, half angle 1°26'16".
    expect(page.resultValue('Half angle (compound setting)')).toBe(`1°26'16"`);
    expect(page.resultValue('Taper per foot')).toBe('0.60235');
    const svg = page.el.querySelector('sw-lathe-work-drawing svg');
    expect(svg?.querySelector('title')?.textContent).toContain('compound rest');
    expect(svg?.textContent).toContain('Ø 0.9380 in');
    expect(svg?.textContent).toContain(`α/2 = 1°26'16"`);
  });

  it('should fall back to the standard taper for a choice no page offers (?define=foo)', async () => {
    await page.open('/lathe-tapers?define=foo&method=bar');
    // Morse No. 3, the default: 0.60235 in/ft (REFERENCE.md §4.2).
    expect(page.resultValue('Taper per foot')).toBe('0.60235');
    expect((page.fixture.componentInstance['form'].controls.define.value)).toBe('standard');
    expect((page.fixture.componentInstance['form'].controls.method.value)).toBe('compound');
  });

  it('should give the tail-stock offset from the URL (REFERENCE.md §4.1, Rose: 1 in/ft, work 3 ft → 1-1/2 in)', async () => {
    await page.open('/lathe-tapers?define=tpf&taperPerFoot=1&largeDiameter=&smallDiameter=&length=&workLength=36&method=offset&stations=');
    expect(page.resultValue('Tail-stock offset')).toBe('1.5000');
    expect(page.el.querySelector('sw-lathe-work-drawing svg title')?.textContent).toContain('tail stock set over');
    expect(page.el.querySelector('sw-lathe-work-drawing')?.textContent).toContain('Diameters not given');
  });

  it('should answer a 7:24 steep taper and ask for the part\'s own sizes to list diameters along it', async () => {
    await page.open('/lathe-tapers?define=standard&standard=steep-7-24&largeDiameter=&smallDiameter=&length=');
    // 7:24 = 3-1/2 in/ft (US Army OD1645, REFERENCE.md §4.5).
    expect(page.resultValue('Taper per foot')).toBe('3.50000');
    expect(page.el.querySelector('.hint-line')?.textContent).toContain('This standard fixes only the taper');
    expect(page.fieldErrors()).toBe('');
    await page.type('largeDiameter', '2.75');
    // d(1 in) = 2.75 − 3.5/12 = 2.4583 in (derived).
    expect(page.el.textContent).toContain('2.4583');
  });

  it('should put the message under a bad taper per foot and clear the results', async () => {
    await page.open('/lathe-tapers?define=tpf&largeDiameter=&smallDiameter=&length=&stations=');
    await page.type('taperPerFoot', 'steep');
    expect(page.fieldErrors()).toContain('Must be a decimal number');
    expect(page.el.querySelector('.no-results')).not.toBeNull();
  });

  it('should open the taper-per-foot way ready to answer, working out the small diameter', async () => {
    await page.open('/lathe-tapers?define=tpf');
    // The Morse No. 3 sizes stay, less the small diameter: REFERENCE.md §4.1, d = D − TPF·l/12
    // = 0.938 − 0.600 × 3.1875/12 = 0.7786 in (derived).
    expect(page.fieldErrors()).toBe('');
    expect((page.el.querySelector('input[formcontrolname="smallDiameter"]') as HTMLInputElement).value).toBe('');
    expect(page.resultValue('Small diameter')).toBe('0.7786');
  });

  it('should open the included-angle way ready to answer when picked from the list', async () => {
    await page.open();
    await pick('The taper is given as', 'Included angle');
    // 3° included: k = 2·tan 1°30' = 0.0523718; d = 0.938 − 0.0523718 × 3.1875 = 0.7711 in (derived, REFERENCE.md §4.1).
    expect(page.fieldErrors()).toBe('');
    expect(page.resultValue('Small diameter')).toBe('0.7711');
  });

  it('should say which size to leave out when all three are typed, in words, and still show each field\'s own error', async () => {
    await page.open('/lathe-tapers?define=tpf');
    await page.type('smallDiameter', '0.778');
    expect(page.fieldErrors()).toMatch(/leave one of the large diameter, small diameter and taper length empty/i);
    expect(page.fieldErrors()).not.toMatch(/largeDiameter|smallDiameter|taperPerFoot/);
    // The long message takes its own room instead of running into the toggle below.
    const length = page.el.querySelector('input[formcontrolname="length"]')!.closest('mat-form-field')!;
    expect(length.querySelector('.mat-mdc-form-field-subscript-dynamic-size')).not.toBeNull();
    await page.type('taperPerFoot', 'abc');
    expect(page.fieldErrors()).toContain('Must be a decimal number');
    await page.type('workLength', '');
    await pickMethod('Tail-stock offset');
    expect(page.fieldErrors()).toContain('Must be a decimal number');
    expect(page.fieldErrors()).toContain('Is required for the tail-stock offset');
  });

  it.each([
    ['morse-5', '5.1875'],
    ['morse-6', '7.2500'],
  ])('should show the published length of %s: %s in (Machinery\'s Handbook "Morse Taper Shanks" plug depth 5-3/16, 7-1/4)', async (id, length) => {
    await page.open(`/lathe-tapers?standard=${id}`);
    expect(page.resultValue('Taper length')).toBe(length);
  });

  it('should ask for the work length when the tail stock is set over', async () => {
    await page.open('/lathe-tapers?method=offset');
    await page.type('workLength', '');
    expect(page.fieldErrors()).toContain('Is required for the tail-stock offset');
  });

  it('should find the small diameter from the large one, the length and the included angle', async () => {
    await page.open(`/lathe-tapers?define=angle&includedAngle=3&largeDiameter=1&smallDiameter=&length=2&stations=`);
    // REFERENCE.md §4.6: included 3° → TPF 0.62846 [DER]; d = 1 − 0.0523718·2 = 0.8953 (derived).
    expect(page.resultValue('Taper per foot')).toBe('0.62846');
    expect(page.resultValue('Small diameter')).toBe('0.8953');
  });

  it('should give a metric job its taper as a ratio and per mm of length, not per foot or per inch', async () => {
    await page.open('/lathe-tapers?unit=mm&workLength=203.2');
    // REFERENCE.md §4.2: MT3 0.60235 in/ft, so k = 0.60235/12 = 0.0501958 (per mm as per inch), 1/k = 19.922,
    // 5.0196 mm per 100 mm (derived).
    expect(page.resultValue('Taper ratio')).toBe('1:19.922');
    expect(page.resultValue('Taper per mm of length')).toBe('0.050196');
    expect(page.resultValue('Taper per foot')).toBeUndefined();
    expect(page.resultValue('Taper per inch')).toBeUndefined();
    const results = page.el.querySelector('sw-results')?.textContent ?? '';
    expect(results).toContain('5.0196 mm on the diameter per 100 mm of length');
    expect(results).not.toMatch(/in\/ft|in\/in|per foot|per inch/);
    const derivation = page.el.querySelector('sw-derivation')?.textContent ?? '';
    expect(derivation).toContain('α/2 = atan(k / 2)');
    expect(derivation).not.toMatch(/in\/ft|per inch/);
  });

  it('should warn that a 60° taper over 100 mm needs 57.735 mm of offset, more than a tail stock sets over (100 · tan 30°, derived)', async () => {
    await page.open('/lathe-tapers?unit=mm&define=angle&includedAngle=60&largeDiameter=&smallDiameter=&length=&workLength=100&method=offset&stations=');
    expect(page.resultValue('Tail-stock offset')).toBe('57.735');
    const warnings = Array.from(page.el.querySelectorAll('sw-warnings')).map((w) => w.textContent).join(' ');
    expect(warnings).toContain('more than a tail stock can usually be set over (about 13 mm, common practice): turn this taper with the compound rest or a taper attachment');
    expect(warnings).toContain('too steep for the tail-stock offset method');
  });

  describe('latheRequest', () => {
    it('should send only the fields of the chosen definition', () => {
      expect(latheRequest(LATHE_DEFAULTS)).toEqual({ unit: 'in', standard: 'morse-3', workLength: '8', stations: ['0.5', '1', '2'] });
      expect(latheRequest({ ...LATHE_DEFAULTS, define: 'diameters' })).toMatchObject({ largeDiameter: '0.938', smallDiameter: '0.778', length: '3.1875' });
      expect(latheRequest({ ...LATHE_DEFAULTS, define: 'diameters' })).not.toHaveProperty('standard');
    });
  });

  describe('splitStations', () => {
    it('should split on commas, spaces and semicolons', () => {
      expect(splitStations('0.5, 1 ;2,,')).toEqual(['0.5', '1', '2']);
      expect(splitStations('')).toEqual([]);
    });
  });

  /** Opens the select labelled `label` and picks the option with this text. */
  async function pick(label: string, text: string): Promise<void> {
    const field = Array.from(page.el.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;
    (field.querySelector('.mat-mdc-select-trigger') as HTMLElement).click();
    await page.render();
    const option = Array.from(document.querySelectorAll('mat-option')).find((o) => o.textContent?.trim() === text) as HTMLElement;
    option.click();
    await page.settle();
  }

  async function pickMethod(text: string): Promise<void> {
    const button = Array.from(page.el.querySelectorAll('mat-button-toggle button')).find((b) => b.textContent?.trim() === text) as HTMLButtonElement;
    button.click();
    await page.settle();
  }
});
