/**
 * Script injection through stored text, in the browser: set-ups whose name, notes and job are
 * markup are listed in the library and opened on their detail page. Nothing runs (window.__xss
 * stays undefined, no dialog opens, no element is injected) and the text is shown literally.
 */
import type { Browser, BrowserContext } from 'playwright-core';

import { DESKTOP, launch, openPage, signInByApi, type OpenPage } from '../support/browser';

jest.setTimeout(120_000);

const TAG = `xss${Date.now().toString(36)}`;
const NAMES = [`<img src=x onerror="window.__xss=1"> ${TAG}`, `<script>window.__xss=1</script> ${TAG}`];
const NOTES = '<svg/onload="window.__xss=1"><b>bold?</b>';
const JOB = '"><img src=y onerror=window.__xss=1>';

let browser: Browser;
let lead: OpenPage;
const ids: number[] = [];
const dialogs: string[] = [];

async function csrf(context: BrowserContext): Promise<string> {
  return ((await (await context.request.get('/api/auth/csrf')).json()) as { token: string }).token;
}

beforeAll(async () => {
  browser = await launch();
  lead = await openPage(browser, DESKTOP);
  await signInByApi(lead.context, 'lead@demo.test');
  lead.page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  const token = await csrf(lead.context);
  for (const name of NAMES) {
    const res = await lead.context.request.post('/api/setups', {
      headers: { 'X-CSRF-Token': token },
      data: { name, kind: 'taper', job: JOB, notes: NOTES, inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' } },
    });
    expect(res.status()).toBe(201);
    ids.push(((await res.json()) as { id: number }).id);
  }
});

afterAll(async () => {
  await browser?.close();
});

async function nothingRan(): Promise<void> {
  const page = lead.page;
  expect(await page.evaluate(() => (window as unknown as { __xss?: unknown }).__xss)).toBeUndefined();
  expect(await page.locator('img[src="x"], img[src="y"], svg[onload], script:not([src])').count()).toBe(0);
  expect(dialogs).toEqual([]);
}

describe('stored markup in the browser', () => {
  it('lists both set-ups in the library with their names as literal text', async () => {
    const page = lead.page;
    await page.goto('/library');
    await page.getByLabel('Search name, job or notes').fill(TAG);
    for (const name of NAMES) await page.getByRole('link', { name }).waitFor();
    await page.waitForTimeout(300);
    await nothingRan();
  });

  it.each([0, 1])('shows set-up %i on its detail page literally, running nothing', async (i) => {
    const page = lead.page;
    await page.goto(`/library/${ids[i]}`);
    await page.getByRole('heading', { name: NAMES[i] }).waitFor();
    expect(await page.getByRole('heading', { name: NAMES[i] }).textContent()).toContain(NAMES[i]);
    await page.getByText(NOTES).first().waitFor();
    expect(await page.locator('body').innerText()).toContain(JOB);
    await page.waitForTimeout(300);
    await nothingRan();
  });
});
