/**
 * End-to-end helpers: Debian's Chromium driven by playwright-core against the app that
 * scripts/run-tests.ts serves (E2E_BASE_URL), with an axe-core accessibility check.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

export const BASE_URL = process.env['E2E_BASE_URL'] ?? 'http://127.0.0.1:4300';
export const DEMO_PASSWORD = process.env['DEMO_PASSWORD'] ?? 'kestrel-demo-2026';
export const ARTIFACTS = path.join(process.env['TEST_ARTIFACTS'] ?? 'test-artifacts', 'screens');

export const DESKTOP = { width: 1280, height: 900 };
export const TABLET = { width: 768, height: 1024 };
export const PHONE = { width: 390, height: 844 };

export function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'],
  });
}

export interface OpenPage {
  readonly context: BrowserContext;
  readonly page: Page;
  /** Console errors and failed requests seen so far (a page must have none). */
  readonly problems: string[];
}

/** A fresh context and page that records console errors, page errors and 5xx answers. */
export async function openPage(browser: Browser, viewport = DESKTOP): Promise<OpenPage> {
  const context = await browser.newContext({ viewport, baseURL: BASE_URL, acceptDownloads: true });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') problems.push(`console: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('response', (r) => {
    if (r.status() >= 500) problems.push(`HTTP ${r.status()} ${r.url()}`);
  });
  return { context, page, problems };
}

/** Signs in through the sign-in page, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** Signs in through the API only (faster, for tests whose subject is another page). */
export async function signInByApi(context: BrowserContext, email: string, password = DEMO_PASSWORD): Promise<void> {
  const csrf = (await (await context.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await context.request.post('/api/auth/login', { data: { email, password }, headers: { 'X-CSRF-Token': csrf.token } });
  if (res.status() !== 200) throw new Error(`sign-in as ${email} failed: ${res.status()}`);
}

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: Array<{ target: string[] }>;
}

const axeSource = fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** Runs axe-core in the page; returns the serious and critical violations. */
export async function seriousA11yViolations(page: Page): Promise<AxeViolation[]> {
  // Let entering messages finish fading in first: axe measures contrast on what is painted now.
  await page
    .waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'), undefined, { timeout: 3_000 })
    .catch(() => undefined);
  await page.evaluate(axeSource);
  const result = (await page.evaluate(`axe.run(document, { resultTypes: ['violations'] })`)) as { violations: AxeViolation[] };
  return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

/** A readable summary for a failed expectation. */
export function describeViolations(violations: AxeViolation[]): string {
  return violations.map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`).join('\n');
}
