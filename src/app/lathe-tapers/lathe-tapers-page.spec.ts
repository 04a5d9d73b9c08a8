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

  it('should say which size to leave out when the taper per foot is chosen with all three sizes filled', async () => {
    await page.open('/lathe-tapers?define=tpf');
    expect(page.fieldErrors()).toMatch(/leave one of large diameter, small diameter and length empty/i);
    expect(page.fieldErrors()).not.toMatch(/largeDiameter/);
    await page.type('smallDiameter', '');
    // REFERENCE.md §4.1: d = D − TPF·L/12 = 0.938 − 0.600 × 3.1875/12 = 0.7786 in (derived).
    expect(page.resultValue('Small diameter')).toBe('0.7786');
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
});
