/**
 * End-to-end checks of the angle-block, lathe-taper and pins-and-rolls pages in Chromium: typed
 * values (good and bad), results, the drawing and its labels, "Show the work", a saved set-up
 * reopened, screenshots at desktop and tablet width, and no serious accessibility violations.
 */
import type { Browser, Page } from 'playwright-core';

import { DESKTOP, type OpenPage, PHONE, TABLET, describeViolations, launch, openPage, screenshot, seriousA11yViolations, signInByApi } from '../support/browser';

// testTimeout in jest.config.js is a global option and is not applied per project.
jest.setTimeout(60_000);

let browser: Browser;

/** The one request that may answer 401 on these pages: the shell asking who is signed in, for an anonymous visitor. */
const SESSION_CHECK = '/api/auth/me';

beforeAll(async () => {
  browser = await launch();
});

afterAll(async () => {
  await browser.close();
});

/** The text of the result with this label (its number and unit). */
async function result(page: Page, label: string): Promise<string> {
  const item = page.locator('.result').filter({ has: page.locator('.result-label', { hasText: label }) }).first();
  return (await item.locator('.value-text').innerText()).replace(/\s+/g, ' ').trim();
}

/** Types into a field by its label, replacing what was there. */
async function type(page: Page, label: string, text: string): Promise<void> {
  const field = page.getByLabel(label, { exact: true });
  await field.fill(text);
}

/** Waits until the result with this label reads `expected` (the page recomputes after a pause in typing). */
async function expectResult(page: Page, label: string, expected: string): Promise<void> {
  await page.waitForFunction(
    ([l, e]) =>
      Array.from(document.querySelectorAll(".result")).some(
        (r) => r.querySelector('.result-label')?.textContent?.trim() === l && (r.querySelector('.value-text')?.textContent ?? '').replace(/\s+/g, ' ').includes(e),
      ),
    [label, expected] as const,
    { timeout: 5_000 },
  ).catch(async () => {
    throw new Error(`result "${label}" should read ${expected}, got "${await result(page, label).catch(() => 'nothing')}"`);
  });
}

/** Opens a page that also records which requests answered 401. */
async function open(viewport = DESKTOP): Promise<OpenPage & { unauthorized: string[] }> {
  const o = await openPage(browser, viewport);
  const unauthorized: string[] = [];
  o.page.on('response', (r) => {
    if (r.status() === 401) unauthorized.push(new URL(r.url()).pathname);
  });
  return { ...o, unauthorized };
}

/**
 * The page's console errors, less Chromium's "Failed to load resource … 401" lines when every 401
 * came from the anonymous session check (expected: nobody is signed in).
 */
function realProblems(o: OpenPage & { unauthorized: string[] }): string[] {
  const onlySessionCheck = o.unauthorized.every((path) => path === SESSION_CHECK);
  return o.problems.filter((p) => !(onlySessionCheck && /Failed to load resource: .* 401/.test(p)));
}

async function expectCleanPage(o: OpenPage & { unauthorized: string[] }): Promise<void> {
  const violations = await seriousA11yViolations(o.page);
  expect(describeViolations(violations)).toBe('');
  expect(realProblems(o)).toEqual([]);
}

async function shoot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => document.fonts.ready);
  await screenshot(page, name);
}

/**
 * Pairs of labels in a drawing whose boxes overlap, and labels that cover an arrow head of another
 * dimension, as text ("a × b"); empty when everything reads clear.
 */
async function drawingOverlaps(page: Page, svg: string): Promise<string[]> {
  return page.locator(svg).evaluate((root) => {
    const boxes = Array.from(root.querySelectorAll('text'))
      .filter((t) => (t.textContent ?? '').trim())
      .map((t) => ({ name: (t.textContent ?? '').trim(), r: t.getBoundingClientRect() }));
    const hit = (a: DOMRect, b: DOMRect, inset: number) =>
      a.left + inset < b.right && b.left + inset < a.right && a.top + inset < b.bottom && b.top + inset < a.bottom;
    const out: string[] = [];
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) if (hit(boxes[i].r, boxes[j].r, 2)) out.push(`${boxes[i].name} × ${boxes[j].name}`);
    }
    // The angle's own text may not sit on any dimension's arrows (the arc's arrows are its own).
    for (const label of Array.from(root.querySelectorAll('text.angle-text'))) {
      const r = label.getBoundingClientRect();
      for (const a of Array.from(root.querySelectorAll('g[swdimension] path.arrow'))) {
        const ar = a.getBoundingClientRect();
        // An arrow path holds both heads; test each end's 12 px square.
        const ends = [new DOMRect(ar.left, ar.top, 12, 12), new DOMRect(ar.right - 12, ar.bottom - 12, 12, 12)];
        if (ends.some((e) => hit(r, e, 1))) out.push(`${(label.textContent ?? '').trim()} × arrow`);
      }
    }
    return out;
  });
}

