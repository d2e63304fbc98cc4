import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousViolations } from '../helpers/axe';
import { launchBrowser, screenshot, serve, signInThroughForm } from '../helpers/browser';
import { writeQrVideo } from '../helpers/fake-camera';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { createUser } from '../helpers/users';
import { syntheticAltimeterLog } from '../../seeds/05_launches';
import { memberWithCard } from '../api/launch-fixtures';

// A new user's whole launch day, on phones: the range officer puts the day on the calendar, a member replies from
// the calendar, is checked in by the camera reading their member card, files a card, the range officer clears it and
// records how it went, the flyer adds the altimeter log, and the logbook and the day's results show the flight.
// launches.e2e.test.ts covers refusals at the range table (a card beyond the flyer's certification, a bad motor).

// A phone held at the range table (a common 6.1-inch screen, in CSS pixels), and a laptop at home.
const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
const DESKTOP = { viewport: { width: 1366, height: 900 } };
const today = new Intl.DateTimeFormat('en-CA', {
  timeZone: 'America/Winnipeg',
  year: 'numeric',
  month: '2-digit',
  day: '2-digit',
}).format(new Date());
const title = `Walk-through fly day ${Date.now().toString(36)}`;

let t: TestApp;
let site: { baseUrl: string; stop(): Promise<void> };
/** The member's own browser, and the range officer's, whose camera films the member's card. */
let browser: Browser;
let cameraBrowser: Browser;
let videoDir: string;
let member: Awaited<ReturnType<typeof memberWithCard>>;

beforeAll(async () => {
  // The real clock: the browser's own "today" picks the launch on the range table.
  t = buildTestApp({ clock: fixedClock(new Date().toISOString()) });
  site = await serve(t);
  member = await memberWithCard(t, { name: 'Philippa Windrow', certificationLevel: 'L1' });
  // The legal name is on the card and the check-in; public pages show the name the member goes by.
  await t.deps.db('users').where('id', member.user.id).update({ display_name: 'Pippa W.' });
  videoDir = mkdtempSync(path.join(os.tmpdir(), 'padside-camera-'));
  const video = path.join(videoDir, 'member-card.y4m');
  writeQrVideo(video, member.token);
  browser = await launchBrowser();
  cameraBrowser = await launchBrowser([
    '--use-fake-ui-for-media-stream',
    '--use-fake-device-for-media-stream',
    `--use-file-for-fake-video-capture=${video}`,
  ]);
});
afterAll(async () => {
  await browser?.close();
  await cameraBrowser?.close();
  await site?.stop();
  await t?.close();
  if (videoDir) rmSync(videoDir, { recursive: true, force: true });
});

/** A page whose uncaught errors and console errors are kept, to be empty at the end. */
async function open(b: Browser, options: object): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await b.newContext(options);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (err) => errors.push(`${page.url()}: ${err.message}`));
  page.on('console', (m) => m.type() === 'error' && errors.push(`${page.url()}: ${m.text()}`));
  return { context, page, errors };
}

/** Nothing wider than the phone: usable without sideways scrolling. */
const pageWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

