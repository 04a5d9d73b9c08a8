import { EXERCISE_TYPES, type ExerciseType } from './exercise-types';
import { checkAnswer, hintsOf, readAnswer } from './exercise';
import { article, buildExercise, drawInputs, generateExercise } from './generators';

const SEEDS = Array.from({ length: 40 }, (_, i) => (i * 2_654_435_761) >>> 0);
const rad = (deg: number) => (deg * Math.PI) / 180;
const deg = (r: number) => (r * 180) / Math.PI;
const num = (text: string) => Number(text);
/** Angle text as decimal degrees ("7.5" or "14°30'00\""). */
function degreesOf(text: string): number {
  const m = /^(\d+)°(\d+)'(\d+(?:\.\d+)?)"$/.exec(text);
  return m ? num(m[1]!) + num(m[2]!) / 60 + num(m[3]!) / 3600 : num(text);
}

/**
 * An independent double-precision answer for drawn inputs, straight from the published formulas
 * (derived): checks the generators wire the engine to the right question.
 */
function formulaAnswer(type: ExerciseType, seed: number): number | null {
  switch (type) {
    case 'taper-depth': { // h = L·sin α, REFERENCE.md §1 (derived)
      const i = drawInputs(type, seed);
      return num(i.taperLength) * Math.sin(rad(num(i.angle)));
    }
    case 'taper-end-thickness': { // t = T − L·tan α, REFERENCE.md §1 (derived)
      const i = drawInputs(type, seed);
      return num(i.thickness) - num(i.taperLength) * Math.tan(rad(num(i.angle)));
    }
    case 'taper-angle': { // α = atan((T − t)/L), REFERENCE.md §1 (derived)
      const i = drawInputs(type, seed);
      return deg(Math.atan((num(i.thickness) - num(i.endThickness)) / num(i.taperLength)));
    }
    case 'sine-stack': { // H = L·sin θ, Army OD1642 sine-bar lesson (REFERENCE.md §2.1)
      const i = drawInputs(type, seed);
      return num(i.barLength) * Math.sin(rad(degreesOf(i.angle)));
    }
    case 'sine-angle': { // θ = asin(H/L), Army OD1642 (REFERENCE.md §2.1)
      const i = drawInputs(type, seed);
      return deg(Math.asin(num(i.stackHeight) / num(i.barLength)));
    }
    case 'lathe-half-angle': { // α/2 = atan(TPF/24), REFERENCE.md §4.1 (derived)
      const i = drawInputs(type, seed);
      return deg(Math.atan(num(i.taperPerFoot) / 24));
    }
    case 'lathe-offset': { // offset = (D − d)/2 · L/l, Rose; US Navy "Using the Compound Rest" (REFERENCE.md §4.1)
      const i = drawInputs(type, seed);
      return ((num(i.largeDiameter) - num(i.smallDiameter)) / 2) * (num(i.workLength) / num(i.length));
    }
    case 'dovetail-pins': { // x = a + D·(1 + cot(α/2)), Machinery's Handbook "Measuring dovetail slides" (REFERENCE.md §5.1)
      const i = drawInputs(type, seed);
      return num(i.width) + num(i.rollDiameter) * (1 + 1 / Math.tan(rad(num(i.angle) / 2)));
    }
    case 'gauge-fewest':
      return null;
  }
}

