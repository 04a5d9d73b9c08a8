import fc from 'fast-check';
import { Dec } from './decimal-math';
import { calculateLatheTaper, type LatheTaperResult } from './lathe-taper';
import type { CalcResult } from './step';

function value(r: CalcResult<LatheTaperResult>): LatheTaperResult {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}
const lathe = (input: Record<string, unknown>) => value(calculateLatheTaper(input));
const dp = (text: string, places: number) => new Dec(text).toDecimalPlaces(places).toString();

describe('calculateLatheTaper', () => {
  describe('tail-stock offset (REFERENCE.md §4.1)', () => {
    it('should give 1-1/2 in for 1 in/ft on work 3 ft long (Rose, Modern Machine Shop Practice)', () => {
      expect(lathe({ unit: 'in', taperPerFoot: 1, workLength: 36 }).tailstockOffset).toBe('1.5000');
    });
    it('should give 1/2 in for 3 in → 2 in over 12 in and 1/4 in for 1 in/ft on 6 in (US Navy "Using the Compound Rest")', () => {
      expect(lathe({ unit: 'in', largeDiameter: 3, smallDiameter: 2, length: 12, workLength: 12 }).tailstockOffset).toBe('0.5000');
      expect(lathe({ unit: 'in', taperPerFoot: 1, workLength: 6 }).tailstockOffset).toBe('0.2500');
    });
    it('should give 0.375 in for 1/2 in/ft on 18 in (Coast Guard QMED05 Q66, cross-check)', () => {
      expect(lathe({ unit: 'in', taperPerFoot: 0.5, workLength: 18 }).tailstockOffset).toBe('0.3750');
    });
    it('should give 1/3 in for a 3 in taper 1.250 → 1.000 on an 8 in shaft (sciemce cross-check; derived)', () => {
      expect(lathe({ unit: 'in', largeDiameter: 1.25, smallDiameter: 1, length: 3, workLength: 8 }).tailstockOffset).toBe('0.3333');
    });
    it('should give 0.46875 in for TPI 0.0625 on 15 in (learnexams cross-check)', () => {
      expect(lathe({ unit: 'in', taperPerInch: '0.0625', workLength: 15 }).exact.tailstockOffset).toBe('0.46875');
    });
  });

  describe('taper per foot ↔ angle (REFERENCE.md §4.6)', () => {
    it("should convert 6-1/8 in/ft to 28°38'01\" included (Machinery's Handbook 31 p. 695)", () => {
      expect(lathe({ unit: 'in', taperPerFoot: '6.125' }).includedAngleDms).toBe('28°38\'01"');
    });
    it('should convert 0.550 in/ft to 2.626° included (Precision Machining Practices: Foundations)', () => {
      expect(dp(lathe({ unit: 'in', taperPerFoot: '0.550' }).includedAngleDeg, 3)).toBe('2.626');
    });
    it('should convert 1/2 in/ft to a half angle of 1.1935° (homeshopmachinist cross-check)', () => {
      expect(lathe({ unit: 'in', taperPerFoot: 0.5 }).halfAngleDeg).toBe('1.1935');
    });
    it("should convert 3° included to .6283 in/ft (Groff, \"Angle of Taper Examples\")", () => {
      expect(dp(lathe({ unit: 'in', includedAngle: 3 }).taperPerFoot, 4)).toBe('0.6285');
    });
    it.each([
      [1, '0.01745'],
      [10, '0.17498'],
      [20, '0.35265'],
      [30, '0.53590'],
      [45, '0.82843'],
    ])('should convert %s° included to %s taper per inch (Derry-Collard, Turning and Boring Tapers)', (angle, tpi) => {
      expect(new Dec(lathe({ unit: 'in', includedAngle: angle }).taperPerInch).toFixed(5)).toBe(tpi);
    });
    it.each([
      ['0.0625', '0°17\'54"', '1:192.000'],
      ['0.25', '1°11\'37"', '1:48.000'],
      ['0.75', '3°34\'47"', '1:16.000'],
      ['3.5', '16°35\'39"', '1:3.429'],
    ])('should give %s in/ft → %s included, %s (REFERENCE.md §4.6 exact table, derived)', (tpf, dms, ratio) => {
      const r = lathe({ unit: 'in', taperPerFoot: tpf });
      expect([r.includedAngleDms, r.ratio]).toEqual([dms, ratio]);
    });
  });

  describe('standard tapers', () => {
    it.each([
      ['morse-0', '1.4908'],
      ['morse-1', '1.4287'],
      ['morse-2', '1.4307'],
      ['morse-3', '1.4377'],
      ['morse-4', '1.4876'],
      ['morse-5', '1.5073'],
      ['morse-6', '1.4933'],
      ['morse-7', '1.4894'],
    ])('%s should have the half angle %s° (SCI catalogue via REFERENCE.md §4.2)', (id, half) => {
      expect(lathe({ unit: 'in', standard: id }).halfAngleDeg).toBe(half);
    });
    it.each([
      ['morse-0', '2.0000'],
      ['morse-1', '2.1250'],
      ['morse-2', '2.5625'],
      ['morse-3', '3.1875'],
      ['morse-4', '4.0625'],
      ['morse-5', '5.1875'],
      ['morse-6', '7.2500'],
      ['morse-7', '10.0000'],
    ])('%s should be %s in long, the plug depth P as published (Machinery\'s Handbook "Morse Taper Shanks", via sizes.com)', (id, length) => {
      const r = lathe({ unit: 'in', standard: id });
      expect(r.length).toBe(length);
      expect(r.steps.find((st) => st.label === 'Taper length')?.formula).toMatch(/as published/);
    });
    it('should work out a Brown & Sharpe length from its diameters, its table giving lengths only to 0.01 in (derived)', () => {
      // (0.2392 − 0.2000) × 12 / 0.5020 = 0.93705 in; the vintagemachinery table prints .94 (REFERENCE.md §4.3).
      expect(lathe({ unit: 'in', standard: 'brown-sharpe-1' }).length).toBe('0.9371');
    });
    it('should give Jarno half angle 1°25\'56" (US Army OD1645; atan(0.6/24), derived)', () => {
      expect(lathe({ unit: 'in', standard: 'jarno-7' }).halfAngleDms).toBe('1°25\'56"');
    });
    it('should give the 7:24 steep taper 16°35\'39" included (derived)', () => {
      expect(lathe({ unit: 'in', standard: 'steep-7-24' }).includedAngleDms).toBe('16°35\'39"');
    });
  });

  describe('diameters', () => {
    it('should find the small end from the large end, taper and length, and diameters along it (Jones, Turning and Boring)', () => {
      const r = lathe({ unit: 'in', taperPerFoot: 0.6, largeDiameter: 1, length: 4, stations: [0, 2, 4] });
      expect(r.smallDiameter).toBe('0.8000');
      expect(r.stations.map((s) => s.diameter)).toEqual(['1.0000', '0.9000', '0.8000']);
    });
    it('should refuse a taper that comes to a point', () => {
      const r = calculateLatheTaper({ unit: 'in', taperPerFoot: 12, largeDiameter: 1, length: 2 });
      expect(r.ok || r.kind).toBe('impossible');
    });
  });

  describe('tail-stock offset too large or taper too steep for it', () => {
    const offsetWarning = (r: LatheTaperResult) => r.warnings.filter((w) => /more than a tail stock can usually be set over/.test(w));
    const steepWarning = (r: LatheTaperResult) => r.warnings.filter((w) => /too steep for the tail-stock offset method/.test(w));

    it('should warn that 57.735 mm for 60° over 100 mm is past any tail stock, and too steep for the method (100 · tan 30°, derived)', () => {
      const r = lathe({ unit: 'mm', includedAngle: 60, workLength: 100 });
      expect(r.tailstockOffset).toBe('57.735');
      expect(offsetWarning(r)).toEqual([
        'The tail-stock offset, 57.735 mm, is more than a tail stock can usually be set over (about 13 mm, common practice): turn this taper with the compound rest or a taper attachment.',
      ]);
      expect(steepWarning(r)[0]).toContain("lean about 30°00'00\" on the centres");
    });
    it('should warn that 1.7500 in for 3.5 in/ft over 12 in is past any tail stock (3.5/12 · 12 / 2, derived)', () => {
      const r = lathe({ unit: 'in', taperPerFoot: '3.5', workLength: 12 });
      expect(r.tailstockOffset).toBe('1.7500');
      expect(offsetWarning(r)[0]).toMatch(/^The tail-stock offset, 1\.7500 in, is more than .* \(about 1\/2 in, common practice\): turn this taper with the compound rest or a taper attachment\.$/);
      expect(steepWarning(r)).toHaveLength(1);
    });
    it('should take 1/2 in as the most a tail stock sets over (common practice): 1 in/ft on 12 in is 0.5000, on 12.1 in 0.5042 (derived)', () => {
      expect(lathe({ unit: 'in', taperPerFoot: 1, workLength: 12 }).warnings).toEqual([]);
      expect(offsetWarning(lathe({ unit: 'in', taperPerFoot: 1, workLength: '12.1' }))).toHaveLength(1);
      // 12.7 mm = 1/2 in: 1 in/ft (k = 1/12) over 152.4 mm is 6.350 mm, over 305 mm 12.708 mm (derived).
      expect(offsetWarning(lathe({ unit: 'mm', taperPerFoot: 1, workLength: '304.8' }))).toEqual([]);
      expect(offsetWarning(lathe({ unit: 'mm', taperPerFoot: 1, workLength: '305' }))).toHaveLength(1);
    });
    it('should take 10° included as the steepest taper for the offset method (common practice), on short work (2 · tan 5.05° = 0.1767, derived)', () => {
      expect(lathe({ unit: 'in', includedAngle: 10, workLength: 2 }).warnings).toEqual([]);
      const r = lathe({ unit: 'in', includedAngle: '10.1', workLength: 2 });
      expect(r.tailstockOffset).toBe('0.1767');
      expect(offsetWarning(r)).toEqual([]);
      expect(steepWarning(r)).toHaveLength(1);
    });
    it('should say nothing of the offset for a Morse No. 3 on 8 in, nor without a work length (REFERENCE.md §4.2; 0.60235 · 8 / 24 = 0.2008, derived)', () => {
      expect(lathe({ unit: 'in', standard: 'morse-3', workLength: 8 }).warnings).toEqual([]);
      expect(lathe({ unit: 'in', includedAngle: 60 }).warnings).toEqual([]);
    });
  });

  describe('taper ratio (API)', () => {
    it.each(['1:20', '1 : 20', ' 1:20 ', 20, '20'])('should read %p as 1:20: k 0.05, 2.8642° included (2 · atan(1/40), derived)', (ratio) => {
      const r = lathe({ unit: 'in', ratio });
      expect([r.ratio, r.taperPerInch, r.includedAngleDeg, r.taperPerFoot]).toEqual(['1:20.000', '0.050000', '2.8642', '0.60000']);
      expect(r.warnings).toEqual([]);
    });
    it('should read "7:24" as the steep taper, 16°35\'39" included (US Army OD1645 via REFERENCE.md §4.5; 2 · atan(7/48), derived)', () => {
      const r = lathe({ unit: 'in', ratio: '7:24' });
      expect([r.includedAngleDms, r.ratio, r.taperPerFoot]).toEqual(['16°35\'39"', '1:3.429', '3.50000']);
      expect(r.steps[0]).toMatchObject({ substituted: 'k = 7 / 24', value: '0.291667' });
    });
    it('should refuse a bare number below 1 as unclear, saying how to write 1:20 (0.05 would be 1:0.05, 168.58° included)', () => {
      const r = calculateLatheTaper({ unit: 'in', ratio: '0.05' });
      expect(r.ok || r.kind).toBe('invalid');
      if (r.ok) return;
      expect(r.fields.ratio).toContain('is unclear as a bare number below 1: 0.05 would be read as 1:0.05');
      expect(r.fields.ratio).toContain('"1:20" for a taper of 1 in 20');
      expect(r.fields.ratio).not.toMatch(/[a-z][A-Z]/);
      expect(calculateLatheTaper({ unit: 'in', ratio: 0.05 }).ok).toBe(false);
    });
    it('should answer "1:0.05" as written but warn it is a very flat cone: 168.5788° included, 240 in/ft (2 · atan(10), derived)', () => {
      const r = lathe({ unit: 'in', ratio: '1:0.05' });
      expect([r.includedAngleDeg, r.taperPerFoot]).toEqual(['168.5788', '240.00000']);
      expect(r.warnings).toHaveLength(1);
      expect(r.warnings[0]).toMatch(/^An included angle of 168°34'44" is a very flat cone, nearer a face than a taper .*a taper of 1 in 20 is written 1:20\.$/);
    });
    it('should warn of a very flat cone however it is given, above 150° included (common practice: drill points and countersinks stay below about 140°)', () => {
      expect(lathe({ unit: 'in', includedAngle: 170 }).warnings[0]).toMatch(/very flat cone/);
      expect(lathe({ unit: 'in', includedAngle: 150 }).warnings).toEqual([]);
      expect(lathe({ unit: 'in', includedAngle: 120 }).warnings).toEqual([]);
    });
    it.each([
      ['abc', 'must be a taper ratio such as "1:20" (a diameter change of 1 over a length of 20), got "abc"'],
      ['1:20:3', 'must be a taper ratio such as "1:20" (a diameter change of 1 over a length of 20), got "1:20:3"'],
      ['1:0', 'must have both sides greater than 0, such as "1:20", got "1:0"'],
      [-20, 'must be a taper ratio such as "1:20"; a bare number x means 1:x and must be greater than 0'],
      [true, 'must be a taper ratio such as "1:20"'],
    ])('should refuse the ratio %p with a message saying how to write it', (ratio, message) => {
      const r = calculateLatheTaper({ unit: 'in', ratio });
      expect(r.ok || [r.kind, r.fields]).toEqual(['invalid', { ratio: message }]);
    });
  });

  describe('metric work (words for a metric job)', () => {
    it('should give the taper per mm of length and the ratio, never per inch or per foot, with the same numbers (REFERENCE.md §4.2 MT3 0.60235 in/ft; k = TPF/12, derived)', () => {
      const mm = lathe({ unit: 'mm', standard: 'morse-3', workLength: '203.2' });
      const inch = lathe({ unit: 'in', standard: 'morse-3', workLength: 8 });
      expect([mm.taperPerInch, mm.ratio, mm.halfAngleDms]).toEqual([inch.taperPerInch, inch.ratio, inch.halfAngleDms]);
      expect([mm.taperPerInch, mm.ratio]).toEqual(['0.050196', '1:19.922']);
      expect(mm.steps.map((st) => st.label)).toEqual(['Taper per mm of length (Morse No. 3)', 'Taper length', 'Taper ratio', 'Half angle (compound setting)', 'Included angle', 'Tail-stock offset']);
      for (const st of mm.steps) expect(`${st.label} ${st.formula} ${st.unit}`).not.toMatch(/in\/ft|per inch|per foot|TPF \/ 24/);
      expect(mm.steps.find((st) => st.label === 'Half angle (compound setting)')).toMatchObject({ formula: 'α/2 = atan(k / 2)', value: '1.4377' });
    });
    it('should keep the inch words on an inch job', () => {
      expect(lathe({ unit: 'in', includedAngle: 3 }).steps.map((st) => st.label)).toEqual(['Taper per inch', 'Taper per foot', 'Half angle (compound setting)', 'Included angle']);
    });
  });

  describe('invalid input', () => {
    it('should refuse two definitions, reversed diameters and unknown standards', () => {
      expect(calculateLatheTaper({ unit: 'in', taperPerFoot: 1, includedAngle: 3 }).ok).toBe(false);
      expect(calculateLatheTaper({ unit: 'in', largeDiameter: 1, smallDiameter: 2, length: 3 }).ok).toBe(false);
      expect(calculateLatheTaper({ unit: 'in', standard: 'morse-99' }).ok).toBe(false);
      expect(calculateLatheTaper({ unit: 'in' }).ok).toBe(false);
      expect(calculateLatheTaper({ unit: 'in', includedAngle: 180 }).ok).toBe(false);
    });
    it('should name fields in words in its messages', () => {
      const fields = (input: Record<string, unknown>) => {
        const r = calculateLatheTaper(input);
        if (r.ok) throw new Error('expected a refusal');
        return r.fields;
      };
      expect(fields({ unit: 'in', largeDiameter: 1 }).smallDiameter).toBe(
        'is required: give the taper (as a taper per foot, an angle, a ratio or a standard taper) or both diameters and the length',
      );
      expect(fields({ unit: 'in', taperPerFoot: 1, includedAngle: 3 }).includedAngle).toBe('conflicts with the taper per foot: define the taper one way only');
      expect(fields({ unit: 'in', taperPerFoot: 1, largeDiameter: 1, smallDiameter: 0.9, length: 2 }).length).toBe(
        'leave one of the large diameter, small diameter and taper length empty when the taper is given',
      );
    });
    it('should never throw (property)', () => {
      fc.assert(fc.property(fc.anything(), (x) => void expect(typeof calculateLatheTaper(x).ok).toBe('boolean')));
    });
  });
});
