/**
 * End-to-end checks of the taper planner, sine bar & plate and gauge-block pages in Chromium:
 * values typed (good and bad), results, the drawing and its labels, "Show the work", a set-up
 * saved and reopened while signed in, screenshots at desktop and tablet width, and no serious
 * accessibility violations or console errors.
 */
import type { Browser, Page } from 'playwright-core';

import { DESKTOP, type OpenPage, PHONE, TABLET, describeViolations, launch, openPage, screenshot, seriousA11yViolations, signInByApi } from '../support/browser';

// testTimeout in jest.config.js is a global option and is not applied per project.
jest.setTimeout(90_000);

let browser: Browser;

beforeAll(async () => {
  browser = await launch();
});

afterAll(async () => {
  await browser.close();
});

/**
 * Problems other than the anonymous session check: the shell asks GET /api/auth/me once, which
 * answers 401 for a visitor and Chromium logs that as a failed resource.
 */
function realProblems(o: OpenPage): string[] {
  return o.problems.filter((p) => !/status of 401/.test(p));
}

/** The number shown for the result with this label. */
async function result(page: Page, label: string): Promise<string> {
  const item = page.locator('.result').filter({ has: page.locator('.result-label', { hasText: new RegExp(`^${label}$`) }) }).first();
  return (await item.locator('.number').innerText()).trim();
}

/** Waits until the result with this label reads `expected` (the page recomputes after a pause in typing). */
async function expectResult(page: Page, label: string, expected: string): Promise<void> {
  await page
    .waitForFunction(
      ([l, e]) =>
        Array.from(document.querySelectorAll('.result')).some(
          (r) => r.querySelector('.result-label')?.textContent?.trim() === l && r.querySelector('.number')?.textContent?.trim() === e,
        ),
      [label, expected] as const,
      { timeout: 5_000 },
    )
    .catch(async () => {
      throw new Error(`result "${label}" should read ${expected}, got "${await result(page, label).catch(() => 'nothing')}"`);
    });
}

/** Waits until a field message containing `text` shows. */
async function expectFieldMessage(page: Page, text: string): Promise<void> {
  await page.locator('mat-error', { hasText: text }).first().waitFor({ timeout: 5_000 });
}

/** Opens "Show the work" and returns the step labels. */
async function openDerivation(page: Page): Promise<string[]> {
  await page.getByRole('button', { name: /Show the work/ }).click();
  await page.locator('.step-label').first().waitFor();
  return page.locator('.step-label').allInnerTexts();
}

/**
 * A screenshot of the whole page: the shell scrolls inside its content pane, so the window is
 * made as tall as that pane's content first, then put back.
 */
async function fullScreenshot(page: Page, name: string): Promise<string> {
  const size = page.viewportSize() ?? DESKTOP;
  const content = await page.evaluate(() => document.querySelector('.mat-sidenav-content')?.scrollHeight ?? 0);
  await page.setViewportSize({ width: size.width, height: Math.max(size.height, content + 64) });
  const file = await screenshot(page, name);
  await page.setViewportSize(size);
  return file;
}

/** Fails with the list when axe finds serious or critical violations. */
async function expectAccessible(page: Page): Promise<void> {
  const violations = await seriousA11yViolations(page);
  expect(describeViolations(violations)).toBe('');
}

/** The drawing's title and every text label in it. */
async function drawingTexts(page: Page): Promise<{ title: string; texts: string[] }> {
  const svg = page.locator('svg[role="img"]').first();
  await svg.waitFor();
  return { title: await svg.locator('title').textContent() ?? '', texts: await svg.locator('text').allTextContents() };
}