describe('generateExercise', () => {
  describe.each(EXERCISE_TYPES.map((t) => [t]))('%s', (type) => {
    it('should reproduce the same problem from the same seed', () => {
      for (const seed of SEEDS.slice(0, 5)) expect(generateExercise(type, seed)).toEqual(generateExercise(type, seed));
    });

    it('should give different problems for different seeds', () => {
      const prompts = new Set(SEEDS.map((s) => generateExercise(type, s).prompt));
      expect(prompts.size).toBeGreaterThan(SEEDS.length / 3);
    });

    it('should agree with the published formula worked independently', () => {
      for (const seed of SEEDS) {
        const expected = formulaAnswer(type, seed);
        if (expected === null) continue;
        const exercise = generateExercise(type, seed);
        expect(Math.abs(num(exercise.exact) - expected)).toBeLessThan(1e-9);
        expect(Number.isFinite(num(exercise.answer.split(/[°\s]/)[0]!))).toBe(true);
      }
    });

    it('should accept its own answer and refuse one just outside the tolerance', () => {
      for (const seed of SEEDS.slice(0, 10)) {
        const e = generateExercise(type, seed);
        expect(checkAnswer(e, e.exact)).toMatchObject({ ok: true, correct: true });
        const off = (num(e.exact) + num(e.tolerance) + (e.answerKind === 'count' ? 1 : 0.0002)).toString();
        expect(checkAnswer(e, off)).toMatchObject({ ok: true, correct: false });
      }
    });

    it('should end its worked solution on the step that gives the answer, hidden in the hints', () => {
      const e = generateExercise(type, SEEDS[3]!);
      expect(e.steps.length).toBeGreaterThan(0);
      const hints = hintsOf(e);
      expect(hints).toHaveLength(e.steps.length);
      expect(hints[hints.length - 1]!.value).toBe('?');
      expect(hints[hints.length - 1]!.formula).toBe(e.steps[e.steps.length - 1]!.formula);
    });

    it('should draw values in realistic shop ranges', () => {
      for (const seed of SEEDS) {
        const e = generateExercise(type, seed);
        for (const g of e.givens) {
          if (!/^\d/.test(g.value)) continue;
          const v = degreesOf(g.value);
          if (g.unit === 'in') expect(v > 0 && v <= 20).toBe(true);
          if (g.unit === 'mm') expect(v > 0 && v <= 300).toBe(true);
          if (g.unit === '°') expect(v > 0 && v < 90).toBe(true);
        }
      }
    });
  });

  it('should refuse an unknown type', () => {
    expect(() => generateExercise('knurling' as ExerciseType, 1)).toThrow(/unknown exercise type/);
  });
});

describe('fewest gauge blocks', () => {
  it('should match the blocks of the engine\'s own stack and never beat the published minimum', () => {
    // 3.9762 in: Starrett-Webber GB49 builds it from 4 blocks of the 81 set (REFERENCE.md §3.5 G1, published).
    expect(buildExercise('gauge-fewest', { target: '3.9762' }).answer).toBe('4');
    // 2.8260 in: 3 blocks (.126 + .700 + 2.000), REFERENCE.md §3.5 G7 (derived by exhaustive search).
    expect(buildExercise('gauge-fewest', { target: '2.8260' }).answer).toBe('3');
    // 0.2000 in is one block of the .050 series (REFERENCE.md §3.2 and §3.5 G15).
    expect(buildExercise('gauge-fewest', { target: '0.2000' }).answer).toBe('1');
  });
});

