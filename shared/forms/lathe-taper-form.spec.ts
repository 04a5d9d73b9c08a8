import { calculateLatheTaper } from '../calc/lathe-taper';
import { type LatheTapersForm, latheRequest, standardHasSizes } from './lathe-taper-form';

const form = (over: Partial<LatheTapersForm>): LatheTapersForm => ({
  unit: 'in', define: 'standard', standard: 'morse-3', taperPerFoot: '', includedAngle: '', largeDiameter: '', smallDiameter: '', length: '',
  workLength: '', method: 'compound', stations: '0.5, 1, 2', ...over,
});

describe('lathe-taper form → request', () => {
  it('should know which standards fix their sizes and which only their taper', () => {
    expect(standardHasSizes('morse-3')).toBe(true);
    expect(standardHasSizes('steep-7-24')).toBe(false);
    expect(standardHasSizes('taper-pin')).toBe(false);
  });

  it('should answer a 7:24 steep taper without sizes, leaving out the diameters along it', () => {
    const r = calculateLatheTaper(latheRequest(form({ standard: 'steep-7-24' })));
    if (!r.ok) throw new Error(r.error);
    // 7:24 = 3-1/2 in/ft (US Army OD1645, REFERENCE.md §4.5).
    expect(r.value.taperPerFoot).toBe('3.50000');
    expect(r.value.stations).toEqual([]);
  });

  it('should list diameters along a 7:24 taper from the part\'s own large diameter', () => {
    const r = calculateLatheTaper(latheRequest(form({ standard: 'steep-7-24', largeDiameter: '2.75' })));
    if (!r.ok) throw new Error(r.error);
    // d(x) = D − (TPF / 12) · x: 2.75 − 3.5/12 · 1 = 2.458333 → 2.4583 (derived).
    expect(r.value.stations.map((s) => s.diameter)).toEqual(['2.6042', '2.4583', '2.1667']);
  });

  it('should take a taper pin\'s small diameter and length and find its large end', () => {
    const r = calculateLatheTaper(latheRequest(form({ standard: 'taper-pin', smallDiameter: '0.25', length: '2', stations: '' })));
    if (!r.ok) throw new Error(r.error);
    // 1/4 in/ft: D = d + (0.25 / 12) · 2 = 0.25 + 0.041667 = 0.2917 (derived; REFERENCE.md §4.5).
    expect(r.value.largeDiameter).toBe('0.2917');
  });

  it('should keep a sized standard\'s own sizes and ignore the form\'s diameter fields', () => {
    expect(latheRequest(form({ standard: 'morse-3', largeDiameter: '9' }))).toEqual({ unit: 'in', workLength: '', stations: ['0.5', '1', '2'], standard: 'morse-3' });
  });
});
