/**
 * End-to-end checks of the angle-block, lathe-taper and pins-and-rolls pages in Chromium: typed
 * values (good and bad), results, the drawing and its labels, "Show the work", a saved set-up
 * reopened, screenshots at desktop and tablet width, and no serious accessibility violations.
 */
import type { Browser, Page } from 'playwright-core';

import { DESKTOP, type OpenPage, TABLET, describeViolations, launch, openPage, screenshot, seriousA11yViolations, signInByApi } from '../support/browser';

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
    expect(await result(page, 'Error')).toBe('0.00 ″');
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

  it('should total a typed combination with reversed blocks', async () => {
    const { page } = o;
    await page.goto('/angle-blocks');
    await page.getByRole('button', { name: 'Check or change these blocks' }).click();
    await type(page, 'Blocks in the combination', '41° − 27° + 3°');
    // REFERENCE.md §6 [DER]: alternative 17° = 41 − 27 + 3.
    await expectResult(page, 'Angle the blocks make', `17°00'00"`);
    await type(page, 'Blocks in the combination', '41° + 5°');
    await page.locator('mat-error', { hasText: 'not (or no longer) in the set' }).waitFor();
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
    await expect(svg.locator('.dim-text').allTextContents()).resolves.toEqual(expect.arrayContaining(['x 2.2745 in', 'a 1.2500 in']));
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
    await page.getByRole('radio', { name: 'V-groove' }).click();
    // Derived: 0.25 / sin 45° + 0.25 − 0.5 = 0.1036 (REFERENCE.md §5, plain geometry).
    await expectResult(page, 'Pin top over the surface', '0.1036 in');
    expect(await page.locator('sw-roll-drawing circle.roll').count()).toBe(1);
    await shoot(page, 'pins-rolls-vgroove-desktop');
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
});