describe('published worked examples', () => {
  it('should build the sine-bar stack of 23°41\' on a 5 in bar: 2.0084 in', () => {
    // US Army TC 9-524 App. C "Sine bar or sine plate setting" (REFERENCE.md §2.2 #1, published).
    const e = buildExercise('sine-stack', { unit: 'in', barLength: '5', angle: "23°41'" });
    expect(e.answer).toBe('2.0084');
    expect(checkAnswer(e, '2.0084')).toMatchObject({ correct: true });
    expect(checkAnswer(e, '2.0086')).toMatchObject({ correct: false });
  });

  it('should build the stack of 12° on a 5 in bar: 1.03956 in, to 1.0396', () => {
    // Machinery's Handbook 31st ed. p. 695; Sparber, "The Theory and Practice of Using a Sine Bar" (REFERENCE.md §2.2 #3).
    expect(buildExercise('sine-stack', { unit: 'in', barLength: '5', angle: '12' }).answer).toBe('1.0396');
  });

  it('should find 11.537° from a 1 in stack on a 5 in bar', () => {
    // Sparber, "The Theory and Practice of Using a Sine Bar, v2" (REFERENCE.md §2.2 reverse examples, published).
    const e = buildExercise('sine-angle', { unit: 'in', barLength: '5', stackHeight: '1.0000' });
    expect(checkAnswer(e, '11.537')).toMatchObject({ correct: true });
    expect(checkAnswer(e, "11°32'13\"")).toMatchObject({ correct: true });
    expect(checkAnswer(e, '11.56')).toMatchObject({ correct: false });
  });

  it('should find 31°15\' from a 2.5939 in stack on a 5 in bar', () => {
    // Machinery's Handbook 31st ed. p. 695 (REFERENCE.md §2.2 reverse examples, published).
    expect(checkAnswer(buildExercise('sine-angle', { unit: 'in', barLength: '5', stackHeight: '2.5939' }), "31°15'")).toMatchObject({ correct: true });
  });

  it('should set the compound to 1°11\'37" for 1/2 in per foot', () => {
    // Half angle of 1/2 in/ft: 1.19349° (REFERENCE.md §4.3 check and §4.6 table, derived; forum value 1°11'36" is a cross-check).
    const e = buildExercise('lathe-half-angle', { taperPerFoot: '0.5000' });
    expect(e.answer).toContain("1°11'37\"");
    expect(checkAnswer(e, '1.1935')).toMatchObject({ correct: true });
  });

  it('should set the compound to 1.4321° for a Jarno taper (0.600 in/ft)', () => {
    // Jarno taper 0.600 in/ft (Army OD1645), half angle atan(0.6/24) = 1.43210° (REFERENCE.md §4.4, derived).
    expect(checkAnswer(buildExercise('lathe-half-angle', { taperPerFoot: '0.6000' }), "1°25'56\"")).toMatchObject({ correct: true });
  });

  it('should offset the tail stock 1/2 in for 3 in to 2 in over a 12 in piece', () => {
    // US Navy training manual "Using the Compound Rest" (REFERENCE.md §4.1 tail-stock examples, published).
    const e = buildExercise('lathe-offset', { largeDiameter: '3.000', smallDiameter: '2.000', length: '12.000', workLength: '12.000' });
    expect(e.answer).toBe('0.5000');
  });

  it('should offset 1/3 in for 1.250 to 1.000 over 3 in on an 8 in shaft', () => {
    // sciemce.com question (REFERENCE.md §4.1, secondary: cross-check) — 8 × 0.25 / (2 × 3) = 0.3333 (derived).
    expect(buildExercise('lathe-offset', { largeDiameter: '1.250', smallDiameter: '1.000', length: '3.000', workLength: '8.000' }).answer).toBe('0.3333');
  });

  it('should give the depth to stop and end thickness of the 3 in, 5° taper', () => {
    // L = 3.000, T = 0.750, θ = 5° → h = 0.2615, t = 0.4875 (REFERENCE.md §1 check values, derived).
    const inputs = { unit: 'in' as const, thickness: '0.750', taperLength: '3.000', angle: '5' };
    expect(buildExercise('taper-depth', inputs).answer).toBe('0.2615');
    expect(buildExercise('taper-end-thickness', inputs).answer).toBe('0.4875');
  });

  it('should find 3.5763° for 1.000 tapering to 0.750 over 4 in', () => {
    // REFERENCE.md §1 check values (derived): θ = 3.5763° (3°34'35").
    const e = buildExercise('taper-angle', { unit: 'in', thickness: '1.000', endThickness: '0.750', taperLength: '4.000' });
    expect(checkAnswer(e, "3°34'35\"")).toMatchObject({ correct: true });
  });

  it('should read 3.3660 in over 0.500 in pins on a 2.000 in, 60° dovetail', () => {
    // Machinery's Handbook "Measuring dovetail slides": x = a + D(1 + cot α/2) (REFERENCE.md §5.1 check values, derived).
    expect(buildExercise('dovetail-pins', { unit: 'in', angle: '60', rollDiameter: '0.500', width: '2.000' }).answer).toBe('3.3660');
    expect(buildExercise('dovetail-pins', { unit: 'mm', angle: '60', rollDiameter: '8', width: '50' }).answer).toBe('71.856');
  });
});

