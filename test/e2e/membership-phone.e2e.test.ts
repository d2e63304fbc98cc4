import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { browserSuite, consoleErrors, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

// Late November 2026 on the server; the browser's own calendar is the machine's.
const clock = fixedClock('2026-11-20T18:00:00Z');
let t: TestApp;
let browser: Browser;
let site: Site;
let plans: Record<string, number>;
const tag = `P${Date.now().toString(36)}`;

browserSuite({ clock }, async (s) => {
  ({ t, site, browser } = s);
  const res = await new Client(t.app).get('/api/membership/plans');
  plans = Object.fromEntries(res.body.items.map((p: { code: string; id: number }) => [p.code, p.id]));
});

/** The one console line a refused request leaves: Chromium logs every 4xx answer. */
const REFUSAL_LOGGED = 'console: Failed to load resource: the server responded with a status of 400 (Bad Request)';

/** A phone-sized browser context (390x844) with touch. */
function phone(): Promise<BrowserContext> {
  return browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
}

/** A member who joined through the API with a one-time card: no card on file. */
async function member(name: string) {
  const user = await createUser(t.deps.db, ['fan'], name);
  const client = new Client(t.app);
  await client.signIn(user);
  const res = await client.post('/api/membership', {
    planId: plans.adult,
    profile: {
      legalName: `${name} ${tag}`,
      dateOfBirth: '1985-02-14',
      address: '3 Gopher Lane, Gopher Flats, MB',
      phone: '204-555-0170',
      emergencyContact: 'Wren, 204-555-0171',
      certificationLevel: 'L1',
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_ca',
  });
  expect(res.status).toBe(201);
  return user;
}

async function pick(page: Page, label: string, option: string): Promise<void> {
  await page.getByLabel(label, { exact: true }).click();
  await page.getByRole('option', { name: option }).click();
}

/**
 * The label of the field that holds focus, and whether that field is on screen. Focus moves after Angular's next
 * render, which can come after the click returns, so this first waits (up to Playwright's timeout) for focus to reach
 * a form field; if it never does, the wait fails the test.
 */
async function focusedField(page: Page) {
  await page.waitForFunction(() => !!document.activeElement?.closest('mat-form-field'));
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    const field = el?.closest('mat-form-field');
    const box = el?.getBoundingClientRect();
    return {
      label: field?.querySelector('mat-label')?.textContent?.trim() ?? el?.tagName ?? null,
      onScreen: !!box && box.top >= 0 && box.bottom <= window.innerHeight,
    };
  });
}

/**
 * Field labels in the join form that run past the room the field gives them: the field clips what sticks out (its
 * infix ends before a suffix such as the calendar button), or the label itself ends in an ellipsis.
 */
function cutLabels(page: Page) {
  return page.evaluate(() =>
    [
      ...document.querySelectorAll<HTMLElement>(
        'form[aria-labelledby="join-heading"] mat-form-field .mdc-floating-label',
      ),
    ]
      .filter((l) => {
        const room = l.closest('.mat-mdc-form-field-infix')!.getBoundingClientRect();
        return l.getBoundingClientRect().right > room.right + 1 || l.scrollWidth > l.clientWidth + 1;
      })
      .map((l) => l.textContent?.trim()),
  );
}