describe('a launch day walked through on phones', () => {
  it('goes from a new launch day to the flight in the logbook and the results, with the camera checking the member in', async () => {
    const officer = await open(cameraBrowser, PHONE);
    const flyer = await open(browser, PHONE);
    const o = officer.page;
    const f = flyer.page;
    const staff = await createUser(t.deps.db, ['fan', 'range_officer'], 'Walk-through Officer');

    // The range officer adds the day in the console.
    await signInThroughForm(o, site.baseUrl, staff.email, staff.password);
    await o.goto(`${site.baseUrl}/console/launches`);
    await o.getByLabel('Title').fill(title);
    await o.getByLabel('Date').fill(today);
    await o.getByLabel('Name', { exact: true }).fill('Coulee Flats Field');
    await o.getByLabel('Address').fill('Range Road 41, Gopher Flats, MB');
    await o.getByLabel('Altitude ceiling (m, from the airspace arrangement)').fill('600');
    await o.getByLabel('Notes for flyers').fill('Pads 5 and 6 for high power.');
    await o.getByRole('button', { name: 'Add to the calendar' }).click();
    await o.getByText('Launch day added to the calendar.').waitFor();
    const day = o.locator('li.launch', { hasText: title });
    await day.waitFor();
    expect(await seriousViolations(o)).toEqual([]);
    expect(await pageWidth(o)).toBeLessThanOrEqual(390);
    await screenshot(o, 'walkthrough-1-launch-added-phone');

    // The member finds the day on the calendar and replies.
    await signInThroughForm(f, site.baseUrl, member.user.email, member.user.password);
    await f.goto(`${site.baseUrl}/launches`);
    await f.getByTestId('upcoming-launches').getByRole('link', { name: title }).click();
    await f.getByRole('heading', { name: title }).waitFor();
    await f.getByTestId('rsvp-yes').click();
    await f.getByText('You are coming ✓').waitFor();
    await f.getByText('show your member card at the range table').waitFor();
    expect(await seriousViolations(f)).toEqual([]);
    await screenshot(f, 'walkthrough-2-rsvp-phone');

    // At the field the range officer opens the range table and points the camera at the member card.
    await day.getByRole('link', { name: 'Range table' }).click();
    await o.getByRole('heading', { name: `Range table: ${title}` }).waitFor();
    await o.getByTestId('scan-with-camera').click();
    await o.getByTestId('check-in-answer').getByText('Checked in: Philippa Windrow').waitFor();
    // The scan stops the camera and hides the preview; the typed code stays for a card the camera cannot read.
    expect(await o.locator('video').evaluate((v: HTMLVideoElement) => v.srcObject === null && v.hidden)).toBe(true);
    await o.getByTestId('check-in-token').waitFor();
    await o.getByRole('button', { name: 'Scan with camera' }).waitFor();
    expect(await seriousViolations(o)).toEqual([]);
    await screenshot(o, 'walkthrough-3-camera-check-in-phone');

    // Now checked in, the member files a card that is above the day's ceiling and needs high power.
    await f.reload();
    await f.getByTestId('file-card').click();
    await f.getByLabel('Rocket name').fill('Prairie Lantern');
    await f.getByLabel('Liftoff mass (g, with motors)').fill('1800');
    await f.getByLabel('Motor 1').fill('H128W-M');
    await f.getByLabel('Expected altitude (m)').fill('650');
    await f.getByLabel('Pad (if the range table gave you one)').fill('5');
    await f.getByRole('button', { name: 'File the card' }).click();
    const warnings = f.getByTestId('card-warnings');
    await warnings.getByText(/expected altitude of 650 m is above this launch's ceiling of 600 m/).waitFor();
    await warnings.getByText(/This looks like a high-power flight/).waitFor();
    await f
      .getByRole('note', { name: 'Who decides' })
      .getByText('The range safety officer decides what flies')
      .waitFor();
    expect(await seriousViolations(f)).toEqual([]);
    expect(await pageWidth(f)).toBeLessThanOrEqual(390);
    await screenshot(f, 'walkthrough-4-card-filed-phone');

    // The range officer clears it on the phone and records the outcome after the flight.
    await o.getByRole('button', { name: 'Refresh' }).click();
    const card = o.locator('li.card', { hasText: 'Prairie Lantern' });
    await card.getByText(/above this launch's ceiling/).waitFor();
    await card.getByRole('button', { name: 'Approve' }).click();
    await card.getByText('Cleared to fly').waitFor();
    await card.getByLabel('How it ended').click();
    await o.getByRole('option', { name: 'Recovered', exact: true }).click();
    await card.getByLabel('Notes').fill('Main out at 150 m, landed in the stubble.');
    await card.getByRole('button', { name: 'Record outcome' }).click();
    await card.getByText('Outcome: Recovered · Main out at 150 m, landed in the stubble.').waitFor();
    expect(await seriousViolations(o)).toEqual([]);
    expect(await pageWidth(o)).toBeLessThanOrEqual(390);
    await screenshot(o, 'walkthrough-5-range-table-phone');

    // The flyer opens the flight page from the filed card and adds the altimeter log over a slow field connection.
    await f.getByRole('link', { name: 'Open the flight page' }).click();
    await f.getByTestId('flight-status').getByText('Flown').waitFor();
    const cdp = await flyer.context.newCDPSession(f);
    await cdp.send('Network.enable');
    // About 20 kB a second up: a weak phone signal, so the upload's progress shows.
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 100,
      downloadThroughput: 500_000,
      uploadThroughput: 20_000,
    });
    const log = syntheticAltimeterLog({ boostMps2: 60, burnS: 1.6, descentMps: 6 });
    await f
      .locator('#flight-log-file')
      .setInputFiles({ name: 'prairie-lantern.csv', mimeType: 'text/csv', buffer: Buffer.from(log) });
    await f.getByRole('table', { name: /First rows of prairie-lantern.csv/ }).waitFor();
    await f.getByRole('button', { name: 'Upload and analyse' }).click();
    await f.getByRole('progressbar', { name: /^Uploading: \d+%$/ }).waitFor();
    await screenshot(f, 'walkthrough-6-upload-progress-phone');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 0,
      downloadThroughput: -1,
      uploadThroughput: -1,
    });
    // 0.5 x 60 x 1.6^2 + 96^2 / (2 x 9.80665) = 76.8 + 469.9 = 546.7 m (constant-acceleration kinematics, analytic).
    await f
      .getByTestId('flight-summary')
      .getByText(/^54[67](\.\d)? m$/)
      .waitFor();
    await f.locator('canvas').first().waitFor();
    await f.getByRole('note', { name: 'Who decides' }).waitFor();
    // The upload component's hidden file input (opened by its labelled button) is left to that component's owner.
    expect(await seriousViolations(f, ['#flight-log-file'])).toEqual([]);
    expect(await pageWidth(f)).toBeLessThanOrEqual(390);
    await screenshot(f, 'walkthrough-7-flight-page-phone');

    // The logbook counts the flight and its height.
    await f.goto(`${site.baseUrl}/account/flights`);
    await f.getByRole('link', { name: 'Prairie Lantern', exact: true }).waitFor();
    await f
      .getByTestId('logbook-totals')
      .getByText(/^54[67] m$/)
      .waitFor();
    expect(await seriousViolations(f)).toEqual([]);
    expect(await pageWidth(f)).toBeLessThanOrEqual(390);
    await screenshot(f, 'walkthrough-8-logbook-phone');

    // The range officer closes the day; the calendar then links its results.
    await o.goto(`${site.baseUrl}/console/launches`);
    await day.getByRole('button', { name: 'Close the day' }).click();
    await day.getByText('Flown and closed').waitFor();
    await f.goto(`${site.baseUrl}/launches`);
    // Closed on its own date, the day is over: it moves from "Coming up" to the recent days.
    await f.getByRole('heading', { name: 'Recent' }).waitFor();
    expect(await f.getByTestId('upcoming-launches').getByText(title).count()).toBe(0);
    await f.locator('li.launch', { hasText: title }).getByRole('link', { name: 'Results' }).click();
    const row = f.getByRole('row', { name: /Prairie Lantern/ });
    await row.getByText('Recovered').waitFor();
    await row.getByText(/^54[67] m$/).waitFor();
    await f.getByText('Highest').waitFor();
    expect(await seriousViolations(f)).toEqual([]);
    expect(await pageWidth(f)).toBeLessThanOrEqual(390);
    await screenshot(f, 'walkthrough-9-results-phone');
    const resultsUrl = f.url();

    expect(officer.errors).toEqual([]);
    expect(flyer.errors).toEqual([]);
    await officer.context.close();
    await flyer.context.close();

    // At home on a laptop: the calendar and the day's results.
    const desk = await open(browser, DESKTOP);
    await desk.page.goto(`${site.baseUrl}/launches`);
    await desk.page.locator('li.launch', { hasText: title }).getByText('Flown and closed').waitFor();
    expect(await seriousViolations(desk.page)).toEqual([]);
    await screenshot(desk.page, 'walkthrough-10-calendar-desktop');
    await desk.page.goto(resultsUrl);
    await desk.page
      .getByRole('row', { name: /Prairie Lantern/ })
      .getByText('Pippa W.')
      .waitFor();
    expect(await desk.page.getByText('Philippa Windrow').count()).toBe(0);
    expect(await seriousViolations(desk.page)).toEqual([]);
    await screenshot(desk.page, 'walkthrough-11-results-desktop');
    expect(desk.errors).toEqual([]);
    await desk.context.close();
  });
});

