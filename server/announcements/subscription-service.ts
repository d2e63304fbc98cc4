import type { Knex } from 'knex';
import type {
  ConfirmedSignUp,
  ConsentWording,
  MySubscription,
  UnsubscribeTarget,
} from '../../contracts/announcements/subscription-answers';
import type { SignUp } from '../../contracts/announcements/subscription-schemas';
import { hashToken, newToken } from '../auth/single-use-token';
import { enqueueEmail } from '../mail/outbox';
import { SuppressionList } from '../mail/suppression-list';
import type { AfterAnswer } from '../platform/after-answer';
import { AppError, badRequest } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { FailureLimiter } from '../platform/rate-limit';
import { CONSENT_WORDING } from './consent-wording';
import { confirmSubscriptionMail } from './subscription-mail';
import type { SubscriptionRepository } from './subscription-repository';
import { TOPIC_LABELS, TOPICS, type MailList, type Topic } from './topics';
import type { UnsubscribeTokens } from './unsubscribe-token';

const CONFIRM_TTL_DAYS = 7;

/** Sign-ups with double opt-in, confirmation, one-click withdrawal, and the signed-in person's own lists. */
export class SubscriptionService {
  // Mail floods: sign-ups per address and per network address (common practice, no source).
  private readonly perAddress: FailureLimiter;
  private readonly perIp: FailureLimiter;
  private readonly suppressions: SuppressionList;

  constructor(
    private readonly db: Knex,
    private readonly repo: SubscriptionRepository,
    private readonly tokens: UnsubscribeTokens,
    private readonly afterAnswer: AfterAnswer,
    private readonly clock: Clock,
    private readonly site: { teamName: string; publicUrl: string },
  ) {
    this.perAddress = new FailureLimiter(db, 'subscribe-address', 5, 3600);
    this.perIp = new FailureLimiter(db, 'subscribe-ip', 30, 3600);
    this.suppressions = new SuppressionList(db);
  }

  /** The lists and the consent wording the forms show. */
  wording(): ConsentWording {
    return {
      version: CONSENT_WORDING.version,
      text: CONSENT_WORDING.text(this.site.teamName),
      topics: TOPICS.map((code) => ({ code, label: TOPIC_LABELS[code] })),
    };
  }

  /**
   * Takes a sign-up. The answer is the same whether the address is known, pending, confirmed or suppressed: the
   * records and the confirmation mail are written after the answer. Throws 429 when the address or the network
   * address signed up too often.
   */
  async subscribe(input: SignUp, ip: string, userId: number | null): Promise<void> {
    if (input.productId !== undefined && !input.topics.includes('drops')) {
      throw badRequest('A product can only be followed for its drops.', {
        topics: 'Tick “new runs and drops” to hear about this product.',
      });
    }
    if (input.productId !== undefined && !(await this.repo.productExists(input.productId)))
      throw badRequest('That product does not exist.', { productId: 'No such product.' });
    const email = input.email.trim().toLowerCase();
    await Promise.all([this.perAddress.check(email), this.perIp.check(ip)]);
    await Promise.all([this.perAddress.fail(email), this.perIp.fail(ip)]);
    this.afterAnswer.start('subscribe', () => this.askToConfirm({ ...input, email }, ip, userId));
  }

  private async askToConfirm(input: SignUp, ip: string, userId: number | null): Promise<void> {
    const { token, hash } = newToken();
    const now = this.clock.now();
    const expiresAt = new Date(now.getTime() + CONFIRM_TTL_DAYS * 86_400_000);
    const wording = this.wording();
    await this.db.transaction(async (trx) => {
      // An address that bounced or complained gets no confirmation either.
      const blocked = await this.suppressions.blocked(
        [{ id: 0, to_address: input.email, category: 'transactional', list: null }],
        trx,
      );
      if (blocked.size) return;
      const asked: Topic[] = [];
      for (const topic of [...new Set(input.topics)]) {
        const productId = topic === 'drops' ? (input.productId ?? null) : null;
        const fresh = await this.repo.requestConsent(trx, {
          email: input.email,
          topic,
          productId,
          userId,
          wordingVersion: wording.version,
          wordingText: wording.text,
          sourcePage: input.page,
          sourceIp: ip,
          tokenHash: hash,
          expiresAt,
          now,
        });
        if (fresh) asked.push(topic);
      }
      if (asked.length === 0) return;
      const productName = input.productId ? await this.repo.productName(trx, input.productId) : null;
      const link = `${this.site.publicUrl}/subscriptions/confirm?token=${token}`;
      await enqueueEmail(
        trx,
        confirmSubscriptionMail(input.email, asked, productName, input.page, link, this.site.teamName),
      );
    });
  }

  /** Confirms the lists of one confirmation mail; the link works once. */
  async confirm(token: string, ip: string): Promise<ConfirmedSignUp> {
    return this.db.transaction(async (trx) => {
      const rows = await this.repo.pendingByToken(trx, hashToken(token));
      const now = this.clock.now();
      if (rows.length === 0 || rows.some((r) => r.confirm_expires_at && new Date(r.confirm_expires_at) <= now)) {
        throw badRequest('This link has expired or was already used. Sign up again to get a new one.', {
          token: 'Expired or already used.',
        });
      }
      await this.repo.confirm(
        trx,
        rows.map((r) => r.id),
        now,
        ip,
      );
      // A new express consent overrides an earlier unsubscribe from the same list.
      for (const r of rows) await this.suppressions.liftUnsubscribe(trx, r.email, r.topic);
      return { email: rows[0].email, topics: [...new Set(rows.map((r) => r.topic))] };
    });
  }

  /** What an unsubscribe link stands for, for the page that shows it before the click. */
  describeUnsubscribe(token: string): UnsubscribeTarget {
    const who = this.readToken(token);
    return { email: who.email, topic: who.topic, label: TOPIC_LABELS[who.topic] };
  }

  /** Stops a list for an address at once: consents withdrawn, and the address suppressed for that list. */
  async unsubscribe(token: string, how: 'one-click' | 'page' | 'account'): Promise<UnsubscribeTarget> {
    const who = this.readToken(token);
    await this.withdraw(who.email, who.topic, how);
    return { ...who, label: TOPIC_LABELS[who.topic] };
  }

  /** The signed-in person's lists by their account address; each with a withdrawal token for the account page. */
  async mine(email: string): Promise<{ items: MySubscription[] }> {
    const address = email.trim().toLowerCase();
    const rows = await this.repo.byEmail(address);
    return {
      items: rows.map((r) => ({
        topic: r.topic,
        label: TOPIC_LABELS[r.topic],
        productId: r.product_id,
        productName: r.product_name,
        status: r.confirmed_at ? ('confirmed' as const) : ('pending' as const),
        since: (r.confirmed_at ?? r.requested_at).toISOString(),
        unsubscribeToken: this.tokens.tokenFor(address, r.topic),
      })),
    };
  }

  private async withdraw(email: string, topic: MailList, how: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      await this.repo.withdraw(trx, email, topic, this.clock.now(), how);
      await this.suppressions.add(trx, email, 'unsubscribed', { list: topic, detail: how });
    });
  }

  private readToken(token: string) {
    const who = this.tokens.read(token);
    if (!who)
      throw new AppError(
        400,
        'invalid_token',
        'This unsubscribe link is not valid. Use the link from the latest e-mail.',
        { token: 'Not a valid link.' },
      );
    return who;
  }
}
