import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import request from 'supertest';
import type { PadsideApp } from '../../server/app';
import type { Client } from '../helpers/users';

let ipCounter = 0;

/** A new address for one test. */
export const address = (tag: string) => `${tag}-${randomUUID().slice(0, 8)}@example.test`;

/** A sign-up from its own network address (the per-address limit of the endpoint stays out of the way). */
export function signUp(client: Client, body: object) {
  ipCounter++;
  return client.token().then((token) =>
    client.agent
      .post('/api/subscriptions')
      .set('X-CSRF-Token', token)
      .set('X-Forwarded-For', `10.77.${Math.floor(ipCounter / 250) % 250}.${(ipCounter % 250) + 1}`)
      .send(body),
  );
}

/** The confirmation token from the latest confirmation mail queued for the address. */
export async function confirmToken(db: Knex, email: string): Promise<string> {
  const mail = await db('outbound_emails')
    .where({ to_address: email, template: 'subscription-confirm' })
    .orderBy('id', 'desc')
    .first();
  if (!mail) throw new Error(`no confirmation mail for ${email}`);
  return /confirm\?token=([A-Za-z0-9_-]+)/.exec(mail.text_body)![1];
}

/** An address confirmed on a list, through the sign-up and the confirmation link. */
export async function confirmedSubscriber(
  app: PadsideApp,
  client: Client,
  db: Knex,
  email: string,
  topics: string[],
  productId?: number,
): Promise<void> {
  const res = await signUp(client, { email, topics, productId });
  if (res.status !== 202) throw new Error(`sign-up: ${res.status} ${JSON.stringify(res.body)}`);
  await app.platform.auth.afterAnswer.settled();
  const confirmed = await request(app).get(`/api/subscriptions/confirm?token=${await confirmToken(db, email)}`);
  if (confirmed.status !== 200) throw new Error(`confirm: ${confirmed.status} ${JSON.stringify(confirmed.body)}`);
}

/** Mail the outbox holds for an address from one announcement. */
export const announcementMail = (db: Knex, email: string, announcementId: number) =>
  db('outbound_emails').where({ to_address: email, announcement_id: announcementId });

/** The one-click address from a queued mail's List-Unsubscribe header. */
export function oneClickUrl(row: { headers: Record<string, string> | null }): string {
  const header = row.headers?.['List-Unsubscribe'];
  if (!header) throw new Error('no List-Unsubscribe header');
  return /^<(.+)>$/.exec(header)![1];
}

/** Addresses with a confirmed express consent written straight to the table (for audiences too big to sign up one by one). */
export async function bulkConfirmed(db: Knex, emails: string[], topic: string): Promise<void> {
  const now = new Date();
  const row = (email: string) => ({
    email,
    topic,
    wording_version: 'test',
    wording_text: 'Test consent.',
    source_page: 'home',
    source_ip: '127.0.0.1',
    requested_at: now,
    confirmed_at: now,
    confirmed_ip: '127.0.0.1',
    confirmed_how: 'email-link',
  });
  await db.batchInsert('subscriptions', emails.map(row), 500);
}
