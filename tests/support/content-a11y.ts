import type { Page } from 'playwright-core';

import { describeViolations, seriousA11yViolations } from './browser';

/** Serious and critical accessibility problems of the whole page, as text ('' when none); each node is described with the start of its HTML. */
export async function contentViolations(page: Page): Promise<string> {
  const violations = [];
  for (const v of await seriousA11yViolations(page)) {
    const nodes = [];
    for (const n of v.nodes) {
      const selector = n.target.join(' ');
      const html = await page.locator(selector).first().evaluate((el) => el.outerHTML.slice(0, 160)).catch(() => '');
      nodes.push({ target: [`${selector} ${html}`] });
    }
    if (nodes.length) violations.push({ ...v, nodes });
  }
  return describeViolations(violations);
}
