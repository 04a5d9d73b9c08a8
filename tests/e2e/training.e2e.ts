/**
 * Training end to end in Chromium: a lead assigns one problem to the demo apprentice, the SMTP
 * catcher receives the notice, the apprentice answers once wrong and once right from the e-mailed
 * link, and the lead sees the score. Answers are looked up from the stored seed, as the server does.
 */
import type { Browser } from 'playwright-core';
import { Op, type Sequelize } from 'sequelize';

import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { AssignmentWork, CapturedMail, initModels, TrainingProblem, User } from '../../server/models';
import { generateExercise } from '../../shared/training/generators';
import { DESKTOP, PHONE, TABLET, launch, openPage, screenshot, signIn, signInByApi } from '../support/browser';
import { contentViolations } from '../support/content-a11y';

jest.setTimeout(120_000);

let browser: Browser;
let sequelize: Sequelize;

beforeAll(async () => {
  browser = await launch();
  sequelize = createSequelize(loadConfig().db);
  initModels(sequelize);
});
afterAll(async () => {
  await browser?.close();
  await sequelize?.close();
});

async function waitForMail(to: string, subject: string): Promise<CapturedMail> {
  for (let i = 0; i < 100; i++) {
    const mail = await CapturedMail.findOne({ where: { recipients: { [Op.like]: `%${to}%` }, subject: { [Op.like]: `%${subject}%` } }, order: [['id', 'DESC']] });
    if (mail) return mail;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} about ${subject}`);
}

describe('training', () => {
  it('lets a lead assign, e-mails the apprentice, grades one wrong and one right answer, and shows the score', async () => {
    const title = `Depth to stop drill ${Date.now()}`;
    const lead = await openPage(browser, DESKTOP);
    // The lead works in Chicago: the e-mail gives the due time on that clock, zone named.
    await (await lead.context.newCDPSession(lead.page)).send('Emulation.setTimezoneOverride', { timezoneId: 'America/Chicago' });
    await signIn(lead.page, 'lead@demo.test');
    await lead.page.goto('/training/assignments');
    await lead.page.getByRole('heading', { name: 'Assignments & scores' }).waitFor();
    await lead.page.getByLabel('Title').fill(title);
    // A fraction of a problem is refused with its reason under its own box, not quietly rounded down.
    await lead.page.getByLabel('Depth to stop on an angle block').fill('1.5');
    await lead.page.getByRole('checkbox', { name: 'Sam Okafor' }).check();
    await lead.page.getByRole('button', { name: 'Assign and notify' }).click();
    await lead.page.locator('mat-form-field', { hasText: 'Depth to stop on an angle block' }).locator('.field-error', { hasText: /whole number/i }).waitFor();
    await lead.page.getByLabel('Depth to stop on an angle block').fill('1');
    await lead.page.getByRole('button', { name: 'Assign and notify' }).click();
    await lead.page.getByText(`Assigned "${title}" to 1 apprentice; 1 e-mail notice sent.`).waitFor();

    // The catcher has the notice, with a link to the assignment.
    const mail = await waitForMail('apprentice@demo.test', title);
    const link = /https?:\/\/\S+\/training\/assignments\/(\d+)/.exec(mail.text);
    expect(link).not.toBeNull();
    // The form's default is 16:00 a week ahead on the lead's clock.
    expect(mail.text).toMatch(/It is due \w{3} \d{1,2} \w{3} \d{4}, 16:00 \(America\/Chicago\)\./);
    const path = new URL(link![0]).pathname;

    const apprentice = await User.findOne({ where: { email: 'apprentice@demo.test' } });
    const work = await AssignmentWork.findOne({ where: { assignmentId: Number(link![1]), userId: apprentice!.id } });
    const problem = await TrainingProblem.findOne({ where: { workId: work!.id, position: 1 } });
    const exercise = generateExercise(problem!.type, problem!.seed);

    for (const viewport of [DESKTOP, TABLET]) {
      const a = await openPage(browser, viewport);
      await signInByApi(a.context, 'apprentice@demo.test');
      await a.page.goto(path);
      await a.page.getByRole('heading', { name: title }).waitFor();
      if (viewport === DESKTOP) {
        const box = a.page.getByLabel('Depth to stop h');
        await box.fill((Number(exercise.exact) + 0.05).toFixed(4));
        await a.page.getByRole('button', { name: 'Check answer' }).click();
        await a.page.getByText(/not within ±0\.0005|not within ±0\.01/).waitFor();
        // Enter on Hint keeps the keyboard focus on the button while the server answers and after.
        await a.page.getByRole('button', { name: /Hint/ }).focus();
        await a.page.keyboard.press('Enter');
        await a.page.getByLabel('Hints').waitFor();
        await expect(a.page.evaluate(() => document.activeElement?.textContent ?? '')).resolves.toMatch(/Hint 1\//);
        await box.fill(exercise.answer);
        await a.page.getByRole('button', { name: 'Check answer' }).click();
        await a.page.getByText('Correct.').waitFor();
        await a.page.getByRole('region', { name: 'Worked solution' }).waitFor();
        expect(await contentViolations(a.page)).toBe('');
      } else {
        await a.page.getByText('Correct.').waitFor();
      }
      await screenshot(a.page, `training-apprentice-work-${viewport.width}`);
      expect(a.problems).toEqual([]);
      await a.context.close();
    }

    // The lead's score table shows the apprentice's 100% (one problem, right on the second try).
    await lead.page.reload();
    const column = lead.page.getByRole('columnheader', { name: new RegExp(title) });
    await column.waitFor();
    const row = lead.page.getByRole('row', { name: /Sam Okafor/ });
    const headers = await lead.page.getByRole('columnheader').allTextContents();
    const index = headers.findIndex((h) => h.includes(title));
    const cell = row.locator('th, td').nth(index);
    await expect(cell.textContent()).resolves.toMatch(/100%\s*1\/1\s*Done/);
    await screenshot(lead.page, 'training-lead-scores-1280');
    expect(await contentViolations(lead.page)).toBe('');

    // The score cell opens the apprentice's answers: wrong, then right, and the worked solution.
    await cell.getByRole('link', { name: `Sam Okafor's work on ${title}` }).click();
    await lead.page.getByRole('heading', { name: `Sam Okafor: ${title}` }).waitFor();
    const answers = lead.page.getByRole('list', { name: 'Answers to problem 1' }).getByRole('listitem');
    await expect(answers.allTextContents()).resolves.toEqual([expect.stringMatching(/Wrong/), expect.stringMatching(/Right/)]);
    await expect(answers.nth(0).textContent()).resolves.toContain((Number(exercise.exact) + 0.05).toFixed(4));
    await expect(answers.nth(1).textContent()).resolves.toContain(exercise.answer);
    await lead.page.getByText('hints used 1 of').waitFor();
    await lead.page.getByRole('button', { name: /Worked solution/ }).click();
    await lead.page.getByText(`(exact ${exercise.exact};`).waitFor();
    await lead.page.locator('.solution').getByText(exercise.steps[0]!.formula, { exact: true }).first().waitFor();
    await screenshot(lead.page, 'training-lead-work-review-1280');
    expect(await contentViolations(lead.page)).toBe('');
    // The lead grades the closed problem by hand, with a reason; the score follows.
    await lead.page.getByRole('button', { name: 'Grade by hand: problem 1' }).click();
    await lead.page.getByLabel('Why, for the apprentice to read').fill('Right, but only after a hint: do it again without one.');
    await lead.page.getByRole('button', { name: 'Save grade' }).click();
    await lead.page.getByText('counted wrong by hand').waitFor();
    await lead.page.getByText('0 of 1 right (0%)').waitFor();
    await lead.page.getByText('“Right, but only after a hint: do it again without one.”').waitFor();
    // An apprentice who joins later is given the same assignment from the list: problems of her own and the e-mail.
    await lead.page.goto('/training/assignments');
    await lead.page.getByRole('button', { name: `Add apprentices to ${title}` }).click();
    await lead.page.getByRole('group', { name: `Give "${title}" to` }).getByRole('checkbox', { name: 'Juno Pell' }).check();
    await lead.page.getByRole('button', { name: 'Give it to them' }).click();
    await lead.page.getByText(`"${title}" given to Juno Pell; 1 e-mail notice sent.`).waitFor();
    await lead.page.getByRole('listitem').filter({ hasText: title }).getByText('2 apprentices').waitFor();
    await expect(lead.page.getByRole('button', { name: `Add apprentices to ${title}` }).count()).resolves.toBe(0);
    const late = await waitForMail('juno@demo.test', title);
    expect(late.text).toContain(path);
    const juno = await User.findOne({ where: { email: 'juno@demo.test' } });
    const junoWork = await AssignmentWork.findOne({ where: { assignmentId: Number(link![1]), userId: juno!.id } });
    expect(junoWork!.seed).not.toBe(work!.seed);
    // The one refusal asked for above (1.5 problems), which the browser logs; nothing else.
    expect(lead.problems).toEqual(['console: Failed to load resource: the server responded with a status of 400 (Bad Request)']);
    await lead.context.close();
  });

  it('keeps the score table readable on a phone: it scrolls sideways in its own box, names and scores unbroken', async () => {
    const { context, page, problems } = await openPage(browser, PHONE);
    await signInByApi(context, 'lead@demo.test');
    await page.goto('/training/assignments');
    await page.getByRole('heading', { name: 'Assignments & scores' }).waitFor();
    const wrap = page.getByRole('region', { name: /Scores: scrolls sideways/ });
    await wrap.waitFor();
    await page.getByText('The table scrolls sideways').waitFor();
    const layout = await wrap.evaluate((el) => {
      const lines = (node: Element) => {
        const range = document.createRange();
        range.selectNodeContents(node);
        // One line box per rendered line of the text.
        return new Set(Array.from(range.getClientRects()).map((r) => Math.round(r.top))).size;
      };
      return {
        scrolls: el.scrollWidth > el.clientWidth,
        // The page scrolls in the side-menu layout's content box, not the document.
        pageScrolls: ((c) => c.scrollWidth > c.clientWidth)(document.querySelector('mat-sidenav-content')!),
        names: Array.from(el.querySelectorAll('th[scope=row] .name')).map((n) => [n.textContent, lines(n)]),
        scores: Array.from(el.querySelectorAll('td strong')).map((n) => [n.textContent, lines(n)]),
      };
    });
    expect(layout.scrolls).toBe(true);
    expect(layout.pageScrolls).toBe(false);
    expect(layout.names.length).toBeGreaterThan(0);
    for (const [name, count] of layout.names) expect([name, count]).toEqual([name, 1]);
    for (const [score, count] of layout.scores) expect([score, count]).toEqual([score, 1]);
    // The names stay in view when the table is scrolled to its far end.
    await wrap.evaluate((el) => el.scrollTo({ left: el.scrollWidth }));
    const nameBox = await page.locator('th[scope=row]').first().boundingBox();
    const wrapBox = await wrap.boundingBox();
    expect(Math.abs(nameBox!.x - wrapBox!.x)).toBeLessThan(2);
    await screenshot(page, 'training-lead-scores-390');
    expect(await contentViolations(page)).toBe('');
    expect(problems).toEqual([]);
    await context.close();
  });

  it('shows the lessons with their drawings and practice, at desktop and tablet width', async () => {
    for (const viewport of [DESKTOP, TABLET]) {
      const { context, page, problems } = await openPage(browser, viewport);
      await signInByApi(context, 'apprentice@demo.test');
      await page.goto('/training');
      await page.getByRole('link', { name: /The right triangle on a taper set-up/ }).click();
      await page.getByRole('heading', { name: 'The right triangle on a taper set-up' }).waitFor();
      await page.locator('sw-lesson-drawing svg').first().waitFor();
      const slider = page.getByRole('slider', { name: 'Angle α' });
      await slider.focus();
      await page.keyboard.press('ArrowRight');
      await page.getByText('Depth to stop h = L · sin α').waitFor();
      await screenshot(page, `training-lesson-${viewport.width}`);
      if (viewport === DESKTOP) expect(await contentViolations(page)).toBe('');
      await page.goto('/training/assignments');
      await page.getByRole('heading', { name: 'My assignments' }).waitFor();
      await page.getByText('Angles on the mill 1: the right triangle on a taper').waitFor();
      await screenshot(page, `training-my-assignments-${viewport.width}`);
      expect(problems).toEqual([]);
      await context.close();
    }
  });

  it('keeps the words on every lesson drawing readable on a phone: 10.5 px or more on the screen, inside the drawing', async () => {
    const { context, page, problems } = await openPage(browser, PHONE);
    await signInByApi(context, 'apprentice@demo.test');
    for (const slug of ['right-triangle', 'sine-bar', 'gauge-stack', 'taper-per-foot', 'over-pins']) {
      await page.goto(`/training/lessons/${slug}`);
      const svg = page.locator('sw-lesson-drawing svg').first();
      await svg.locator('text').first().waitFor();
      // Each text's size on the screen: its font size in view units times the drawing's scale.
      const texts = await svg.evaluate((el) => {
        const drawing = el as SVGSVGElement;
        const scale = drawing.getScreenCTM()?.a ?? 0;
        const frame = drawing.getBoundingClientRect();
        return Array.from(drawing.querySelectorAll('text')).map((t) => {
          const box = t.getBoundingClientRect();
          const inside = box.left >= frame.left - 0.5 && box.right <= frame.right + 0.5 && box.top >= frame.top - 0.5 && box.bottom <= frame.bottom + 0.5;
          return { text: t.textContent ?? '', px: Math.round(parseFloat(getComputedStyle(t).fontSize) * scale * 10) / 10, inside };
        });
      });
      expect(texts.length).toBeGreaterThan(0);
      for (const t of texts) {
        expect({ slug, ...t, px: t.px >= 10.5 }).toEqual({ slug, text: t.text, px: true, inside: true });
      }
      await screenshot(page, `training-lesson-${slug}-390`);
    }
    expect(problems).toEqual([]);
    await context.close();
  });

  it('turns the taper angle by dragging the handle on the drawing, and the slider and tan α follow', async () => {
    for (const viewport of [DESKTOP, TABLET]) {
      const { context, page, problems } = await openPage(browser, viewport);
      await signInByApi(context, 'apprentice@demo.test');
      await page.goto('/training/lessons/right-triangle');
      await page.getByRole('heading', { name: 'The right triangle on a taper set-up' }).waitFor();
      const handle = page.getByRole('slider', { name: 'Drag on the drawing to set α' });
      const slider = page.getByRole('slider', { name: 'Angle α', exact: true });
      const angleText = page.locator('sw-lesson-drawing .slider-row strong');
      const tanText = page.locator('sw-lesson-drawing .readouts div').filter({ has: page.getByText('tan α', { exact: true }) }).locator('dd');
      await handle.waitFor();
      // On a tablet the drawing sits below the text: bring it on screen, where the mouse can reach it.
      await handle.scrollIntoViewIfNeeded();
      const before = await angleText.textContent();
      const startAngle = Number(await slider.inputValue());

      // Big enough for a finger: at least 24 px across, and it says it can be grabbed.
      const box = (await handle.boundingBox())!;
      expect(box.width).toBeGreaterThanOrEqual(24);
      expect(box.height).toBeGreaterThanOrEqual(24);
      await expect(handle.evaluate((el) => getComputedStyle(el).cursor)).resolves.toBe('grab');
      await expect(handle.evaluate((el) => getComputedStyle(el).touchAction)).resolves.toBe('none');

      // The part tilts about the low corner of its block (down-left of the handle): dragging up opens the angle.
      const x = box.x + box.width / 2;
      const y = box.y + box.height / 2;
      await page.mouse.move(x, y);
      await page.mouse.down();
      for (let i = 1; i <= 8; i++) await page.mouse.move(x, y - i * 10);
      await page.mouse.up();
      // Let the app render the last move (change detection runs by the next frame).
      await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));

      const angle = Number(await slider.inputValue());
      expect(angle).toBeGreaterThanOrEqual(startAngle + 5);
      expect(await angleText.textContent()).not.toBe(before);
      expect(await angleText.textContent()).toBe(`${angle}°`);
      await expect(handle.getAttribute('aria-valuenow')).resolves.toBe(String(angle));
      // tan of the slider's angle to 4 places (derived: definition of the tangent).
      expect(await tanText.textContent()).toBe(Math.tan((angle * Math.PI) / 180).toFixed(4));

      // The keyboard moves the same value through the handle.
      await handle.focus();
      await page.keyboard.press('ArrowUp');
      await angleText.filter({ hasText: `${angle + 0.5}°` }).waitFor();
      expect(Number(await slider.inputValue())).toBe(angle + 0.5);
      await screenshot(page, `training-lesson-drag-${viewport.width}`);
      expect(problems).toEqual([]);
      await context.close();
    }
  });
});
