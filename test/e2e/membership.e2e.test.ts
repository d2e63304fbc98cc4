import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { browserSuite, recordRequests, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { fixedClock, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

// Late November 2026: a renewal now runs from the current Dec 31 end to Dec 31, 2027.
const clock = fixedClock('2026-11-20T18:00:00Z');
let t: TestApp;
let browser: Browser;
let site: Site;
let plans: Record<string, number>;
const tag = `E${Date.now().toString(36)}`;

browserSuite({ clock }, async (s) => {
  ({ t, site, browser } = s);
  const res = await new Client(t.app).get('/api/membership/plans');
  plans = Object.fromEntries(res.body.items.map((p: { code: string; id: number }) => [p.code, p.id]));
});

/** A member who joined in June through the API (term to Dec 31, 2026). */
async function memberSince(name: string, on: string, over: Record<string, unknown> = {}) {
  const user = await createUser(t.deps.db, ['fan'], name);
  const client = new Client(t.app);
  await client.signIn(user);
  clock.set(`${on}T18:00:00Z`);
  const res = await client.post('/api/membership', {
    planId: plans.adult,
    profile: {
      legalName: `${name} ${tag}`,
      dateOfBirth: '1988-10-03',
      address: '5 Slough Road, Gopher Flats, MB',
      phone: '204-555-0150',
      emergencyContact: 'Rook, 204-555-0151',
      certificationLevel: 'L1',
      ...over,
    },
    waiverVersion: '2026-1',
    paymentToken: 'tok_ca',
  });
  clock.set('2026-11-20T18:00:00Z');
  expect(res.status).toBe(201);
  return user;
}

async function pick(page: Page, label: string, option: string): Promise<void> {
  await page.getByLabel(label, { exact: true }).click();
  await page.getByRole('option', { name: option }).click();
}

describe('club dues in a browser', () => {
  it('lets a fan join with the form, and shows the server’s word beside the plan for a junior plan taken by an adult', async () => {
    const fan = await createUser(t.deps.db, ['fan'], 'Perpetua Lindgren');
    const page = await browser.newPage();
    const requests = recordRequests(page);
    await signInThroughForm(page, site.baseUrl, fan.email, fan.password);
    await page.goto(`${site.baseUrl}/membership`);
    await page.getByRole('heading', { name: 'Join the club' }).waitFor();
    await pick(page, 'Plan', 'Junior');
    await page.getByLabel('Legal name', { exact: true }).fill(`Perpetua Lindgren ${tag}`);
    await page.getByLabel('Date of birth', { exact: true }).fill('1991-05-05');
    await page.getByLabel('Address', { exact: true }).fill('9 Prairie Drive, Gopher Flats, MB');
    await page.getByLabel('Phone', { exact: true }).fill('204-555-0160');
    await page.getByLabel('Emergency contact', { exact: true }).fill('Aksel Lindgren 204-555-0161');
    await page.getByLabel('Association member number', { exact: true }).fill('NA-60613');
    await pick(page, 'Certification level', 'Level 1');
    await page.getByLabel(/I have read and accept the waiver/).check();
    await pick(page, 'Card', 'Test Visa issued in Canada (pays)');
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await page.getByText('You are 18 or over on the first day of the term').waitFor();
    await screenshot(page, 'membership-join-refused');
    await pick(page, 'Plan', 'Adult');
    await page.getByTestId('join-quote').getByText('Dec 31, 2027').waitFor();
    await page.getByRole('button', { name: 'Pay dues and join' }).click();
    await page
      .getByRole('status')
      .getByText(/Welcome aboard/)
      .waitFor();
    await expect(page.getByTestId('term-end').textContent()).resolves.toContain('Nov 20, 2026 to Dec 31, 2027');
    await screenshot(page, 'membership-joined');
    await page.getByRole('link', { name: 'Show my member card' }).click();
    await page.getByRole('img', { name: /Check-in code for member/ }).waitFor();
    await page.emulateMedia({ media: 'print' });
    await screenshot(page, 'membership-card-print');
    expect(requests.filter((u) => !/^(http:\/\/127\.0\.0\.1[:/]|data:|blob:)/.test(u))).toEqual([]);
    await page.close();
  });

  it('lets a member renew dues and see the new term end', async () => {
    const user = await memberSince('Tobiah Quist', '2026-06-10');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, user.email, user.password);
    await page.goto(`${site.baseUrl}/membership`);
    await expect(page.getByTestId('term-end').textContent()).resolves.toContain('Dec 31, 2026');
    await page.getByTestId('renew-quote').getByText('Jan 1, 2027 to Dec 31, 2027').waitFor();
    await pick(page, 'Card', 'Test Visa issued in Canada (pays)');
    await page.getByRole('button', { name: 'Pay and renew' }).click();
    await page.getByText('Renewed. Your dues now run to Dec 31, 2027.').waitFor();
    await page.getByTestId('term-end').getByText('Jan 1, 2027 to Dec 31, 2027').waitFor();
    // Paid a term ahead: the form gives way to the date the next renewal opens, so a second click cannot buy 2028.
    await page.reload();
    await page.getByTestId('renewal-later').getByText('Renewing for the term after opens on Jan 1, 2027.').waitFor();
    await expect(page.getByRole('button', { name: 'Pay and renew' }).count()).resolves.toBe(0);
    await screenshot(page, 'membership-renewed');
    await page.close();
  });

  it('lets the treasurer filter the roster and export it as CSV', async () => {
    await memberSince('Ottoline Brisk', '2026-06-10', { certificationLevel: 'L2' });
    await memberSince('Pim Haverkamp', '2025-03-02', { certificationLevel: 'L2' });
    await memberSince('Quenby Marsh', '2026-06-10', { certificationLevel: 'none' });
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Dale Ledger');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, treasurer.email, treasurer.password);
    await page.getByRole('link', { name: 'Console' }).click();
    await page.getByRole('navigation', { name: 'Console sections' }).getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { name: 'Members' }).waitFor();
    await page.getByLabel('Search name, e-mail or number').fill(tag);
    await pick(page, 'Certification', 'Level 2');
    await page.getByRole('cell', { name: new RegExp(`Pim Haverkamp ${tag}`) }).waitFor();
    await pick(page, 'Status', 'lapsed');
    await page.getByRole('cell', { name: new RegExp(`Ottoline Brisk ${tag}`) }).waitFor({ state: 'detached' });
    await page.getByRole('cell', { name: new RegExp(`Pim Haverkamp ${tag}`) }).waitFor();
    await expect(page.getByRole('cell', { name: new RegExp(`Ottoline Brisk ${tag}`) }).count()).resolves.toBe(0);
    // Move focus off the last select so its closing panel does not sit over the screenshot.
    await page.getByRole('heading', { name: 'Members' }).click();
    await screenshot(page, 'membership-roster-filtered');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Export CSV' }).click(),
    ]);
    const csv = readFileSync((await download.path())!, 'utf8');
    const lines = csv.trim().split('\r\n');
    expect(lines[0]).toMatch(/^Member number,Name,E-mail,Plan,Status/);
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain(`Pim Haverkamp ${tag}`);
    expect(lines[1]).toContain('Lapsed');
    await page.close();
  });

  it('lets the treasurer record cash at the field and see it in the history and the dues summary', async () => {
    await memberSince('Sigrun Oakes', '2026-06-10');
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Dale Ledger');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, treasurer.email, treasurer.password);
    await page.goto(`${site.baseUrl}/console/members`);
    await page.getByLabel('Search name, e-mail or number').fill(`Sigrun Oakes ${tag}`);
    await page
      .getByRole('row', { name: new RegExp(`Sigrun Oakes ${tag}`) })
      .getByRole('link')
      .click();
    await page.getByRole('heading', { name: /Sigrun Oakes/ }).waitFor();
    await page.getByLabel('Amount (CAD)').fill('45.00');
    await page.getByLabel('Receipt number').fill('GF-0712');
    await page.getByRole('button', { name: 'Record payment' }).click();
    await page.getByText('Payment GF-0712 recorded').waitFor();
    await page.getByRole('cell', { name: /#GF-0712/ }).waitFor();
    await page.getByText('Jan 1, 2027 to Dec 31, 2027').first().waitFor();
    await screenshot(page, 'membership-member-detail');
    await page.goto(`${site.baseUrl}/console/members/summary`);
    await page.getByRole('heading', { name: 'Collected per month and plan' }).waitFor();
    await page.getByRole('cell', { name: '2026-11' }).first().waitFor();
    await screenshot(page, 'membership-dues-summary');
    await page.close();
  });

  it('tells staff at check-in what is claimed and what is checked, and whether the card is unknown', async () => {
    const user = await memberSince('Rhosyn Tallow', '2026-06-10', {
      associationNumber: 'NA-808',
      associationExpires: '2027-04-30',
    });
    const memberClient = new Client(t.app);
    await memberClient.signIn(user);
    const token: string = (await memberClient.get('/api/membership/card')).body.card.token;
    const editor = await createUser(t.deps.db, ['fan', 'editor'], 'Range Volunteer');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, editor.email, editor.password);
    await page.goto(`${site.baseUrl}/console/check-in`);
    await page.getByLabel('Card code').fill(token);
    await page.getByRole('button', { name: 'Check' }).click();
    // The association details are the member's own claim: shown in words, and not cleared to fly.
    await page
      .getByTestId('check-in-verdict')
      .getByText(/Not cleared to fly/)
      .waitFor();
    await page
      .getByTestId('answer-association')
      .getByText(/NA-808 to Apr 30, 2027: claimed, not yet checked/)
      .waitFor();
    await screenshot(page, 'membership-check-in-claimed');
    const treasurer = new Client(t.app);
    await treasurer.signIn(await createUser(t.deps.db, ['fan', 'treasurer'], 'Card Checker'));
    const row = await t.deps.db('memberships').where('user_id', user.id).first('id');
    const verified = await treasurer.post(`/api/admin/members/${row.id}/verifications`, {
      what: 'association',
      against: 'association card, seen at the field',
      associationNumber: 'NA-808',
      associationExpires: '2027-04-30',
    });
    expect(verified.status).toBe(200);
    await page.getByLabel('Card code').fill(token);
    await page.getByRole('button', { name: 'Check' }).click();
    await page
      .getByTestId('check-in-verdict')
      .getByText(/May fly/)
      .waitFor();
    await page
      .getByTestId('answer-association')
      .getByText(/checked .* by Card Checker against association card/)
      .waitFor();
    await screenshot(page, 'membership-check-in-valid');
    await page.getByLabel('Card code').fill(token.slice(0, -2) + 'xx');
    await page.getByRole('button', { name: 'Check' }).click();
    await page
      .getByTestId('check-in-verdict')
      .getByText(/Unknown card/)
      .waitFor();
    await page.close();
  });

  it('lets the treasurer add a plan in the console, typed in dollars, that members then see', async () => {
    const code = `crew-${tag.toLowerCase()}`;
    const treasurer = await createUser(t.deps.db, ['fan', 'treasurer'], 'Dale Ledger');
    const page = await browser.newPage();
    await signInThroughForm(page, site.baseUrl, treasurer.email, treasurer.password);
    await page.goto(`${site.baseUrl}/console/members/summary`);
    await page.getByTestId('plan-table').waitFor();
    await page.getByRole('button', { name: 'Add a plan' }).click();
    // The dialog moves focus after it renders, which can come after the click returns.
    await page.waitForFunction(() => document.activeElement?.hasAttribute('formcontrolname'));
    await expect(page.evaluate(() => document.activeElement?.getAttribute('formcontrolname'))).resolves.toBe('code');
    await page.keyboard.type(code);
    await page.getByLabel('Name', { exact: true }).fill('Range crew');
    await page.getByLabel('Dues a term (CAD)').fill('12.50');
    await page.getByLabel('Joining fee (CAD)').fill('5.00');
    await page.getByRole('button', { name: 'Add plan' }).click();
    await page.getByRole('status').getByText('Plan Range crew saved.').waitFor();
    await page
      .getByRole('row', { name: new RegExp(code) })
      .getByRole('cell', { name: '$12.50' })
      .waitFor();
    await screenshot(page, 'membership-plan-added');
    const listed = (await new Client(t.app).get('/api/membership/plans')).body.items.find(
      (p: { code: string }) => p.code === code,
    );
    expect(listed).toEqual(expect.objectContaining({ name: 'Range crew', duesCents: 1250, joiningFeeCents: 500 }));
    await page.close();
  });
});