describe('club dues on a phone (390x844)', () => {
  it('join form: whole labels, focus on the first field that needs attention, dates typed or picked as YYYY-MM-DD', async () => {
    const fan = await createUser(t.deps.db, ['fan'], 'Marisol Quance');
    const context = await phone();
    const page = await context.newPage();
    const errors = consoleErrors(page);
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/membership`);
    await page.getByRole('heading', { name: 'Join the club' }).waitFor();
    await page.getByLabel('Plan', { exact: true }).waitFor();
    expect(await cutLabels(page)).toEqual([]);

    // Nothing filled in: focus moves from the button at the bottom to the first field, with its message.
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await expect(focusedField(page)).resolves.toEqual({ label: 'Plan', onScreen: true });
    await page.getByText('Plan is required.').waitFor();

    await pick(page, 'Plan', 'Adult');
    await page.getByLabel('Legal name', { exact: true }).fill(`Marisol Quance ${tag}`);
    await page.getByLabel('Date of birth', { exact: true }).fill('1991-05-05');
    await page.getByLabel('Address', { exact: true }).fill('21 Coulee Crescent, Gopher Flats, MB');
    // Too short for the server's phone rule (the form itself only asks for something).
    await page.getByLabel('Phone', { exact: true }).fill('12');
    await page.getByLabel('Emergency contact', { exact: true }).fill('Ines Quance 204-555-0181');
    await page.getByLabel('Association member number', { exact: true }).fill('NA-70021');
    // The expiry picked in the calendar: the 15th of the month it opens on.
    await page
      .locator('mat-form-field', { hasText: 'Association expiry' })
      .getByRole('button', { name: 'Open calendar' })
      .click();
    await page.locator('.mat-calendar-body-cell-content', { hasText: /^\s*15\s*$/ }).waitFor();
    await screenshot(page, 'membership-phone-date-picker');
    await page.locator('.mat-calendar-body-cell-content', { hasText: /^\s*15\s*$/ }).click();
    await page.getByRole('dialog', { name: 'Association expiry' }).waitFor({ state: 'detached' });
    const expires = await page.getByRole('textbox', { name: 'Association expiry', exact: true }).inputValue();
    expect(expires).toMatch(/^\d{4}-\d{2}-15$/);
    await pick(page, 'Certification level', 'Level 1');
    await page.getByLabel('Certified on', { exact: true }).fill('2019-08-24');
    await page.getByLabel(/I have read and accept the waiver/).check();
    await pick(page, 'Card', 'Test Visa (pays)');
    // Filled in, the labels float above the text: still whole.
    expect(await cutLabels(page)).toEqual([]);
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await page.getByText('Enter a phone number').waitFor();
    await expect(focusedField(page)).resolves.toEqual({ label: 'Phone', onScreen: true });
    await screenshot(page, 'membership-phone-join-refused');

    await page.getByLabel('Phone', { exact: true }).fill('204-555-0180');
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await page
      .getByRole('status')
      .getByText(/Welcome aboard/)
      .waitFor();
    const row = (
      await t.deps.db.raw(
        `SELECT to_char(date_of_birth, 'YYYY-MM-DD') AS born, to_char(association_expires, 'YYYY-MM-DD') AS expires, to_char(certification_date, 'YYYY-MM-DD') AS certified FROM memberships WHERE user_id = ?`,
        [fan.id],
      )
    ).rows[0];
    expect(row).toEqual({ born: '1991-05-05', expires, certified: '2019-08-24' });
    // The new member's page reads the number and its expiry as one phrase, the date in the club's format.
    const association = page.getByTestId('association-state');
    await association.waitFor();
    expect((await association.textContent())!.replace(/\s+/g, ' ').trim()).toMatch(
      /^NA-70021, expires [A-Z][a-z]{2} 15, \d{4} · not yet checked by the club/,
    );
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([REFUSAL_LOGGED]);
    await context.close();
  });

  it('auto-renew: the switch shows the server’s answer, the refusal sits beside it, and the card on file is named', async () => {
    const user = await member('Tamsin Vale');
    const context = await phone();
    const page = await context.newPage();
    const errors = consoleErrors(page);
    await signInThroughForm(page, site.baseUrl, user.email, user.password);
    await page.goto(`${site.baseUrl}/membership`);
    await page.getByTestId('card-on-file').getByText('none').waitFor();
    const toggle = page.getByRole('switch', { name: 'Renew automatically' });

    // No card chosen and none on file: the server refuses, and the switch stays off.
    await toggle.click();
    const problem = page.getByTestId('auto-renew-problem');
    await problem.getByText('Choose a card to keep on file.').waitFor();
    await expect(toggle.getAttribute('aria-checked')).resolves.toBe('false');
    await expect(toggle.getAttribute('aria-describedby')).resolves.toContain('auto-problem');
    const renewForm = page.getByRole('form', { name: 'Renew', exact: true });
    await expect(renewForm.getByText('Choose a card to keep on file.').count()).resolves.toBe(0);
    await expect(
      page
        .getByRole('form', { name: 'Automatic renewal', exact: true })
        .getByText('Choose a card to keep on file.')
        .count(),
    ).resolves.toBeGreaterThan(0);
    const [switchBox, problemBox] = [await toggle.boundingBox(), await problem.boundingBox()];
    expect(Math.abs(problemBox!.y - switchBox!.y)).toBeLessThan(80);
    await screenshot(page, 'membership-phone-auto-renew-refused');

    await pick(page, 'Card to keep on file', 'Test Mastercard (pays)');
    await toggle.click();
    await page.getByRole('status').getByText('Auto-renew is on.').waitFor();
    await expect(toggle.getAttribute('aria-checked')).resolves.toBe('true');
    await expect(problem.count()).resolves.toBe(0);
    // tok_mastercard is the processor's test Mastercard ending 4444 (the payment fake's fixture).
    await page.getByTestId('card-on-file').getByText('MasterCard ending 4444').waitFor();
    // A November join is paid through next year; in January, when renewal opens, the renew form offers the card.
    clock.set('2027-01-05T18:00:00Z');
    try {
      await page.reload();
      await page.getByLabel('Card', { exact: true }).click();
      await page.getByRole('option', { name: 'MasterCard ending 4444 (on file)' }).waitFor();
      await page.keyboard.press('Escape');
      await page.getByRole('listbox').waitFor({ state: 'detached' });
    } finally {
      clock.set('2026-11-20T18:00:00Z');
    }
    await screenshot(page, 'membership-phone-auto-renew-on');
    expect((await t.deps.db('memberships').where('user_id', user.id).first('auto_renew')).auto_renew).toBe(true);
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([REFUSAL_LOGGED]);
    await context.close();
  });

  it('member card: text of 14 px and more, a check-in code of 160 px and more, black on white with its quiet zone', async () => {
    const user = await member('Osric Penhallow');
    const context = await phone();
    const page = await context.newPage();
    const errors = consoleErrors(page);
    await signInThroughForm(page, site.baseUrl, user.email, user.password);
    await page.goto(`${site.baseUrl}/membership/card`);
    const code = page.getByRole('img', { name: /Check-in code for member/ });
    await code.waitFor();
    const small = await page.locator('article.card').evaluate((card) => {
      const out: string[] = [];
      const walker = document.createTreeWalker(card, NodeFilter.SHOW_TEXT);
      while (walker.nextNode()) {
        const text = walker.currentNode.textContent?.trim();
        const px = parseFloat(getComputedStyle(walker.currentNode.parentElement!).fontSize);
        if (text && px < 14) out.push(`${text.slice(0, 30)}: ${px}px`);
      }
      return out;
    });
    expect(small).toEqual([]);
    const box = await code.locator('svg').boundingBox();
    expect(box!.width).toBeGreaterThanOrEqual(160);
    expect(box!.height).toBeGreaterThanOrEqual(160);
    const qr = await code.locator('svg').evaluate((svg: SVGSVGElement) => {
      const [light, dark] = [...svg.querySelectorAll('path')] as SVGPathElement[];
      const view = svg.viewBox.baseVal;
      const ink = dark.getBBox();
      return {
        light: light.getAttribute('fill'),
        dark: dark.getAttribute('stroke'),
        quiet: Math.min(
          ink.x - view.x,
          view.x + view.width - (ink.x + ink.width),
          ink.y - 0.5 - view.y,
          view.y + view.height - (ink.y + ink.height + 0.5),
        ),
        behind: getComputedStyle(svg.parentElement!).backgroundColor,
      };
    });
    // A quiet zone of at least four modules (ISO/IEC 18004, from memory); the SVG's units are modules.
    expect(qr).toEqual({ light: '#ffffff', dark: '#000000', quiet: expect.any(Number), behind: 'rgb(255, 255, 255)' });
    expect(qr.quiet).toBeGreaterThanOrEqual(4);
    await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(390);
    await screenshot(page, 'membership-phone-card');
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await context.close();
  });
});
