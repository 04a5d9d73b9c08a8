/**
 * Front-end measurements in Chromium, written to docs/frontend-performance.md:
 * - recompute + redraw after a keystroke on every workbench page: from the moment the page starts
 *   recomputing (the `sw-recompute-start` mark that liveCalc sets after the 100 ms typing pause)
 *   to the DOM holding the new results and drawing, and to the next animation frame; plus the
 *   engine's own share (the `sw-recompute` measure) and any long tasks (> 50 ms);
 * - the JavaScript each route costs: what the first load of the home page fetches (initial) and
 *   what navigating to each area fetches on top (its lazy chunks), from the Resource Timing API.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';

import { DESKTOP, launch, openPage } from '../support/browser';

jest.setTimeout(180_000);

/** One frame at 60 Hz: the target for recompute + redraw. */
const FRAME_MS = 16;
/** Keystrokes measured per page. */
const KEYSTROKES = 16;
const DOC = path.join(__dirname, '..', '..', 'docs', 'frontend-performance.md');

/** A page, the field typed into, and the value typed before the measured keystrokes. */
interface Target {
  readonly route: string;
  readonly name: string;
  readonly control: string;
  readonly base: string;
}

// Each keystroke appends "1" to the base value or deletes it again, so every one changes the answer.
const TARGETS: readonly Target[] = [
  { route: '/taper', name: 'Taper planner', control: 'taperLength', base: '2.5' },
  { route: '/sine-bar', name: 'Sine bar & plate', control: 'angle', base: "14°30'" },
  { route: '/gauge-blocks', name: 'Gauge blocks', control: 'target', base: '2.453' },
  { route: '/angle-blocks', name: 'Angle blocks', control: 'angle', base: "17°35'" },
  { route: '/lathe-tapers', name: 'Lathe tapers', control: 'workLength', base: '8.2' },
  { route: '/pins-rolls', name: 'Pins & rolls', control: 'width', base: '1.25' },
];

interface Sample {
  /** Engine and field messages only (the `sw-recompute` measure), ms. */
  readonly engine: number;
  /** Recompute start → the DOM updated (results and drawing), ms. */
  readonly update: number;
  /** Recompute start → the next animation frame after the update, ms. */
  readonly frame: number;
}

interface PageFigures {
  readonly target: Target;
  readonly samples: Sample[];
  readonly longTasks: number;
}

let browser: Browser;
const figures: PageFigures[] = [];
const bundles: { initial?: { files: number; transfer: number; raw: number }; routes: { route: string; files: number; transfer: number; raw: number }[] } = { routes: [] };

beforeAll(async () => {
  browser = await launch();
});

afterAll(async () => {
  await browser.close();
  if (figures.length === TARGETS.length && bundles.initial) writeReport();
});

