// Shared set-up for the calculator page specs (gauge blocks, sine bar, taper, angle blocks,
// lathe tapers, pins and rolls). Test code only: imported by *-page.spec.ts files, never by the app.
// It uses no Jest globals, so it also type-checks under tsconfig.app.json, which includes src/**/*.ts.
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { Type } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import type { GaugeStackRequest } from '../../../../shared/api/calc';
import type { InventorySetDto } from '../../../../shared/api/inventory';
import { calculateGaugeStack } from '../../../../shared/calc/gauge-stack';
import { findGaugeSet } from '../../../../shared/data/gauge-sets';
import { Auth } from '../../core/auth';

/** How long a test waits for a page's debounced recompute (longer than the pages' debounce). */
const RECOMPUTE_WAIT_MS = 150;

/** A created calculator page and the helpers its specs use to drive and read it. */
export interface PageHarness<T> {
  readonly fixture: ComponentFixture<T>;
  /** The page's host element. */
  readonly el: HTMLElement;
  /** Runs change detection and waits until the page is stable. */
  render(): Promise<void>;
  /** Waits out the debounced recompute, then renders. */
  settle(): Promise<void>;
  /**
   * Types `value` into the `input[formcontrolname=name]` and settles. The field is left (blur)
   * afterwards unless `blur` is false, which checks what shows while the user is still in it.
   */
  type(name: string, value: string, options?: { readonly blur?: boolean }): Promise<void>;
  /** The number shown in the result row whose `dt` label is `label`, or undefined if there is none. */
  resultValue(label: string): string | undefined;
  /** Every `mat-error` message on the page, joined with " | " ("" when there are none). */
  fieldErrors(): string;
}

/** A calculator page under test: {@link PageSpec.open} creates it, the {@link PageHarness} helpers drive the page opened last. */
export interface PageSpec<T> extends PageHarness<T> {
  /**
   * Configures TestBed (router knowing the page's route, testing HttpClient), loads the session
   * when `signedIn` is given (the demo machinist, or no one), then navigates to `url` (default
   * the page's own route), creates the page and waits for its first render.
   */
  open(url?: string, options?: { readonly signedIn?: boolean }): Promise<void>;
}

/**
 * The {@link PageSpec} for `page` at route `path` (e.g. "taper"). Declare it once per describe;
 * each test calls `open` first.
 */
export function pageSpec<T>(page: Type<T>, path: string): PageSpec<T> {
  let current: PageHarness<T> | undefined;
  const opened = (): PageHarness<T> => {
    if (!current) throw new Error(`Call open() before using the ${path} page`);
    return current;
  };
  return {
    async open(url = `/${path}`, { signedIn } = {}) {
      TestBed.configureTestingModule({
        providers: [provideRouter([{ path, children: [] }]), provideHttpClient(), provideHttpClientTesting()],
      });
      if (signedIn !== undefined) await loadSession(signedIn);
      await TestBed.inject(Router).navigateByUrl(url);
      current = pageHarness(TestBed.createComponent(page));
      await current.render();
    },
    get fixture() {
      return opened().fixture;
    },
    get el() {
      return opened().el;
    },
    render: () => opened().render(),
    settle: () => opened().settle(),
    type: (name, value, options) => opened().type(name, value, options),
    resultValue: (label) => opened().resultValue(label),
    fieldErrors: () => opened().fieldErrors(),
  };
}

/** Wraps a created page's fixture in the {@link PageHarness} helpers. */
function pageHarness<T>(fixture: ComponentFixture<T>): PageHarness<T> {
  const el = fixture.nativeElement as HTMLElement;
  async function render(): Promise<void> {
    fixture.detectChanges();
    await fixture.whenStable();
  }
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, RECOMPUTE_WAIT_MS));
    await render();
  }
  return {
    fixture,
    el,
    render,
    settle,
    async type(name, value, { blur = true } = {}) {
      const input = el.querySelector(`input[formcontrolname="${name}"]`) as HTMLInputElement;
      input.value = value;
      input.dispatchEvent(new Event('input'));
      if (blur) input.dispatchEvent(new Event('blur'));
      await settle();
    },
    resultValue(label) {
      const row = Array.from(el.querySelectorAll('.result')).find((r) => r.querySelector('dt')?.textContent?.trim() === label);
      return row?.querySelector('.number')?.textContent?.trim();
    },
    fieldErrors() {
      return Array.from(el.querySelectorAll('mat-error')).map((e) => e.textContent ?? '').join(' | ');
    },
  };
}

/** Answers GET /api/auth/session with the demo machinist (or no one) and waits for Auth to load it. */
async function loadSession(signedIn: boolean): Promise<void> {
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(Auth).load();
  http.expectOne('/api/auth/session').flush({ user: signedIn ? { id: 4, email: 'machinist@demo.test', name: 'Demo machinist', role: 'machinist' } : null });
  await loading;
}

/** The demo team's inch box as GET /api/inventories lists it (demo seed: .1007 missing, .137 damaged). */
export const DEMO_BOX: InventorySetDto = {
  id: 7, type: 'gauge-blocks', name: 'Inch 81-piece set, cabinet 2', unit: 'in', standardSet: 'inch-81', grade: '0',
  wearBlockSize: '0.050', wearBlockCount: 2, notes: '', version: 3,
  totals: { sizes: 81, blocks: 81, missing: 1, damaged: 1, available: 79 }, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z',
};

/** The demo box with its blocks, as GET /api/inventories/gauge-sets/7 gives it: the 81-piece set, 0.1007 missing and 0.137 damaged. */
export function demoBoxWithBlocks(): InventorySetDto {
  const set = findGaugeSet('inch-81');
  if (!set) throw new Error('inch-81 missing from the standard sets');
  const blocks = set.blocks.map((b, i) => {
    const gone = DEMO_BOX_EXCLUDED.find((x) => Number(x.size) === Number(b.size));
    const missing = gone?.missing ?? 0;
    const damaged = gone?.damaged ?? 0;
    return { id: 100 + i, size: b.size, label: `${b.size} in`, count: b.count, missing, damaged, available: b.count - missing - damaged, note: '' };
  });
  return { ...DEMO_BOX, blocks };
}

/** The blocks the inventory route leaves out of the demo box. */
export const DEMO_BOX_EXCLUDED = [{ size: '0.1007', missing: 1, damaged: 0 }, { size: '0.137', missing: 0, damaged: 1 }];

/**
 * What the inventory stack route answers for the demo box: the shared engine on the blocks left
 * (as the server does). `extra` adds request fields such as the grade or the wear blocks.
 */
export function demoBoxAnswer(target: string, extra: Partial<GaugeStackRequest> = {}): object {
  const set = findGaugeSet('inch-81');
  if (!set) throw new Error('inch-81 missing from the standard sets');
  const gone = new Set(DEMO_BOX_EXCLUDED.map((b) => Number(b.size)));
  const blocks = set.blocks.filter((b) => !gone.has(Number(b.size))).map((b) => ({ size: b.size, count: b.count }));
  const r = calculateGaugeStack({ target, unit: 'in', blocks, ...extra });
  if (!r.ok) throw new Error(r.error);
  return { ...r.value, inventory: { id: DEMO_BOX.id, name: DEMO_BOX.name, version: DEMO_BOX.version }, excluded: DEMO_BOX_EXCLUDED };
}