describe('taper planner', () => {
  it('should plan the demo wedge, react to typing and bad input, and show its work', async () => {
    const o = await openPage(browser, DESKTOP);
    const { page } = o;
    await page.goto('/taper');
    await page.getByRole('heading', { level: 1, name: 'Taper planner' }).waitFor();
    // Fixture wedge: 7°30' over 2.5 in of 0.75 in stock (derived, four-figure trig):
    // h = 2.5 · sin 7.5° = 0.3263, t = 0.75 − 2.5 · tan 7.5° = 0.4209, F = 2.5 / cos 7.5° = 2.5216.
    await expectResult(page, 'Depth to stop', '0.3263');
    await expectResult(page, 'End thickness', '0.4209');
    await expectResult(page, 'Face length', '2.5216');
    const drawing = await drawingTexts(page);
    expect(drawing.title).toBe('Taper set-up drawing');
    expect(drawing.texts).toEqual(expect.arrayContaining(['0.3263 in', '2.5216 in', '0.4209 in', 'Touch off', 'angle block']));

    // Step through the passes: 0.1 in a pass → readings 0.1000, 0.2000, 0.3000, 0.3263.
    await page.getByRole('button', { name: 'Next pass' }).click();
    await page.getByRole('button', { name: 'Next pass' }).click();
    await page.locator('.pass-status', { hasText: 'DRO reads 0.2000 in' }).waitFor();
    expect(await page.locator('svg text', { hasText: 'Pass 2' }).count()).toBe(1);

    await fullScreenshot(page, 'taper-desktop');
    await expectAccessible(page);

    await page.getByLabel('Angle', { exact: true }).fill('7°75\'');
    await expectFieldMessage(page, 'Minutes must be below 60');
    await page.locator('.no-drawing').waitFor();
    await page.getByLabel('Angle', { exact: true }).fill('10');
    // 2.5 · sin 10° = 0.43412 (derived).
    await expectResult(page, 'Depth to stop', '0.4341');
    await page.waitForURL(/angle=10/);

    await page.getByLabel('Taper length', { exact: true }).fill('6');
    await expectFieldMessage(page, 'runs out through the bottom face');
    await page.getByLabel('Taper length', { exact: true }).fill('2.5');
    await expectResult(page, 'Depth to stop', '0.4341');

    const steps = await openDerivation(page);
    expect(steps).toEqual(expect.arrayContaining(['Stock removed at the end', 'End thickness', 'Depth to stop (from the highest corner, face horizontal)']));
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });

  it('should reflow at tablet width with the drawing above the form', async () => {
    const o = await openPage(browser, TABLET);
    await o.page.goto('/taper?unit=mm&thickness=19.05&angle=7.5&taperLength=63.5&depthPerPass=2.5&cutterDiameter=19.05&fluteLength=25.4&partLength=101.6');
    // 63.5 · sin 7.5° = 8.2884 mm (derived).
    await expectResult(o.page, 'Depth to stop', '8.288');
    const drawingBox = await o.page.locator('sw-taper-drawing').boundingBox();
    const formBox = await o.page.locator('form[aria-label="Taper inputs"]').boundingBox();
    expect(drawingBox && formBox && drawingBox.y < formBox.y).toBe(true);
    await fullScreenshot(o.page, 'taper-tablet');
    await expectAccessible(o.page);
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });
  it('should show the taper page on a phone, drawing first', async () => {
    const o = await openPage(browser, PHONE);
    await o.page.goto('/taper');
    await expectResult(o.page, 'Depth to stop', '0.3263');
    const width = await o.page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    await fullScreenshot(o.page, 'taper-phone');
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });
});

describe('sine bar & plate', () => {
  it('should give the demo sine-plate stack with its blocks and take a stack back to an angle', async () => {
    const o = await openPage(browser, DESKTOP);
    const { page } = o;
    await page.goto('/sine-bar');
    // 5 · sin 14.5° = 1.2519 in (REFERENCE.md §2 formula, derived).
    await expectResult(page, 'Stack height', '1.2519');
    const blocks = (await result(page, 'Blocks')).split(' + ');
    expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
    const drawing = await drawingTexts(page);
    expect(drawing.title).toBe('Sine bar set-up drawing');
    expect(drawing.texts).toEqual(expect.arrayContaining([...blocks, 'L 5.0000 in', 'H 1.2519 in']));
    await fullScreenshot(page, 'sine-bar-desktop');
    await expectAccessible(page);

    await page.getByLabel('Angle', { exact: true }).fill('abc');
    await expectFieldMessage(page, 'is not an angle');
    await page.getByLabel('Angle', { exact: true }).fill('60');
    await page.getByRole('heading', { name: /Complement set-up/ }).waitFor();
    await fullScreenshot(page, 'sine-bar-complement-desktop');

    await page.getByRole('radio', { name: 'Angle from a stack' }).click().catch(() => page.getByText('Angle from a stack').click());
    await page.getByLabel('Stack height', { exact: true }).fill('2.5');
    // asin(2.5 / 5) = 30° (derived).
    await expectResult(page, 'Angle', '30°00\'00"');
    const steps = await openDerivation(page);
    expect(steps).toEqual(expect.arrayContaining(['Angle', 'Sensitivity']));
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });

  it('should fit a tablet screen', async () => {
    const o = await openPage(browser, TABLET);
    await o.page.goto('/sine-bar');
    await expectResult(o.page, 'Stack height', '1.2519');
    await fullScreenshot(o.page, 'sine-bar-tablet');
    await expectAccessible(o.page);
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });
});

