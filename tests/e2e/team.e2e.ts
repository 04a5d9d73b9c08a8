/**
 * Team end to end in Chromium: an admin invites a new member, the SMTP catcher receives the
 * invitation, the link from the captured e-mail is accepted in a fresh browser, and the new member
 * signs in. Also the dev mailbox and the "Forgot password?" path from the sign-in page.
 */
import type { Browser } from 'playwright-core';

import { DESKTOP, TABLET, launch, openPage, screenshot, signIn } from '../support/browser';
import { contentViolations } from '../support/content-a11y';

jest.setTimeout(120_000);

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(() => browser?.close());

describe('team', () => {
  it('invites by e-mail; the captured link is accepted and the new member signs in', async () => {
    const email = `new.hand.${Date.now()}@example.test`;
    const admin = await openPage(browser, DESKTOP);
    await signIn(admin.page, 'admin@demo.test');
    await admin.page.goto('/team');
    await admin.page.getByRole('tab', { name: 'Invitations' }).click();
    await admin.page.getByLabel('E-mail').fill(email);
    await admin.page.getByRole('button', { name: 'Send invitation' }).click();
    await admin.page.getByText(`Invitation sent to ${email}.`).waitFor();

    // The dev mailbox (admins, local catcher only) shows the message and its link.
    let link: string | undefined;
    for (let i = 0; i < 50 && !link; i++) {
      const res = await admin.context.request.get(`/api/team/mailbox?to=${encodeURIComponent(email)}`);
      const body = (await res.json()) as { messages: Array<{ links: string[] }> };
      link = body.messages[0]?.links.find((l) => l.includes('/accept-invite?token='));
      if (!link) await new Promise((r) => setTimeout(r, 100));
    }
    expect(link).toBeDefined();
    await admin.page.getByRole('tab', { name: 'Dev mailbox' }).click();
    await admin.page.getByRole('button', { name: /You are invited to join/ }).first().click();
    await admin.page.locator('pre.mail-text').first().waitFor();
    await screenshot(admin.page, 'team-dev-mailbox-1280');

    const guest = await openPage(browser, TABLET);
    const url = new URL(link!);
    await guest.page.goto(url.pathname + url.search);
    await guest.page.getByText('You are invited to Kestrel Lane Instruments').waitFor();
    await screenshot(guest.page, 'team-accept-invite-768');
    expect(await contentViolations(guest.page)).toBe('');
    await guest.page.getByLabel('Your name').fill('Rowan Fell');
    await guest.page.getByLabel('New password').fill('rowan-long-password');
    await guest.page.getByRole('button', { name: 'Create my account' }).click();
    await guest.page.getByText('Your account is ready.').waitFor();

    // Single use: the same link no longer works.
    await guest.page.goto(url.pathname + url.search);
    await guest.page.getByText(/expired or was already used/).waitFor();

    await signIn(guest.page, email, 'rowan-long-password');
    await guest.page.getByText('Rowan Fell').first().waitFor();
    expect(guest.problems.filter((p) => !p.includes('410'))).toEqual([]);

    // The new member is listed for the admin.
    await admin.page.goto('/team');
    await admin.page.getByRole('rowheader', { name: 'Rowan Fell' }).waitFor();
    await screenshot(admin.page, 'team-members-1280');
    expect(await contentViolations(admin.page)).toBe('');
    expect(admin.problems).toEqual([]);
    await admin.context.close();
    await guest.context.close();
  });

  it('offers "Forgot password?" on the sign-in page with one answer for any address', async () => {
    for (const viewport of [DESKTOP, TABLET]) {
      const { context, page, problems } = await openPage(browser, viewport);
      await page.goto('/sign-in');
      await page.getByRole('link', { name: 'Forgot password?' }).click();
      await page.getByRole('heading', { name: 'Forgot your password?' }).waitFor();
      await page.getByLabel('E-mail').fill(`nobody.${viewport.width}.${Date.now()}@example.test`);
      await page.getByRole('button', { name: 'Send me a link' }).click();
      await page.getByText(/If that address belongs to an active Slantwise account/).waitFor();
      await screenshot(page, `team-forgot-password-${viewport.width}`);
      expect(problems).toEqual([]);
      await context.close();
    }
  });
});