describe('readAnswer', () => {
  it('should read decimals, a comma as the decimal mark, and a trailing unit', () => {
    expect(readAnswer('length', '0.2615').ok).toBe(true);
    expect(readAnswer('length', '0,2615')).toMatchObject({ ok: true });
    expect(readAnswer('length', '0.2615 in')).toMatchObject({ ok: true });
    expect(readAnswer('count', '4 blocks')).toMatchObject({ ok: true });
  });

  it('should read angles as decimal degrees or DMS', () => {
    const a = readAnswer('angle', "7°30'");
    expect(a.ok && a.value.toString()).toBe('7.5');
  });

  it('should take a unit only when it is the problem\'s own, and give the number without it', () => {
    expect(readAnswer('length', '0.2993 mm', 'in')).toEqual({ ok: false, error: 'Answer in inches (in), or as a plain number.' });
    expect(readAnswer('length', '0.2993 in', 'mm')).toEqual({ ok: false, error: 'Answer in millimetres (mm), or as a plain number.' });
    expect(readAnswer('length', '21.9048 in', 'mm')).toMatchObject({ ok: false });
    expect(readAnswer('count', '5 mm', 'blocks')).toMatchObject({ ok: false });
    expect(readAnswer('length', '0.2993 in', 'in')).toMatchObject({ ok: true, number: '0.2993' });
    expect(readAnswer('length', '0.2993 inch', 'in')).toMatchObject({ ok: true, number: '0.2993' });
    expect(readAnswer('length', '0.2993"', 'in')).toMatchObject({ ok: true, number: '0.2993' });
    expect(readAnswer('length', '36.161mm', 'mm')).toMatchObject({ ok: true, number: '36.161' });
    expect(readAnswer('count', '5 blocks', 'blocks')).toMatchObject({ ok: true, number: '5' });
    expect(readAnswer('count', '1 block', 'blocks')).toMatchObject({ ok: true, number: '1' });
  });

  it('should read the shop abbreviation with its period ("0.2615 in.") and a typographic minus', () => {
    expect(readAnswer('length', '0.2615 in.', 'in')).toMatchObject({ ok: true, number: '0.2615' });
    expect(readAnswer('length', '6.642 mm.', 'mm')).toMatchObject({ ok: true, number: '6.642' });
    expect(readAnswer('length', '0.2615 mm.', 'in')).toEqual({ ok: false, error: 'Answer in inches (in), or as a plain number.' });
    expect(readAnswer('length', '\u22120.65390', 'in')).toMatchObject({ ok: true, number: '-0.65390' });
  });

  it('should never count an answer in the wrong unit as right, nor spend a try on it', () => {
    const e = generateExercise('sine-stack', SEEDS[3]!);
    const other = e.unit === 'in' ? 'mm' : 'in';
    expect(checkAnswer(e, `${e.exact} ${other}`)).toMatchObject({ ok: false, error: expect.stringContaining(`(${e.unit}), or as a plain number`) });
    expect(checkAnswer(e, `${e.answer} ${e.unit}`)).toMatchObject({ ok: true, correct: true, given: e.answer });
  });

  it('should point out a minus sign or an answer rounded too soon without marking it wrong', () => {
    const e = generateExercise('sine-stack', SEEDS[5]!);
    const places = (e.answer.split('.')[1] ?? '').length;
    expect(places).toBeGreaterThan(2);
    const rounded = Number(e.exact).toFixed(2);
    // The two-decimal figure lies outside the tolerance (3.21 against 3.2084 in): "close", not wrong.
    expect(Math.abs(Number(rounded) - Number(e.exact))).toBeGreaterThan(Number(e.tolerance));
    expect(checkAnswer(e, rounded)).toEqual({ ok: false, error: `Close: that is the answer rounded to 2 decimals. Carry it to ${places} decimals; it is checked to ±${e.tolerance} ${e.unit}.` });
    expect(checkAnswer(e, `-${e.answer}`)).toEqual({ ok: false, error: 'A length is never negative: type it without the minus sign.' });
    // A plainly wrong answer is still wrong.
    expect(checkAnswer(e, String(Number(e.exact) + 1))).toMatchObject({ ok: true, correct: false });
  });

  it('should point out a minus sign on an angle as it does on a length, without spending a try', () => {
    for (const type of ['taper-angle', 'sine-angle', 'lathe-half-angle'] as const) {
      const e = generateExercise(type, SEEDS[4]!);
      const note = { ok: false, error: 'This angle is never negative: type it without the minus sign.' };
      expect(checkAnswer(e, `-${e.exact}`)).toEqual(note);
      expect(checkAnswer(e, `\u2212${Number(e.exact).toFixed(2)}`)).toEqual(note);
      expect(checkAnswer(e, '-35')).toEqual(note);
      // The right angle without the sign is right; a wrong one is still wrong.
      expect(checkAnswer(e, e.exact)).toMatchObject({ ok: true, correct: true });
      expect(checkAnswer(e, String(Number(e.exact) + 1))).toMatchObject({ ok: true, correct: false });
    }
  });

  it('should refuse empty and non-numeric text with a message', () => {
    expect(readAnswer('length', '  ')).toMatchObject({ ok: false, error: expect.stringMatching(/Type/) });
    expect(readAnswer('length', 'about half')).toMatchObject({ ok: false });
    expect(readAnswer('angle', 'steep')).toMatchObject({ ok: false });
  });
});