describe('the certification classes screen on a phone', () => {
  it('is reached from the console navigation and puts a class list it cannot read beside its field', async () => {
    const { context, page, errors } = await open(browser, PHONE);
    const staff = await createUser(t.deps.db, ['fan', 'range_officer'], 'Classes Officer');
    await signInThroughForm(page, site.baseUrl, staff.email, staff.password);
    await page.goto(`${site.baseUrl}/console`);
    await page.getByRole('button', { name: 'Console sections' }).click();
    await page.getByRole('link', { name: 'Certification classes' }).click();
    const level1 = page.getByLabel('Level 1: classes allowed');
    await level1.waitFor();
    const saved = await level1.inputValue();
    expect(saved).toMatch(/^[A-Z]/);
    await level1.fill('A-G, 7');
    await page.getByRole('button', { name: 'Save the classes' }).click();
    await page.getByText('Use letters and ranges such as "A-G" or "H, I".').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    expect(await pageWidth(page)).toBeLessThanOrEqual(390);
    await screenshot(page, 'walkthrough-certification-classes-phone');
    // Suites share the club's settings: the same classes go back, so nothing another suite reads changes.
    await level1.fill(saved);
    await page.getByRole('button', { name: 'Save the classes' }).click();
    await page.getByText('Saved.', { exact: false }).waitFor();
    expect(await level1.inputValue()).toBe(saved);
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('the console check-in with the camera', () => {
  it('reads the member card from the camera, and asks for a reload when the page was opened inside the app', async () => {
    const { context, page, errors } = await open(cameraBrowser, PHONE);
    const staff = await createUser(t.deps.db, ['fan', 'treasurer'], 'Gate Treasurer');
    await signInThroughForm(page, site.baseUrl, staff.email, staff.password);
    // Opened inside the app from a page without the camera: the browser keeps that page's policy, so the camera is
    // refused until a full load of the check-in page.
    await page.goto(`${site.baseUrl}/console`);
    await page.evaluate(() => {
      history.pushState({}, '', '/console/check-in');
      dispatchEvent(new PopStateEvent('popstate'));
    });
    await page.getByRole('heading', { name: 'Launch check-in' }).waitFor();
    await page.getByTestId('scan-with-camera').click();
    await page.getByRole('alert').getByText('The camera is only offered when this page is opened directly.').waitFor();
    await screenshot(page, 'walkthrough-check-in-reload-phone');
    await page.getByRole('button', { name: 'Reload this page' }).click();
    await page.getByRole('heading', { name: 'Launch check-in' }).waitFor();
    await page.getByTestId('scan-with-camera').click();
    const verdict = page.getByTestId('check-in-verdict');
    await verdict.getByText('Philippa Windrow (member').waitFor();
    // The fixture's member has paid dues but no association membership on record.
    await verdict.getByRole('heading', { name: 'Not cleared to fly: see the answers below' }).waitFor();
    expect(await page.locator('video').evaluate((v: HTMLVideoElement) => v.srcObject === null && v.hidden)).toBe(true);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'walkthrough-check-in-camera-phone');
    expect(errors).toEqual([]);
    await context.close();
  });
});
