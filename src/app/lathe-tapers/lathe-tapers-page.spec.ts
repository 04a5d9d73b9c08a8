import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import LatheTapersPage, { LATHE_DEFAULTS, latheRequest, splitStations } from './lathe-tapers-page';

describe('LatheTapersPage', () => {
  let fixture: ComponentFixture<LatheTapersPage>;

  async function create(url = '/lathe-tapers'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'lathe-tapers', children: [] }]), provideHttpClient(), provideHttpClientTesting()],
    });
    await TestBed.inject(Router).navigateByUrl(url);
    fixture = TestBed.createComponent(LatheTapersPage);
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('should show the Morse No. 3 arbor’s compound setting and draw the work between centres', async () => {
    await create();
    // REFERENCE.md §4.2 (Machinery's Handbook "Morse Taper Shanks"; SCI catalogue): MT3 0.60235 in/ft, half angle 1°26'16".
    expect(resultValue('Half angle (compound setting)')).toBe(`1°26'16"`);
    expect(resultValue('Taper per foot')).toBe('0.60235');
    const svg = el().querySelector('sw-lathe-work-drawing svg');
    expect(svg?.querySelector('title')?.textContent).toContain('compound rest');
    expect(svg?.textContent).toContain('Ø 0.9380 in');
    expect(svg?.textContent).toContain(`α/2 = 1°26'16"`);
  });

  it('should give the tail-stock offset from the URL (REFERENCE.md §4.1, Rose: 1 in/ft, work 3 ft → 1-1/2 in)', async () => {
    await create('/lathe-tapers?define=tpf&taperPerFoot=1&largeDiameter=&smallDiameter=&length=&workLength=36&method=offset&stations=');
    expect(resultValue('Tail-stock offset')).toBe('1.5000');
    expect(el().querySelector('sw-lathe-work-drawing svg title')?.textContent).toContain('tail stock set over');
    expect(el().querySelector('sw-lathe-work-drawing')?.textContent).toContain('Diameters not given');
  });

  it('should put the message under a bad taper per foot and clear the results', async () => {
    await create('/lathe-tapers?define=tpf&largeDiameter=&smallDiameter=&length=&stations=');
    await type('taperPerFoot', 'steep');
    expect(fieldErrors()).toContain('Must be a decimal number');
    expect(el().querySelector('.no-results')).not.toBeNull();
  });

  it('should ask for the work length when the tail stock is set over', async () => {
    await create('/lathe-tapers?method=offset');
    await type('workLength', '');
    expect(fieldErrors()).toContain('Is required for the tail-stock offset');
  });

  it('should find the small diameter from the large one, the length and the included angle', async () => {
    await create(`/lathe-tapers?define=angle&includedAngle=3&largeDiameter=1&smallDiameter=&length=2&stations=`);
    // REFERENCE.md §4.6: included 3° → TPF 0.62846 [DER]; d = 1 − 0.0523718·2 = 0.8953 (derived).
    expect(resultValue('Taper per foot')).toBe('0.62846');
    expect(resultValue('Small diameter')).toBe('0.8953');
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

  function el(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  function resultValue(label: string): string | undefined {
    const row = Array.from(el().querySelectorAll('.result')).find((r) => r.querySelector('dt')?.textContent?.trim() === label);
    return row?.querySelector('.number')?.textContent?.trim();
  }

  function fieldErrors(): string {
    return Array.from(el().querySelectorAll('mat-error')).map((e) => e.textContent ?? '').join(' | ');
  }

  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 150));
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function type(name: string, value: string): Promise<void> {
    const input = el().querySelector(`input[formcontrolname="${name}"]`) as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await settle();
  }
});