describe('article (a or an before a number read aloud; common English usage)', () => {
  it.each([['8', 'an'], ['18°', 'an'], ['11.5', 'an'], ['80', 'an'], ['800', 'an'], ['5', 'a'], ['1.5', 'a'], ['110', 'a'], ['0.8', 'a'], ['27°30\'', 'a']])('%s takes "%s"', (text, word) => {
    expect(article(text)).toBe(word);
  });

  it('should never write "a 8" or "a 18" in a prompt', () => {
    for (const type of EXERCISE_TYPES) for (const seed of SEEDS) expect(generateExercise(type, seed).prompt).not.toMatch(/\b[Aa] (8|11\b|18\b)/);
  });
});

describe('worked steps an apprentice checks by hand', () => {
  it('should give the tail-stock offset from the taper per inch only, and both diameters to four places', () => {
    for (const seed of SEEDS.slice(0, 10)) {
      const e = generateExercise('lathe-offset', seed);
      expect(e.steps.map((st) => st.label)).not.toContain('Included angle');
      expect(e.steps.some((st) => st.label.startsWith('Half angle'))).toBe(false);
      expect(e.steps[e.steps.length - 1]!.label).toBe('Tail-stock offset');
      const [D, d] = e.givens.map((g) => g.value);
      expect([D!.split('.')[1]!.length, d!.split('.')[1]!.length]).toEqual([4, 4]);
    }
  });

  it('should not go round in a circle from a given taper per foot', () => {
    const e = generateExercise('lathe-half-angle', SEEDS[2]!);
    expect(e.steps.map((st) => st.formula)).not.toContain('TPF = 12 · k');
  });
});

/**
 * Evaluates a worked step's substitution ("h = 1.5000 · 0.052381 / 1.500914", "d = 25.000 · tan 6°00'00\"",
 * "α = atan(0.5700 / 1.0000)") in double precision, with the numbers exactly as printed: what an
 * apprentice does on a calculator to check the line (derived). Null for a line that is no sum (a count).
 */