describe('gauge blocks', () => {
  it('should build the stack, leave out a missing block and name a block not in the box', async () => {
    const o = await openPage(browser, DESKTOP);
    const { page } = o;
    await page.goto('/gauge-blocks');
    await page.getByRole('heading', { level: 1, name: 'Gauge blocks' }).waitFor();
    await page.locator('.result').first().waitFor();
    const fewest = (await result(page, 'Fewest blocks')).split(' + ');
    expect(fewest.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(12_519);
    const lastDigit = (await result(page, 'Last-digit method')).split(' + ');
    expect(fewest.length).toBeLessThanOrEqual(lastDigit.length);
    const drawing = await drawingTexts(page);
    expect(drawing.title).toBe('Gauge-block stacks drawing');
    expect(drawing.texts).toEqual(expect.arrayContaining([`Fewest: ${fewest.length} blocks`, ...fewest, '1.2519 in']));
    await fullScreenshot(page, 'gauge-blocks-desktop');
    await expectAccessible(page);

    await page.getByLabel('Blocks missing or damaged', { exact: true }).fill('0.7777');
    await expectFieldMessage(page, 'There is no 0.7777 block left in the box');
    await page.getByLabel('Blocks missing or damaged', { exact: true }).fill(fewest[0]);
    await page.waitForFunction(
      (gone) => !(document.querySelector('.result .number')?.textContent ?? '').split(' + ').includes(gone) && !!document.querySelector('.result'),
      fewest[0],
    );
    const steps = await openDerivation(page);
    expect(steps.length).toBeGreaterThan(0);
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });

  it('should fit a tablet screen', async () => {
    const o = await openPage(browser, TABLET);
    await o.page.goto('/gauge-blocks?temperature=23');
    await o.page.locator('.result').first().waitFor();
    await fullScreenshot(o.page, 'gauge-blocks-tablet');
    await expectAccessible(o.page);
    expect(realProblems(o)).toEqual([]);
    await o.context.close();
  });
});

describe('saved set-ups', () => {
  it('should save a taper set-up when signed in and open it again', async () => {
    const o = await openPage(browser, DESKTOP);
    const { page, context } = o;
    await signInByApi(context, 'machinist@demo.test');
    await page.goto('/taper?angle=12&taperLength=2');
    // 2 · sin 12° = 0.41582 (derived).
    await expectResult(page, 'Depth to stop', '0.4158');
    await page.getByRole('button', { name: 'Save as set-up' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Set-up name').fill('Wedge 12 degree trial');
    await dialog.getByLabel('Job (optional)').fill('KL-204');
    await dialog.getByRole('button', { name: 'Save set-up' }).click();
    await page.getByText('Saved set-up “Wedge 12 degree trial”').waitFor();
    await page.getByRole('button', { name: 'Open' }).click();
    await page.waitForURL(/setup=\d+/);
    const id = new URL(page.url()).searchParams.get('setup');

    // A fresh page with only ?setup= loads the saved inputs.
    const again = await openPage(browser, DESKTOP);
    await signInByApi(again.context, 'machinist@demo.test');
    await again.page.goto(`/taper?setup=${id}`);
    await again.page.getByText('Set-up “Wedge 12 degree trial”').waitFor();
    await expectResult(again.page, 'Depth to stop', '0.4158');
    expect(await again.page.getByLabel('Angle', { exact: true }).inputValue()).toBe('12');
    expect(realProblems(o)).toEqual([]);
    expect(realProblems(again)).toEqual([]);
    await again.context.close();
    await context.close();
  });

  it('should not offer saving to a visitor who is not signed in', async () => {
    const o = await openPage(browser, DESKTOP);
    await o.page.goto('/sine-bar');
    await expectResult(o.page, 'Stack height', '1.2519');
    expect(await o.page.getByRole('button', { name: 'Save as set-up' }).count()).toBe(0);
    await o.context.close();
  });
});