/** The message under the field with this label, once it shows. */
async function fieldMessage(page: Page, label: string): Promise<string> {
  const error = page.locator('mat-form-field', { has: page.getByLabel(label, { exact: true }) }).locator('mat-error');
  await error.first().waitFor({ timeout: 5_000 });
  return (await error.first().innerText()).trim();
}

/**
 * Types each value into a field and expects a clear message under it (never NaN, Infinity or a
 * stack trace) and no broken drawing; `ok` values must give results instead.
 */
async function expectSaneInput(page: Page, label: string, bad: readonly string[], ok: readonly string[] = []): Promise<void> {
  for (const text of bad) {
    await type(page, label, text);
    const message = await fieldMessage(page, label).catch(() => {
      throw new Error(`${label} = "${text}" should show a message by the field`);
    });
    expect(message.length).toBeGreaterThan(5);
    expect(message).not.toMatch(/NaN|Infinity|undefined|TypeError|at \w+ \(/);
  }
  for (const text of ok) {
    await type(page, label, text);
    await page.locator('sw-results .result').first().waitFor({ timeout: 5_000 });
  }
  const body = await page.locator('sw-calc-page').innerText();
  expect(body).not.toMatch(/NaN|Infinity/);
}

describe('angle-blocks page', () => {
  let o: Awaited<ReturnType<typeof open>>;
  beforeEach(async () => {
    o = await open();
  });
  afterEach(async () => {
    await o.context.close();
  });

  it('should find the fewest blocks for 17°35′, draw them and show the work', async () => {
    const { page } = o;
    await page.goto('/angle-blocks');
    // REFERENCE.md §6 [DER]: 17°35′ with the 13-piece set by hand is 27 − 9 − 1 and 27′ + 9′ − 1′,
    // six blocks; the exact search must make the angle exactly with no more than that.
    await expectResult(page, 'Angle the blocks make', `17°35'00"`);
    expect(await result(page, 'Error')).toBe('0.00″');
    const count = Number((await result(page, 'Number of blocks')).split(' ')[0]);
    expect(count).toBeLessThanOrEqual(6);
    const svg = page.locator('sw-angle-stack-drawing svg');
    await expect(svg.locator('title').textContent()).resolves.toContain('17°35′');
    expect(await svg.locator('.block').count()).toBe(count);
    expect(await svg.locator('.block.reversed').count()).toBeGreaterThan(0);
    await expect(svg.locator('.block-text').allTextContents()).resolves.toEqual(expect.arrayContaining(['27°']));
    await shoot(page, 'angle-blocks-desktop');
    await page.getByText('Show the work').click();
    await expect(page.locator('.step').first().textContent()).resolves.toContain('Σ added − Σ reversed');
    await expectCleanPage(o);
  });

  it('should say what is wrong with a bad angle and recover', async () => {
    const { page } = o;
    await page.goto('/angle-blocks');
    await expectResult(page, 'Error', '0.00');
    await type(page, 'Wanted angle', '17°75');
    await page.locator('mat-error', { hasText: 'minutes must be below 60' }).waitFor();
    expect(await page.locator('sw-results .result').count()).toBe(0);
    // REFERENCE.md §6 [DER]: 2° = 3° − 1°, two blocks.
    await type(page, 'Wanted angle', '2');
    await expectResult(page, 'Blocks', '3° − 1°');
    await page.waitForURL(/[?&]angle=2(&|$)/);
    expect(realProblems(o)).toEqual([]);
  });

  it('should give a clear message for nonsense angles', async () => {
    const { page } = o;
    await page.goto('/angle-blocks');
    await expectResult(page, 'Error', '0.00');
    // 90° is beyond the 13-piece set (all its blocks make 81°40'57"): refused with that top, not a far "nearest".
    await expectSaneInput(page, 'Wanted angle', ['abc', '-5', '0', '1e400', '361', '', '90'], ['80', '45°30\'']);
    expect(realProblems(o)).toEqual([]);
  });

  it('should lay out at phone width', async () => {
    await o.context.close();
    o = await open(PHONE);
    await o.page.goto('/angle-blocks');
    await expectResult(o.page, 'Error', '0.00');
    await shoot(o.page, 'angle-blocks-phone');
    await expectCleanPage(o);
  });

  it('should total a typed combination with reversed blocks', async () => {
    const { page } = o;
    await page.goto('/angle-blocks');
    await page.getByRole('button', { name: 'Check or change these blocks' }).click();
    await type(page, 'Blocks in the combination', '41° − 27° + 3°');
    // REFERENCE.md §6 [DER]: alternative 17° = 41 − 27 + 3.
    await expectResult(page, 'Angle the blocks make', `17°00'00"`);
    await type(page, 'Blocks in the combination', '41° + 5°');
    await page.locator('mat-error', { hasText: 'is not in the set, or is marked missing or damaged' }).waitFor();
  });

  it('should lay out at tablet width', async () => {
    await o.context.close();
    o = await open(TABLET);
    await o.page.goto('/angle-blocks');
    await expectResult(o.page, 'Error', '0.00');
    await shoot(o.page, 'angle-blocks-tablet');
    await expectCleanPage(o);
  });
});

describe('lathe-tapers page', () => {
  let o: Awaited<ReturnType<typeof open>>;
  beforeEach(async () => {
    o = await open();
  });
  afterEach(async () => {
    await o.context.close();
  });

  it('should give the Morse No. 3 compound setting and draw the work between centres', async () => {
    const { page } = o;
    await page.goto('/lathe-tapers');
    // REFERENCE.md §4.2 (Machinery's Handbook / SCI catalogue): MT3 0.60235 in/ft, half angle 1°26'16".
    await expectResult(page, 'Half angle (compound setting)', `1°26'16"`);
    expect(await result(page, 'Taper per foot')).toBe('0.60235 in/ft');
    const svg = page.locator('sw-lathe-work-drawing svg');
    await expect(svg.locator('title').textContent()).resolves.toContain('compound rest');
    await expect(svg.locator('.dia-text').allTextContents()).resolves.toEqual(['Ø 0.9380 in', 'Ø 0.7780 in']);
    await expect(svg.locator('.dim-text').allTextContents()).resolves.toEqual(expect.arrayContaining(['3.1875 in', 'L 8 in']));
    await shoot(page, 'lathe-tapers-desktop');
    await page.getByText('Show the work').click();
    await expect(page.locator('.step', { hasText: 'Half angle' }).first().textContent()).resolves.toContain('atan(TPF / 24)');
    await expectCleanPage(o);
  });

  it('should give the tail-stock offset for 1 in/ft on a 6 in piece', async () => {
    const { page } = o;
    await page.goto('/lathe-tapers');
    await page.getByLabel('The taper is given as').click();
    await page.getByRole('option', { name: 'Taper per foot' }).click();
    await type(page, 'Taper per foot', '1');
    await type(page, 'Large diameter', '');
    await type(page, 'Small diameter', '');
    await type(page, 'Taper length', '');
    // Diameters along the taper need a diameter: with none given the field says so.
    await page.locator('mat-error', { hasText: 'need the large diameter' }).waitFor();
    await type(page, 'Diameters at (distance from the large end)', '');
    await page.getByRole('radio', { name: 'Tail-stock offset' }).click();
    await type(page, 'Work length between centres', '6');
    // REFERENCE.md §4.1, US Navy training manual "Using the Compound Rest": 1 in/ft on a 6 in piece → 1/4 in.
    await expectResult(page, 'Tail-stock offset', '0.2500 in');
    await expect(page.locator('sw-lathe-work-drawing .dim-text').allTextContents()).resolves.toEqual(expect.arrayContaining(['offset 0.2500 in']));
    await shoot(page, 'lathe-tapers-offset-desktop');
    await type(page, 'Taper per foot', 'steep');
    await page.locator('mat-error', { hasText: 'must be a decimal number' }).waitFor();
    await type(page, 'Work length between centres', '');
    await type(page, 'Taper per foot', '1');
    await page.locator('mat-error', { hasText: 'required for the tail-stock offset' }).waitFor();
    expect(realProblems(o)).toEqual([]);
  });

  it('should keep the half-angle label clear of the small-end arrows at 1280, 768 and 390 px', async () => {
    for (const [viewport, suffix] of [[DESKTOP, 'desktop'], [TABLET, 'tablet'], [PHONE, 'phone']] as const) {
      await o.context.close();
      o = await open(viewport);
      await o.page.goto('/lathe-tapers');
      await expectResult(o.page, 'Taper per foot', '0.60235');
      await expect(o.page.locator('sw-lathe-work-drawing text.angle-text').textContent()).resolves.toContain(`1°26'16"`);
      expect(await drawingOverlaps(o.page, 'sw-lathe-work-drawing svg')).toEqual([]);
      await shoot(o.page, `lathe-tapers-labels-${suffix}`);
    }
  });

  it('should give a clear message for nonsense in every field kind', async () => {
    const { page } = o;
    await page.goto('/lathe-tapers');
    await expectResult(page, 'Taper per foot', '0.60235');
    await expectSaneInput(page, 'Work length between centres', ['abc', '-8', '0', '1e400'], ['8']);
    await page.getByLabel('The taper is given as').click();
    await page.getByRole('option', { name: 'Included angle' }).click();
    // With the angle given, two of the three sizes complete the taper.
    await type(page, 'Small diameter', '');
    await expectSaneInput(page, 'Included angle', ['steep', '-3', '0', '180', ''], ['2.8754']);
    // 90° is a fair angle but no taper 3.1875 long from Ø 0.938: a message, not a drawing of nonsense.
    await type(page, 'Included angle', '90');
    await page.locator('mat-error, sw-warnings .problem').first().waitFor();
    await expect(page.locator('sw-calc-page').innerText()).resolves.not.toMatch(/NaN|Infinity/);
    await type(page, 'Included angle', '2.8754');
    await page.getByLabel('The taper is given as').click();
    await page.getByRole('option', { name: 'Two diameters and the length' }).click();
    await type(page, 'Small diameter', '0.778');
    await expectSaneInput(page, 'Large diameter', ['big', '-1', '0'], ['0.938']);
    expect(realProblems(o)).toEqual([]);
  });

  it('should convert the lengths to millimetres', async () => {
    const { page } = o;
    await page.goto('/lathe-tapers');
    await expectResult(page, 'Tail-stock offset', '0.2008 in');
    await page.getByRole('radio', { name: 'Millimetres' }).click();
    await expect(page.getByLabel('Work length between centres', { exact: true }).inputValue()).resolves.toBe('203.2');
    // 0.0501958… × 203.2 / 2 = 5.100 mm (derived).
    await expectResult(page, 'Tail-stock offset', '5.100 mm');
  });

  it('should lay out at tablet width', async () => {
    await o.context.close();
    o = await open(TABLET);
    await o.page.goto('/lathe-tapers');
    await expectResult(o.page, 'Taper per foot', '0.60235');
    await shoot(o.page, 'lathe-tapers-tablet');
    await expectCleanPage(o);
  });
});

/** Picks what the pins-and-rolls page measures. */
async function chooseKind(page: Page, name: string): Promise<void> {
  await page.getByLabel('What is measured').click();
  await page.getByRole('option', { name }).click();
}

describe('pins-rolls page', () => {
  let o: Awaited<ReturnType<typeof open>>;
  beforeEach(async () => {
    o = await open();
  });
  afterEach(async () => {
    await o.context.close();
  });

  it('should give the reading over 0.375 rolls on the 60° dovetail and draw the measurement line', async () => {
    const { page } = o;
    await page.goto('/pins-rolls');
    // REFERENCE.md §5.1, Machinery's Handbook "Measuring dovetail slides": 60°, D 0.375, a 1.250 → x 2.2745.
    await expectResult(page, 'Reading over the rolls', '2.2745 in');
    const svg = page.locator('sw-roll-drawing svg');
    expect(await svg.locator('circle.roll').count()).toBe(2);
    await expect(svg.locator('.dim-text').allTextContents()).resolves.toEqual(expect.arrayContaining(['stop at x 2.2745 in', 'a 1.2500 in']));
    await shoot(page, 'pins-rolls-desktop');
    await page.getByText('Show the work').click();
    await expect(page.locator('.step').first().textContent()).resolves.toContain('1 + cot(α/2)');
    await expectCleanPage(o);
  });

  it('should read between the rolls of a female dovetail and refuse a bad roll', async () => {
    const { page } = o;
    await page.goto('/pins-rolls');
    await page.getByRole('radio', { name: 'Female (groove)' }).click();
    await type(page, 'Roll diameter D', '0.5');
    await type(page, 'Corner width b', '2.5');
    await type(page, 'Depth h (optional)', '');
    // REFERENCE.md §5.1: 60°, D 0.500, b 2.500 → y 1.1340.
    await expectResult(page, 'Reading between the rolls', '1.1340 in');
    await type(page, 'Roll diameter D', '0');
    await page.locator('mat-error', { hasText: 'Must be greater than 0' }).waitFor();
    expect(realProblems(o)).toEqual([]);
  });

  it('should give a pin’s height in a V-groove', async () => {
    const { page } = o;
    await page.goto('/pins-rolls');
    await chooseKind(page, 'Pin in a V-groove');
    // Derived: 0.25 / sin 45° + 0.25 − 0.5 = 0.1036 (REFERENCE.md §5, plain geometry).
    await expectResult(page, 'Pin top over the surface', '0.1036 in');
    expect(await page.locator('sw-roll-drawing circle.roll').count()).toBe(1);
    await shoot(page, 'pins-rolls-vgroove-desktop');
    await expectCleanPage(o);
  });

  it('should work back from a measured reading to what is left to cut', async () => {
    const { page } = o;
    await page.goto('/pins-rolls');
    await page.getByRole('radio', { name: 'From a measured reading' }).click();
    await type(page, 'Measured over the rolls x', '2.2900');
    // REFERENCE.md §5.1: at a = 1.250 the reading is 2.2745; 2.2900 − 2.2745 = 0.0155 left (derived).
    await expectResult(page, 'Left to cut on the width', '0.0155 in');
    expect(await result(page, 'Corner width a now')).toBe('1.2655 in');
    await expect(page.locator('.stop-value').innerText()).resolves.toBe('2.2745 in');
    await expect(page.locator('.stop-left').innerText()).resolves.toContain('0.0155 in left to cut');
    await expect(page.locator('sw-roll-drawing .dim-text').allTextContents()).resolves.toEqual(expect.arrayContaining(['stop at x 2.2745 in']));
    await shoot(page, 'pins-rolls-check-desktop');
    await page.getByText('Show the work').click();
    await expect(page.locator('.step', { hasText: 'Left to cut on the width' }).textContent()).resolves.toContain('2.2900 − 2.2745');
    await expectCleanPage(o);
  });

  for (const [kind, label, value, shot] of [
    ['Dovetail angle from two roll sizes', 'Corner width a', '1.2500 in', 'pins-rolls-dovetail-angle'],
    ['Taper from readings at two heights', 'Taper per foot', '0.60000 in/ft', 'pins-rolls-two-heights'],
    ['Taper set by two discs', 'Taper per foot', '2.00698 in/ft', 'pins-rolls-discs'],
    ['Internal taper with two balls', 'Taper per foot', '4.05674 in/ft', 'pins-rolls-balls'],
  ] as const) {
    it(`should measure "${kind}" and draw it clear at 1280, 768 and 390 px`, async () => {
      // Check values: dovetail angle from REFERENCE.md §5.1 (derived); two heights 24 × 0.1/(2 × 2) (derived);
      // two discs Machinery's Handbook 31 p. 701; two balls 24/√35 from sin(α/2) = 0.25/1.5 (derived).
      for (const [viewport, suffix] of [[DESKTOP, 'desktop'], [TABLET, 'tablet'], [PHONE, 'phone']] as const) {
        await o.context.close();
        o = await open(viewport);
        const { page } = o;
        await page.goto('/pins-rolls');
        await chooseKind(page, kind);
        await expectResult(page, label, value);
        const svg = page.locator('sw-roll-drawing svg');
        await expect(svg.locator('text.angle-text').textContent()).resolves.toMatch(/^α/);
        expect(await drawingOverlaps(page, 'sw-roll-drawing svg')).toEqual([]);
        await shoot(page, `${shot}-${suffix}`);
        await expectCleanPage(o);
      }
    });
  }

  it('should give a clear message for nonsense in every field kind', async () => {
    const { page } = o;
    await page.goto('/pins-rolls');
    await expectSaneInput(page, 'Dovetail angle α', ['abc', '-30', '0', '90', '1e400', ''], ['45']);
    await expectSaneInput(page, 'Roll diameter D', ['x', '-0.375', '0', '', '99999999999'], ['0.375']);
    await expectSaneInput(page, 'Corner width a', ['one', '-1', ''], ['1.250', '12345678.9']);
    await chooseKind(page, 'Pin in a V-groove');
    await expectSaneInput(page, 'Included angle β', ['abc', '0', '180', '-90', ''], ['90']);
    await chooseKind(page, 'Taper from readings at two heights');
    await expectSaneInput(page, 'Height difference ΔH', ['h', '0', '-2', ''], ['2']);
    // Equal readings are parallel sides (0°), so only unreadable or non-positive readings are refused.
    await expectSaneInput(page, 'Upper reading M₂', ['abc', '-1.15', '0', ''], ['1.2500', '1.15']);
    await chooseKind(page, 'Internal taper with two balls');
    await expectSaneInput(page, 'Its top below the face h₂', ['deep', '0.1'], ['2']);
    expect(realProblems(o)).toEqual([]);
  });

  it('should lay out at phone width', async () => {
    await o.context.close();
    o = await open(PHONE);
    await o.page.goto('/pins-rolls');
    await expectResult(o.page, 'Reading over the rolls', '2.2745');
    expect(await drawingOverlaps(o.page, 'sw-roll-drawing svg')).toEqual([]);
    await shoot(o.page, 'pins-rolls-phone');
    await expectCleanPage(o);
  });

  it('should lay out at tablet width', async () => {
    await o.context.close();
    o = await open(TABLET);
    await o.page.goto('/pins-rolls');
    await expectResult(o.page, 'Reading over the rolls', '2.2745');
    await shoot(o.page, 'pins-rolls-tablet');
    await expectCleanPage(o);
  });
});

describe('saved set-ups', () => {
  it('should save a pins set-up signed in and reopen it from its link', async () => {
    const o = await open();
    try {
      const { page, context } = o;
      await signInByApi(context, 'machinist@demo.test');
      await page.goto('/pins-rolls');
      await type(page, 'Corner width a', '2.000');
      // REFERENCE.md §5.1: 60°, D 0.375… with a 2.000: 2 + 0.375 × 2.7320508 = 3.0245 (derived).
      await expectResult(page, 'Reading over the rolls', '3.0245 in');
      await page.getByRole('button', { name: 'Save as set-up' }).click();
      await page.getByLabel('Set-up name').fill('Slide dovetail, batch 12');
      await page.getByRole('button', { name: 'Save set-up' }).click();
      await page.getByRole('button', { name: 'Open' }).click();
      await page.waitForURL(/setup=\d+/);
      const id = new URL(page.url()).searchParams.get('setup');

      const again = await context.newPage();
      await again.goto(`/pins-rolls?setup=${id}`);
      await again.getByText('Set-up “Slide dovetail, batch 12”').waitFor();
      await expect(again.getByLabel('Corner width a', { exact: true }).inputValue()).resolves.toBe('2.000');
      await expectResult(again, 'Reading over the rolls', '3.0245 in');

      await again.goto(`/angle-blocks?setup=${id}`);
      await again.getByText('belongs to another area').waitFor();
      expect(realProblems(o)).toEqual([]);
    } finally {
      await o.context.close();
    }
  });

  it('should show a two-height taper saved from the page with the page\'s answer in the library', async () => {
    const o = await open();
    try {
      const { page, context } = o;
      await signInByApi(context, 'machinist@demo.test');
      await page.goto('/pins-rolls');
      await chooseKind(page, 'Taper from readings at two heights');
      // Two heights: TPF = 24 · (M1 − M2)/(2 ΔH) = 24 × 0.1/(2 × 2) = 0.6 in/ft (derived from REFERENCE.md §5.2).
      await expectResult(page, 'Taper per foot', '0.60000 in/ft');
      await page.getByRole('button', { name: 'Save as set-up' }).click();
      await page.getByLabel('Set-up name').fill('Arbor taper, two heights');
      await page.getByRole('button', { name: 'Save set-up' }).click();
      await page.getByRole('button', { name: 'Open' }).click();
      await page.waitForURL(/setup=\d+/);
      const id = new URL(page.url()).searchParams.get('setup');

      await page.goto(`/library/${id}`);
      const results = page.locator('dl.results');
      await results.getByText('0.60000 in/ft').waitFor();
      await expect(results.textContent()).resolves.toContain('Half angle (DMS)');
      // The inputs are the two readings and their height difference, not every field of the form.
      const inputs = page.locator('section[aria-labelledby="inputs-h"] dl');
      await expect(inputs.textContent()).resolves.toContain('Height difference');
      await expect(inputs.textContent()).resolves.not.toMatch(/lowerReading|Lower reading/);
      expect(realProblems(o)).toEqual([]);
    } finally {
      await o.context.close();
    }
  });
});
