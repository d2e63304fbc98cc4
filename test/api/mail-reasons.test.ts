import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { commercialMail } from '../../server/announcements/commercial-mail';
import { MAIL_REASONS, type TransactionalTemplate } from '../../server/mail/mail-reasons';
import { enqueueEmail } from '../../server/mail/outbox';
import { waitForEmails, type CaughtEmail } from '../helpers/maildev';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';
import { MB_ADDRESS, methodId, openShirt } from './shop-fixtures';

// The templates built with CommercialMailer: they carry the commercial footer and headers, not a reason line.
const COMMERCIAL = new Set(['announcement', 'drop-notice', 'announcement-test', 'membership-roster-news']);

/** Every `template:` value written in server/: plain names, and patterns for names built from a template literal. */
function templatesInCode(): { names: Set<string>; patterns: RegExp[] } {
  const names = new Set<string>();
  const patterns: RegExp[] = [];
  const walk = (dir: string): string[] =>
    readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
      e.isDirectory() ? walk(join(dir, e.name)) : e.name.endsWith('.ts') ? [join(dir, e.name)] : [],
    );
  for (const file of walk(join(__dirname, '../../server'))) {
    if (file.endsWith(join('mail', 'mail-reasons.ts'))) continue;
    for (const [, value] of readFileSync(file, 'utf8').matchAll(/\btemplate: ([^,;}\n]+)/g)) {
      for (const [, name] of value.matchAll(/'([a-z0-9-]+)'/g)) names.add(name);
      for (const [, prefix] of value.matchAll(/`([a-z0-9-]+)\$\{/g)) patterns.push(new RegExp(`^${prefix}[a-z0-9-]+$`));
    }
  }
  return { names, patterns };
}

describe('the reason line of transactional mail (server/mail/mail-reasons.ts)', () => {
  const reasons = Object.keys(MAIL_REASONS) as TransactionalTemplate[];
  const code = templatesInCode();

  it('finds the templates the code queues (the scan itself works)', () => {
    expect([...code.names]).toEqual(
      expect.arrayContaining([
        'shop-order-confirmation',
        'membership-receipt',
        'password-reset',
        'launch-reminder',
        'announcement',
      ]),
    );
    expect(code.patterns.map(String)).toContain(String(/^membership-[a-z0-9-]+$/));
  });

  it('gives every template the code queues a reason, unless it is commercial mail', () => {
    const missing = [...code.names].filter((n) => !COMMERCIAL.has(n) && !(n in MAIL_REASONS));
    expect(missing).toEqual([]);
    for (const p of code.patterns) expect(reasons.filter((r) => p.test(r)).length).toBeGreaterThan(0);
  });

  it('holds no reason for a template the code never queues, and none for commercial templates', () => {
    const unused = reasons.filter((r) => !code.names.has(r) && !code.patterns.some((p) => p.test(r)));
    expect(unused).toEqual([]);
    expect(reasons.filter((r) => COMMERCIAL.has(r))).toEqual([]);
  });

  it('says every reason as a sentence that uses the facts it is given', () => {
    for (const template of reasons) {
      const facts = new Proxy({}, { get: (_, key) => `«${String(key)}»` });
      const text = (MAIL_REASONS[template] as (f: unknown) => string)(facts);
      expect({ template, ok: /^[a-z].{20,}\.$/.test(text) && !text.includes('undefined') }).toEqual({
        template,
        ok: true,
      });
    }
  });
});

describe('the outbox appends the reason', () => {
  let t: TestApp;
  let staff: Client;
  beforeAll(async () => {
    t = buildTestApp();
    staff = (await signedIn(t.app, t.deps.db, ['fan', 'treasurer'])).client;
  });
  afterAll(() => t.close());

  it('ends a shop receipt e-mail with its reason, as sent through SMTP, with no List-Unsubscribe header', async () => {
    const shirt = await openShirt(staff, { cap: 30, priceCents: 3500 });
    const email = `why-receipt-${Date.now()}@example.test`;
    const c = new Client(t.app);
    const res = await c.post('/api/orders', {
      items: [{ variantId: shirt.variants[0].id, quantity: 1 }],
      shipTo: MB_ADDRESS,
      shippingMethodId: await methodId(c, 'canada'),
      email,
      paymentToken: 'tok_visa',
    });
    expect(res.status).toBe(201);
    const number: string = res.body.order.number;
    expect(number).toMatch(/^PS-/);
    await t.deps.mail.deliverDue();
    const [mail] = (await waitForEmails(email, /order PS-/)) as (CaughtEmail & { headers: Record<string, string> })[];
    expect(
      mail.text
        .trimEnd()
        .endsWith(
          `\n--\nWhy you got this: you placed order ${number} with ${t.deps.config.site.teamName}, and this e-mail is its receipt.`,
        ),
    ).toBe(true);
    expect(mail.headers['message-id']).toBeDefined();
    expect(mail.headers['list-unsubscribe']).toBeUndefined();
    const [row] = await t.deps.db('outbound_emails').where({ to_address: email, template: 'shop-order-confirmation' });
    expect(row).toMatchObject({ category: 'transactional', headers: null, list: null });
  });

  it('adds the reason to an HTML body too, escaped, after a rule', async () => {
    const to = `why-html-${Date.now()}@example.test`;
    await t.deps.db.transaction((trx) =>
      enqueueEmail(trx, {
        to,
        subject: 'Order mail',
        text: 'Thanks.\n',
        html: '<p>Thanks.</p>',
        template: 'shop-order-refund',
        reason: { order: 'PS-<0042>' },
      }),
    );
    const [row] = await t.deps.db('outbound_emails').where('to_address', to);
    expect(row.text_body).toBe(
      'Thanks.\n\n--\nWhy you got this: we refunded money on your order PS-<0042>; each refund gets one e-mail.',
    );
    expect(row.html_body).toBe(
      '<p>Thanks.</p>\n<hr>\n<p style="font-size:12px;color:#555">Why you got this: we refunded money on your order PS-&lt;0042&gt;; each refund gets one e-mail.</p>',
    );
  });

  it('leaves commercial mail to its own footer and one-click headers, without a reason line', async () => {
    const to = `why-commercial-${Date.now()}@example.test`;
    const mail = commercialMail(
      { topic: 'launches', subject: 'Next launch', markdown: 'See you at the field.', template: 'announcement' },
      {
        email: to,
        why: 'you asked for launch day e-mails',
        oneClickUrl: 'http://127.0.0.1/one-click',
        pageUrl: 'http://127.0.0.1/page',
      },
      { teamName: 'Thrust & Filament', mailingAddress: 'Box 1, Gopher Flats MB', contactEmail: 'team@example.test' },
    );
    await t.deps.db.transaction((trx) => enqueueEmail(trx, mail));
    const [row] = await t.deps.db('outbound_emails').where('to_address', to);
    expect(row.category).toBe('commercial');
    expect(row.text_body).toBe(mail.text);
    expect(row.text_body).toContain('You get this because you asked for launch day e-mails.');
    expect(row.text_body).not.toContain('Why you got this');
    expect(row.headers).toEqual({
      'List-Unsubscribe': '<http://127.0.0.1/one-click>',
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    });
  });
});
