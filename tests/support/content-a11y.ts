import type { Page } from 'playwright-core';

import { describeViolations, seriousA11yViolations } from './browser';

/**
 * Serious accessibility problems of a page's own content, as text ('' when none). The shell's
 * toolbar (its account menu button) is checked by the shell's own tests, so its nodes are left
 * out; each remaining node is described with the start of its HTML.
 */
export async function contentViolations(page: Page): Promise<string> {
  const violations = [];
  for (const v of await seriousA11yViolations(page)) {
    const nodes = [];
    for (const n of v.nodes) {
      const selector = n.target.join(' ');
      const inToolbar = await page.locator(selector).first().evaluate((el) => !!el.closest('mat-toolbar, .mat-toolbar')).catch(() => false);
      if (inToolbar || selector.includes('.mat-mdc-menu-trigger')) continue;
      const html = await page.locator(selector).first().evaluate((el) => el.outerHTML.slice(0, 160)).catch(() => '');
      nodes.push({ target: [`${selector} ${html}`] });
    }
    if (nodes.length) violations.push({ ...v, nodes });
  }
  return describeViolations(violations);
}

/** Console and network problems, leaving out the 401 of GET /api/auth/me that every anonymous page gets by design. */
export function realProblems(problems: readonly string[]): string[] {
  return problems.filter((p) => !/status of 401 \(Unauthorized\)/.test(p));
}
