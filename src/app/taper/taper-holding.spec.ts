import { calculateTaper } from '../../../shared/calc/taper';
import { TAPER_DEFAULTS, type TaperFormValues, toTaperRequest } from './taper-form';
import { holdingKind, planHolding, shortAngle } from '../../../shared/forms/taper-holding';

const taper = calculateTaper(toTaperRequest(TAPER_DEFAULTS));
if (!taper.ok) throw new Error(taper.error);
const plan = (over: Partial<TaperFormValues>) => planHolding({ ...TAPER_DEFAULTS, ...over }, taper.value);

describe('taper work-holding', () => {
  it('should read an unknown holding as angle blocks', () => expect(holdingKind('clamp')).toBe('angle-block'));

  it('should shorten block marks for the drawing', () => {
    expect(shortAngle('5°00\'00"')).toBe('5°');
    expect(shortAngle('0°30\'00"')).toBe("30'");
    expect(shortAngle('1°03\'09"')).toBe('1°3\'9"');
    expect(shortAngle('0°00\'00"')).toBe('0°');
  });

  it('should wring the fewest angle blocks for 7°30′, a reversed block subtracting', () => {
    // 5° + 3° − 30′ = 7°30′ from the 16-piece set (blocks add, a reversed one subtracts: REFERENCE.md §6).
    const r = plan({});
    if (!r.ok) throw new Error(r.error);
    expect(r.value.heading).toBe('Set-up on angle blocks');
    expect(r.value.instructions[0]).toContain('5°00\'00" + 3°00\'00" − 0°30\'00" = 7°30\'00"');
    expect(r.value.drawing).toEqual({ kind: 'angle-block', blocks: ['5°', '+3°', "−30'"] });
    expect(r.value.instructions[r.value.instructions.length - 1]).toContain('feed down 0.3263 in');
  });

  it('should stack gauge blocks under a 5 in sine plate for the taper angle', () => {
    // H = L · sin α = 5 · sin 7.5° = 0.65263 → 0.6526 in (REFERENCE.md §2.1, derived).
    const r = plan({ holding: 'sine-plate' });
    if (!r.ok || r.value.drawing.kind !== 'sine-plate') throw new Error('the sine plate should work');
    const d = r.value.drawing;
    expect(d.stackLabel).toBe('0.6526 in stack');
    expect(d.plateLength).toBe(5);
    expect(d.blocks.reduce((t, b) => t + Math.round(b.size * 10_000), 0)).toBe(6_526);
    expect(r.value.instructions[0]).toContain(`Wring a 0.6526 in stack: ${d.blocks.map((b) => b.label).join(' + ')}`);
  });

  it('should not set up a stack the set cannot make, and offer the nearest it can (sine plate at 0.5°)', () => {
    // H = 5 · sin 0.5° = 0.04363 → 0.0436 in (REFERENCE.md §2.1, derived): below the 81-piece set's
    // thinnest block, 0.050 in. The nearest it makes, 0.0500 in, stands the plate at
    // asin(0.05 / 5) = 0.572967° = 0°34'22.7", +262.7″ from 0.5° (derived).
    const small = calculateTaper({ unit: 'in', thickness: 1, angle: 0.5, taperLength: 3 });
    if (!small.ok) throw new Error(small.error);
    const r = planHolding({ ...TAPER_DEFAULTS, holding: 'sine-plate', plateLength: '5', plateSet: 'inch-81' }, small.value);
    if (!r.ok) throw new Error(r.error);
    const text = r.value.instructions.join(' ');
    expect(text).not.toMatch(/Wring a 0\.0436 in stack|the hinge roll stays where it is/);
    expect(r.value.instructions[0]).toContain('The Inch 81-piece set cannot make the 0.0436 in stack this angle needs');
    expect(r.value.instructions[1]).toContain('0.0500 in (0.050) stands the plate at 0°34\'22.7", +262.7″ from the taper angle');
    expect(r.value.instructions[r.value.instructions.length - 1]).toContain('feed down 0.0262 in');
    // A sine plate's hinge roll cannot go on a stack (common practice): the sine bar's advice is not given.
    expect(r.value.warnings.join(' ')).not.toMatch(/raise both rolls/);
    expect(r.value.warnings).toContain(
      "The Inch 81-piece set cannot make a 0.0436 in stack, and a sine plate's hinge roll cannot be raised to build the difference on two stacks: change the angle to one the set can make, or hold the part another way (see the set-up).",
    );
    // The sketch shows the height needed as an outline, not as blocks that could be wrung.
    expect(r.value.drawing).toEqual({ kind: 'sine-plate', plateLength: 5, blocks: [{ size: 0.0436, label: '0.0436' }], stackLabel: '0.0436 in: not in set', unmakeable: true });
  });

  it('should put a bad plate length on its own control', () => {
    for (const bad of ['abc', '-5', '0', '']) {
      const r = plan({ holding: 'sine-plate', plateLength: bad });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(Object.keys(r.fields)).toEqual(['plateLength']);
    }
  });

  it('should set a tilting vise on its scale and say to check it', () => {
    const r = plan({ holding: 'tilted-vise' });
    if (!r.ok) throw new Error(r.error);
    expect(r.value.instructions[0]).toBe('Tilt the vise body to 7°30\'00" on its scale and lock it.');
    expect(r.value.instructions[1]).toContain('common practice');
    expect(r.value.drawing).toEqual({ kind: 'tilted-vise' });
  });
});