/** Installs the observers that time each recompute to its DOM update and next frame. */
async function instrument(page: Page): Promise<void> {
  await page.evaluate(() => {
    const state = { samples: [] as { engine: number; update: number; frame: number }[], longTasks: 0, seen: new Set<number>() };
    // Recomputes from before the observers were installed (loading, the base value) are not measured.
    const since = performance.now();
    (window as unknown as { __swPerf: typeof state }).__swPerf = state;
    new PerformanceObserver((list) => {
      state.longTasks += list.getEntries().length;
    }).observe({ type: 'longtask', buffered: false });
    const root = document.querySelector('sw-calc-page');
    if (!root) throw new Error('perf: no sw-calc-page on this page');
    new MutationObserver(() => {
      const marks = performance.getEntriesByName('sw-recompute-start', 'mark');
      const last = marks[marks.length - 1];
      if (!last || last.startTime < since || state.seen.has(last.startTime)) return;
      state.seen.add(last.startTime);
      const updated = performance.now();
      const measures = performance.getEntriesByName('sw-recompute', 'measure');
      const engine = measures.length ? measures[measures.length - 1].duration : NaN;
      requestAnimationFrame(() => {
        state.samples.push({ engine, update: updated - last.startTime, frame: performance.now() - last.startTime });
      });
    }).observe(root, { attributes: true, childList: true, subtree: true, characterData: true });
  });
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

const ms = (x: number): string => x.toFixed(1);
const kb = (bytes: number): string => (bytes / 1000).toFixed(1);

describe('recompute + redraw after a keystroke', () => {
  for (const target of TARGETS) {
    it(`should update ${target.route} within one frame of the recompute starting`, async () => {
      const o = await openPage(browser, DESKTOP);
      try {
        const { page } = o;
        await page.goto(target.route);
        const field = page.locator(`input[formcontrolname="${target.control}"]`);
        await field.fill(target.base);
        await page.locator('.calc-drawing svg[role="img"]').first().waitFor();
        await page.waitForTimeout(400);
        await instrument(page);
        await field.focus();
        await page.keyboard.press('End');
        for (let i = 0; i < KEYSTROKES; i++) {
          await page.keyboard.press(i % 2 === 0 ? '1' : 'Backspace');
          // Longer than the 100 ms typing pause, so each keystroke gets its own recompute.
          await page.waitForTimeout(250);
        }
        const state = (await page.evaluate(() => {
          const s = (window as unknown as { __swPerf: { samples: Sample[]; longTasks: number } }).__swPerf;
          return { samples: s.samples, longTasks: s.longTasks };
        })) as { samples: Sample[]; longTasks: number };
        figures.push({ target, ...state });
        const updates = state.samples.map((s) => s.update);
        console.log(
          `${target.route}: ${state.samples.length} updates, recompute+DOM median ${ms(percentile(updates, 50))} ms, ` +
            `p95 ${ms(percentile(updates, 95))} ms, engine median ${ms(percentile(state.samples.map((s) => s.engine), 50))} ms, ` +
            `to next frame median ${ms(percentile(state.samples.map((s) => s.frame), 50))} ms, long tasks ${state.longTasks}`,
        );
        expect(state.samples.length).toBeGreaterThanOrEqual(KEYSTROKES - 2);
        expect(percentile(updates, 50)).toBeLessThan(FRAME_MS);
      } finally {
        await o.context.close();
      }
    });
  }
});

describe('JavaScript per route', () => {
  it('should load the home page within the initial budget and each area as its own lazy chunks', async () => {
    const o = await openPage(browser, DESKTOP);
    try {
      const { page } = o;
      await page.goto('/', { waitUntil: 'networkidle' });
      const scripts = async (): Promise<{ name: string; transfer: number; raw: number }[]> =>
        page.evaluate(() =>
          (performance.getEntriesByType('resource') as PerformanceResourceTiming[])
            .filter((e) => /\.js(\?|$)/.test(e.name))
            .map((e) => ({ name: e.name, transfer: e.encodedBodySize, raw: e.decodedBodySize })),
        );
      const initial = await scripts();
      const sum = (list: { transfer: number; raw: number }[]) => ({
        files: list.length,
        transfer: list.reduce((a, e) => a + e.transfer, 0),
        raw: list.reduce((a, e) => a + e.raw, 0),
      });
      bundles.initial = sum(initial);
      let known = new Set(initial.map((e) => e.name));
      for (const target of TARGETS) {
        // Client-side navigation through the shell's link, as a person would.
        await page.locator(`a[href="${target.route}"]`).first().click();
        await page.locator('.calc-drawing svg[role="img"]').first().waitFor();
        await page.waitForLoadState('networkidle');
        const now = await scripts();
        const added = now.filter((e) => !known.has(e.name));
        known = new Set(now.map((e) => e.name));
        bundles.routes.push({ route: target.route, ...sum(added) });
      }
      console.log(`initial JS: ${bundles.initial.files} files, ${kb(bundles.initial.raw)} kB raw, ${kb(bundles.initial.transfer)} kB transferred`);
      for (const r of bundles.routes) console.log(`${r.route}: +${r.files} files, ${kb(r.raw)} kB raw, ${kb(r.transfer)} kB transferred`);
      // angular.json's initial budget errors at 650 kB raw; the browser must agree with the build.
      expect(bundles.initial.raw).toBeLessThan(650_000);
      // Areas are lazy: the first area visited fetches its own chunks (and the shared engine).
      expect(bundles.routes[0].files).toBeGreaterThan(0);
    } finally {
      await o.context.close();
    }
  });
});

/** Writes the measured figures to docs/frontend-performance.md. */
function writeReport(): void {
  const rows = figures.map((f) => {
    const u = f.samples.map((s) => s.update);
    const e = f.samples.map((s) => s.engine);
    const fr = f.samples.map((s) => s.frame);
    return `| ${f.target.name} (\`${f.target.route}\`, field \`${f.target.control}\`) | ${f.samples.length} | ${ms(percentile(e, 50))} | ${ms(percentile(u, 50))} | ${ms(percentile(u, 95))} | ${ms(Math.max(...u))} | ${ms(percentile(fr, 50))} | ${f.longTasks} |`;
  });
  const initial = bundles.initial!;
  const routeRows = bundles.routes.map((r) => `| \`${r.route}\` | ${r.files} | ${kb(r.raw)} | ${kb(r.transfer)} |`);
  const text = `# Front-end performance

Measured by \`tests/e2e/perf.e2e.ts\` in headless Chromium (Debian's chromium, playwright-core) against
the production build served by \`scripts/run-tests.ts\`, on the project's 2-core machine shared with
other work. Run it with:

\`\`\`sh
npx ng build
PATH=$PATH:/usr/sbin TEST_QUICK=1 node --import tsx scripts/run-tests.ts --selectProjects e2e -- tests/e2e/perf
\`\`\`

Last run: ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC. The test rewrites this file each time it passes.

## Recompute + redraw after a keystroke

Each page gets ${KEYSTROKES} real keystrokes in one field (a digit typed, then deleted, 250 ms apart).
The page waits for a 100 ms pause in typing (\`RECOMPUTE_DEBOUNCE_MS\`) on purpose; the figures time the
work after that pause:

- **engine**: the \`sw-recompute\` measure set by \`liveCalc\` (the shared engine from \`shared/calc\`,
  run in the browser, plus the field messages);
- **recompute + DOM**: from the \`sw-recompute-start\` mark to the moment a MutationObserver sees the
  page's results and drawing updated (engine, signals, Angular's change detection, D3 path strings);
- **to next frame**: from the same mark to the next \`requestAnimationFrame\` callback after the
  update (includes waiting for the display's next 16.7 ms tick);
- **long tasks**: PerformanceObserver \`longtask\` entries (> 50 ms) while typing.

Target: recompute + DOM under one frame (${FRAME_MS} ms). The test fails if the median is not.

| Page | updates | engine median (ms) | recompute + DOM median (ms) | p95 (ms) | max (ms) | to next frame median (ms) | long tasks |
|---|---|---|---|---|---|---|---|
${rows.join('\n')}

## JavaScript per route

From the Resource Timing API: what the first load of \`/\` fetches, then what a client-side
navigation to each area adds (lazy chunks; the first area also brings the shared engine chunk:
decimal.js, zod and \`shared/\`, which later areas reuse). Raw = decoded size; transferred = encoded
body size as served (the test server does not compress, so the two match unless it does).

| | files | raw (kB) | transferred (kB) |
|---|---|---|---|
| initial (\`/\`) | ${initial.files} | ${kb(initial.raw)} | ${kb(initial.transfer)} |
${routeRows.join('\n')}

Budget (angular.json, production): initial JavaScript + CSS warns above 560 kB and fails the build
above 650 kB; any single lazy script warns above 650 kB and fails above 800 kB; component styles
warn at 8 kB and fail at 16 kB. \`ng build\` prints the same initial total (raw and estimated
transfer with compression) at the end of every build.
`;
  fs.mkdirSync(path.dirname(DOC), { recursive: true });
  fs.writeFileSync(DOC, text);
}