function redo(substituted: string): number | null {
  let e = substituted.includes('=') ? substituted.slice(substituted.indexOf('=') + 1) : substituted;
  if (/count of|⌈/.test(e)) return null;
  e = e.replace(/(\d+)°(\d+)'(\d+(?:\.\d+)?)"|(\d+(?:\.\d+)?)°/g, (_m, d, m, sec, plain) => `(${plain ?? num(d) + num(m) / 60 + num(sec) / 3600})`);
  e = e.replace(/·/g, '*').replace(/−/g, '-').replace(/√\(/g, 'Math.sqrt(').replace(/²/g, '**2');
  e = e.replace(/\b(sin|cos|tan) \(([^)]*)\)/g, (_m, f, x) => `Math.${f}((${x})*D)`);
  e = e.replace(/\bcot\(([^)]*\)[^)]*)\)/g, '(1/Math.tan(($1)*D))');
  e = e.replace(/\batan\(/g, '(1/D)*Math.atan(').replace(/\basin\(/g, '(1/D)*Math.asin(');
  if (!/^[\d\s.+\-*/()MathsqrcoinD,]*$/.test(e)) throw new Error(`cannot redo "${substituted}"`);
  return new Function('D', `return ${e};`)(Math.PI / 180) as number;
}

describe('worked solutions checked line by line on a calculator', () => {
  const seeds = Array.from({ length: 300 }, (_, i) => ((i + 1) * 2_246_822_519) >>> 0);

  it.each(EXERCISE_TYPES.map((t) => [t]))('%s: every line, redone from the numbers it shows, gives its printed value', (type) => {
    const off: string[] = [];
    for (const seed of seeds) {
      for (const st of generateExercise(type, seed).steps) {
        const value = redo(st.substituted);
        if (value === null) continue;
        const places = (st.value.split('.')[1] ?? '').length;
        // Within half a unit of the last printed place (a value exactly half way rounds up).
        if (Math.abs(value - num(st.value)) > 0.5 * 10 ** -places + 1e-12) off.push(`${seed}: ${st.substituted} = ${st.value} (calculator ${value})`);
      }
    }
    expect(off).toEqual([]);
  });

  it.each(EXERCISE_TYPES.map((t) => [t]))('%s: the last line gives the answer as it is graded and printed', (type) => {
    for (const seed of seeds.slice(0, 60)) {
      const e = generateExercise(type, seed);
      const last = e.steps[e.steps.length - 1]!;
      expect(e.answer.startsWith(last.value)).toBe(true);
    }
  });

  it('should carry the taper steps before the answer to two more places than the answer', () => {
    // The depth to stop of the report: 50.000 mm at 3°, where a rounded 2.620 / 50.069 gave 2.6164 on a calculator.
    const e = buildExercise('taper-depth', { unit: 'mm', thickness: '20', taperLength: '50', angle: '3' });
    expect(e.answer).toBe('2.617');
    expect(e.steps.map((st) => st.label.split(' (')[0])).toEqual(['Stock removed at the end', 'Face length', 'Depth to stop']);
    for (const st of e.steps.slice(0, -1)) expect(st.value.split('.')[1]!.length).toBeGreaterThanOrEqual(5);
    expect(e.steps[2]!.substituted).toBe(`h = 50.000 · ${e.steps[0]!.value} / ${e.steps[1]!.value}`);
    expect(redo(e.steps[2]!.substituted)!.toFixed(3)).toBe('2.617');
    const t = buildExercise('taper-end-thickness', { unit: 'in', thickness: '1.000', taperLength: '1.500', angle: '10' });
    expect(t.steps.map((st) => st.label)).toEqual(['Stock removed at the end', 'End thickness']);
    expect(t.steps[0]!.value).toMatch(/^0\.\d{6}$/);
  });
});
