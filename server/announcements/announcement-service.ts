import type { Knex } from 'knex';
import { enqueueEmail } from '../mail/outbox';
import { conflict, notFound } from '../platform/app-error';
import { dateInZone, type Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import type { AnnouncementAudience, Recipient } from './announcement-audience';
import type { AnnouncementRepository, AnnouncementRow, DeliveryCounts } from './announcement-repository';
import { ANNOUNCEMENT_SETTINGS, type AnnouncementSettings } from './announcement-settings';
import type { CommercialContent } from './commercial-mail';
import type { CommercialMailer } from './commercial-mailer';
import type { SubscriptionRepository } from './subscription-repository';
import type { AnnouncementDraft, AnnouncementQuery } from '../../contracts/announcements/announcement-schemas';
import type {
  Announcement,
  AnnouncementAnswer,
  AnnouncementPage,
  AnnouncementPreview,
  AnnouncementTestAnswer,
} from '../../contracts/announcements/announcement-answers';

export interface AnnouncementSite {
  teamName: string;
  publicUrl: string;
  timeZone: string;
}

/** Staff announcements (compose, preview, test, send once per address) and the automatic drop notices. */
export class AnnouncementService {
  constructor(
    private readonly db: Knex,
    private readonly repo: AnnouncementRepository,
    private readonly subscriptions: SubscriptionRepository,
    private readonly audience: AnnouncementAudience,
    private readonly mailer: CommercialMailer,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
    private readonly site: AnnouncementSite,
  ) {}

  /** Saves a new announcement as a draft; nothing is sent until it is sent explicitly. */
  async create(input: AnnouncementDraft, userId: number): Promise<AnnouncementAnswer> {
    const row = await this.db.transaction((trx) =>
      this.repo.insert(trx, {
        kind: 'announcement',
        topic: input.topic,
        subject: input.subject,
        markdown: input.markdown,
        created_by: userId,
      }),
    );
    return { announcement: await this.view(row) };
  }

  /** Changes a draft; once sending started the text is what people received, so it stays. */
  async update(id: number, patch: Partial<AnnouncementDraft>): Promise<AnnouncementAnswer> {
    return this.db.transaction(async (trx) => {
      const row = await this.repo.lockById(trx, id);
      if (!row) throw notFound('No such announcement.');
      if (row.status !== 'draft')
        throw conflict('already_sent', 'This announcement was sent; it can no longer change.');
      return { announcement: await this.view(await this.repo.update(trx, id, patch)) };
    });
  }

  /** One page of announcements for the staff table, each with its outbox counts. */
  async list(q: AnnouncementQuery): Promise<AnnouncementPage> {
    const { rows, total } = await this.repo.page(q);
    const counts = await this.repo.counts(rows.map((r) => r.id));
    return {
      items: rows.map((r) => this.toView(r, counts.get(r.id)!)),
      total,
      page: q.page,
      pageSize: q.pageSize,
    };
  }

  /** One announcement with its delivery counts; a 404 for an unknown id. */
  async show(id: number): Promise<AnnouncementAnswer> {
    return { announcement: await this.view(await this.found(id)) };
  }

  /** The mail exactly as a recipient gets it, addressed to the staff member looking at it. */
  async preview(id: number, viewerEmail: string): Promise<AnnouncementPreview> {
    const row = await this.found(id);
    const mail = this.mailer.mailFor(
      this.content(row),
      { email: viewerEmail, why: 'you asked for this list (each recipient sees their own reason here)' },
      await this.mailer.sender(),
    );
    return { subject: mail.subject, text: mail.text, html: mail.html, headers: mail.headers };
  }

  /** Sends the mail to the staff member alone, marked as a test; it counts nowhere. */
  async testSend(id: number, email: string): Promise<AnnouncementTestAnswer> {
    const row = await this.found(id);
    const content = {
      ...this.content(row),
      subject: `[Test] ${row.subject}`,
      announcementId: undefined,
      template: 'announcement-test',
    };
    await this.db.transaction(async (trx) => {
      await enqueueEmail(
        trx,
        this.mailer.mailFor(
          content,
          { email, why: 'you sent yourself a test of this announcement' },
          await this.mailer.sender(trx),
        ),
      );
    });
    return { to: email };
  }

  /** Records the implied consents that paid orders and memberships give (the nightly job, and before each send). */
  async recordImpliedConsents(): Promise<void> {
    await this.db.transaction((trx) => this.subscriptions.recordImpliedConsents(trx, this.site.timeZone));
  }

  /**
   * Queues the announcement once per address that may receive its list today, in one transaction with the status
   * change, so a second click or a second process finds it sending and queues nothing (409).
   */
  async send(id: number): Promise<AnnouncementAnswer> {
    await this.recordImpliedConsents();
    const row = await this.db.transaction(async (trx) => {
      const locked = await this.repo.lockById(trx, id);
      if (!locked) throw notFound('No such announcement.');
      if (locked.status !== 'draft') throw conflict('already_sent', 'This announcement is already being sent.');
      const { queued, suppressed } = await this.queue(
        trx,
        locked,
        await this.audience.of(trx, locked.topic, this.today()),
      );
      return this.repo.update(trx, id, {
        status: 'sending',
        sent_at: this.clock.now(),
        recipients: queued,
        skipped_suppressed: suppressed,
      });
    });
    return { announcement: await this.view(row) };
  }

  /** The drop notice for each run that opened, once per run, to those who asked for drops of its product or any. */
  async sendDropNotices(): Promise<number> {
    const settings = await this.settings.get(ANNOUNCEMENT_SETTINGS);
    if (!settings.automaticDropNotices) return 0;
    let sent = 0;
    for (const run of await this.repo.openedRunsWithoutNotice(this.clock.now())) {
      await this.db.transaction(async (trx) => {
        const closes = dateInZone(new Date(run.closes_at), this.site.timeZone);
        const notice = await this.repo.insertDropNotice(trx, {
          kind: 'drop_notice',
          topic: 'drops',
          subject: `${run.product_name}: ${run.run_name} is open`,
          markdown: `**${run.product_name}** has a new run, **${run.run_name}**, open until ${closes} or until it sells out.\n\n[See it in the shop](${this.site.publicUrl}/shop/p/${run.slug})`,
          status: 'sending',
          product_id: run.product_id,
          run_id: run.run_id,
          sent_at: this.clock.now(),
        });
        if (!notice) return;
        const { queued, suppressed } = await this.queue(
          trx,
          notice,
          await this.audience.of(trx, 'drops', this.today(), { productId: run.product_id, expressOnly: true }),
        );
        await this.repo.update(trx, notice.id, { recipients: queued, skipped_suppressed: suppressed });
        sent++;
      });
    }
    return sent;
  }

  /** The announcement settings: the sender identity every commercial mail shows, and whether drop notices go out by themselves. */
  async getSettings(): Promise<AnnouncementSettings> {
    return this.settings.get(ANNOUNCEMENT_SETTINGS);
  }

  /** Validates and saves the announcement settings. */
  async putSettings(value: AnnouncementSettings): Promise<AnnouncementSettings> {
    return this.settings.put(ANNOUNCEMENT_SETTINGS, value);
  }

  private queue(trx: Knex.Transaction, row: AnnouncementRow, recipients: Recipient[]) {
    const content = this.content(row);
    // The dedupe key makes each address once-only for this announcement, however often the queueing runs.
    return this.mailer.queue(trx, row.topic, recipients, (r) => ({
      content,
      dedupeKey: `announcement:${row.id}:${r.email}`,
    }));
  }

  private content(row: AnnouncementRow): CommercialContent {
    return {
      topic: row.topic,
      subject: row.subject,
      markdown: row.markdown,
      template: row.kind === 'drop_notice' ? 'drop-notice' : 'announcement',
      announcementId: row.id,
    };
  }

  private today(): string {
    return dateInZone(this.clock.now(), this.site.timeZone);
  }

  private async found(id: number): Promise<AnnouncementRow> {
    const row = await this.repo.byId(id);
    if (!row) throw notFound('No such announcement.');
    return row;
  }

  private async view(row: AnnouncementRow): Promise<Announcement> {
    return this.toView(row, (await this.repo.counts([row.id])).get(row.id)!);
  }

  private toView(r: AnnouncementRow, counts: DeliveryCounts): Announcement {
    const status = r.status === 'draft' ? 'draft' : counts.queued > 0 ? 'sending' : 'sent';
    return {
      id: r.id,
      kind: r.kind,
      topic: r.topic,
      subject: r.subject,
      markdown: r.markdown,
      status,
      productId: r.product_id,
      createdAt: new Date(r.created_at).toISOString(),
      sentAt: r.sent_at ? new Date(r.sent_at).toISOString() : null,
      counts: { recipients: r.recipients, ...counts, suppressed: counts.suppressed + r.skipped_suppressed },
    };
  }
}
