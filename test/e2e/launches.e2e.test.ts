import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { browserSuite, recordRequests, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { fixedClock, type TestApp } from '../helpers/test-app';
import { createUser, signedIn, type Client } from '../helpers/users';
import { syntheticAltimeterLog } from '../../seeds/05_launches';
import { createLaunch, memberWithCard } from '../api/launch-fixtures';

// A phone held at the range table (a common 6.1-inch screen, in CSS pixels).
const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
const today = new Intl.DateTimeFormat('en-CA', {
  timeZone: 'America/Winnipeg',
  year: 'numeric',
  month: '2-digit',
  day: '2-digit',
}).format(new Date());

let t: TestApp;
let browser: Browser;
let site: Site;
let rso: Client;
let launchId: number;

// The real clock: the browser's own "today" picks the launch on the range table.
browserSuite({ clock: fixedClock(new Date().toISOString()) }, async (s) => {
  ({ t, site, browser } = s);
  rso = (await signedIn(t.app, t.deps.db, ['fan', 'range_officer'])).client;
  launchId = await createLaunch(rso, today, {
    title: `Phone test launch ${Date.now().toString(36)}`,
    ceilingMetres: 600,
  });
});

async function phone(): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext(PHONE);
  return { context, page: await context.newPage() };
}

describe('launch day on a phone', () => {
  it('lets a checked-in member file a card and the range officer refuse, approve and record it from the queue', async () => {
    const m = await memberWithCard(t, { name: 'Ottoline Fairweather' });
    const flyer = await phone();
    const requests = recordRequests(flyer.page);
    await signInThroughForm(flyer.page, site.baseUrl, m.user.email, m.user.password);

    // The calendar and the launch page; the member is not checked in yet.
    await flyer.page.goto(`${site.baseUrl}/launches`);
    await flyer.page.getByTestId('upcoming-launches').waitFor();
    expect(await seriousViolations(flyer.page)).toEqual([]);
    await flyer.page.goto(`${site.baseUrl}/launches/${launchId}`);
    await flyer.page.getByTestId('rsvp-yes').click();
    await flyer.page.getByText('You are coming ✓').waitFor();
    await flyer.page.getByText('show your member card at the range table').waitFor();

    // The range officer checks the member in from the range table on another phone.
    const officer = await phone();
    const staff = await createUser(t.deps.db, ['fan', 'range_officer'], 'Range Phone');
    await signInThroughForm(officer.page, site.baseUrl, staff.email, staff.password);
    await officer.page.goto(`${site.baseUrl}/console/range/${launchId}`);
    await officer.page.getByTestId('check-in-token').fill(m.token);
    await officer.page.getByRole('button', { name: 'Check in' }).click();
    await officer.page.getByTestId('check-in-answer').getByText('Ottoline Fairweather').waitFor();

    // The flyer files a high-power card without a verified certification, then a small one.
    await flyer.page.reload();
    await flyer.page.getByTestId('file-card').click();
    await flyer.page.getByLabel('Rocket name').fill('Big Bale');
    await flyer.page.getByLabel('Liftoff mass (g, with motors)').fill('1800');
    await flyer.page.getByLabel('Motor 1').fill('H128W-M');
    await flyer.page.getByLabel('Pad (if the range table gave you one)').fill('5');
    await flyer.page.getByRole('button', { name: 'File the card' }).click();
    await flyer.page
      .getByTestId('card-warnings')
      .getByText(/high-power flight/)
      .waitFor();
    expect(await seriousViolations(flyer.page)).toEqual([]);
    await screenshot(flyer.page, 'launches-card-filed-phone');
    await flyer.page.getByRole('button', { name: 'File another card' }).click();
    await flyer.page.getByLabel('Rocket name').fill('Little Gopher');
    await flyer.page.getByLabel('Liftoff mass (g, with motors)').fill('90');
    await flyer.page.getByLabel('Motor 1').fill('bogus');
    await flyer.page.getByRole('button', { name: 'File the card' }).click();
    // The server's word beside the motor field.
    await flyer.page.getByText(/Padside cannot read "BOGUS"|Padside cannot read "bogus"/).waitFor();
    await flyer.page.getByLabel('Motor 1').fill('C6-5');
    await flyer.page.getByRole('button', { name: 'File the card' }).click();
    await flyer.page.getByTestId('filed-card').getByText('Card filed for Little Gopher').waitFor();

    // The queue: the high-power card cannot be cleared; the small one can, then gets its outcome.
    await officer.page.getByRole('button', { name: 'Refresh' }).click();
    const big = officer.page.locator('li.card', { hasText: 'Big Bale' });
    const small = officer.page.locator('li.card', { hasText: 'Little Gopher' });
    await big.waitFor();
    await officer.page.getByText('Pad 5').waitFor();
    await officer.page.getByText('range safety officer decides', { exact: false }).first().waitFor();
    await big.getByRole('button', { name: 'Approve' }).click();
    await big
      .getByRole('alert')
      .getByText(/beyond the flyer/)
      .waitFor();
    await small.getByRole('button', { name: 'Approve' }).click();
    await small.getByText('Cleared to fly').waitFor();
    await small.getByLabel('How it ended').click();
    await officer.page.getByRole('option', { name: 'Caught in a tree' }).click();
    await small.getByRole('button', { name: 'Record outcome' }).click();
    await small.getByText('Outcome: Caught in a tree').waitFor();
    await big.getByLabel('Reason to send back').fill('Needs a verified level 1 first');
    await big.getByRole('button', { name: 'Send back' }).click();
    await big.getByText('Sent back: Needs a verified level 1 first').waitFor();
    expect(await seriousViolations(officer.page)).toEqual([]);
    // Nothing wider than the phone: the queue is usable without sideways scrolling.
    expect(await officer.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(officer.page, 'launches-range-table-phone');

    // The flyer adds the altimeter log on the flight page and sees the summary and the chart.
    await small.getByRole('link', { name: 'Flight page' }).click();
    await officer.page.getByTestId('flight-status').waitFor();
    const flightUrl = officer.page.url();
    await flyer.page.goto(flightUrl);
    await flyer.page.getByText('range safety officer decides', { exact: false }).first().waitFor();
    await flyer.page.locator('#flight-log-file').setInputFiles({
      name: 'little-gopher.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(syntheticAltimeterLog({ boostMps2: 50, burnS: 1.5, descentMps: 5 })),
    });
    await flyer.page.getByRole('button', { name: 'Upload and analyse' }).click();
    // 56.25 + 75^2 / (2 x 9.80665) = 343 m (constant-acceleration kinematics, analytic).
    await flyer.page
      .getByTestId('flight-summary')
      .getByText(/^34[23](\.\d)? m$/)
      .waitFor();
    await flyer.page.locator('canvas').first().waitFor();
    // The upload component's hidden file input (opened by its labelled button) is left to that component's owner.
    expect(await seriousViolations(flyer.page, ['#flight-log-file'])).toEqual([]);
    await screenshot(flyer.page, 'launches-flight-page-phone');

    // The flyer's logbook shows both cards.
    await flyer.page.goto(`${site.baseUrl}/account/flights`);
    await flyer.page.getByTestId('logbook-totals').waitFor();
    await flyer.page.getByRole('link', { name: 'Big Bale', exact: true }).waitFor();
    await flyer.page
      .getByTestId('logbook-totals')
      .getByText(/^34[23] m$/)
      .waitFor();
    expect(requests.every((u) => u.startsWith(site.baseUrl) || u.startsWith('data:'))).toBe(true);
    await flyer.context.close();
    await officer.context.close();
  });
});
