import type { Knex } from 'knex';
import nodemailer, { Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import { smtpVerdict } from './smtp-reply';
import { SuppressionList } from './suppression-list';

const BATCH = 20;
const MAX_ATTEMPTS = 12;

/** Backoff between attempts: 30 s doubling, capped at 1 h (common practice, no source). */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(3600, 30 * 2 ** Math.max(0, attempts - 1));
}

/**
 * Delivers the outbox through SMTP. Rows are claimed with SKIP LOCKED so several processes never send one twice.
 * Every row is checked against the suppression list just before it is sent, and a permanent refusal from the server
 * (a hard bounce or a complaint) suppresses the address for every later send, in any process.
 */
export class MailWorker {
  private readonly transport: Transporter;
  private readonly suppressions: SuppressionList;
  private timer?: NodeJS.Timeout;
  private running?: Promise<number>;

  constructor(
    private readonly db: Knex,
    smtpUrl: string,
    private readonly from: string,
    private readonly log: Logger,
  ) {
    const url = new URL(smtpUrl);
    url.searchParams.set('connectionTimeout', '3000');
    url.searchParams.set('greetingTimeout', '3000');
    url.searchParams.set('socketTimeout', '5000');
    this.transport = nodemailer.createTransport(url.toString());
    this.suppressions = new SuppressionList(db);
  }

  /** Polls every `intervalMs` until stopped. */
  start(intervalMs: number): void {
    this.timer = setInterval(
      () => void this.deliverDue().catch((err) => this.log.warn({ err }, 'mail delivery pass failed')),
      intervalMs,
    );
  }

  /** Stops polling, waits for a delivery pass in progress to finish, then closes the SMTP connection. */
  async stop(): Promise<void> {
    clearInterval(this.timer);
    await this.running;
    this.transport.close();
  }

  /** Whether the SMTP server answers. */
  async smtpReachable(): Promise<boolean> {
    try {
      await this.transport.verify();
      return true;
    } catch {
      return false;
    }
  }

  /** One pass over due mail; returns how many were sent. Concurrent calls in one process share a pass. */
  deliverDue(): Promise<number> {
    this.running ??= this.pass().finally(() => (this.running = undefined));
    return this.running;
  }

  private async pass(): Promise<number> {
    let sent = 0;
    for (;;) {
      const n = await this.db.transaction(async (trx) => {
        const rows = await trx('outbound_emails')
          .where('status', 'queued')
          .andWhere('next_attempt_at', '<=', trx.fn.now())
          .orderBy('id')
          .limit(BATCH)
          .forUpdate()
          .skipLocked();
        let ok = 0;
        const blocked = await this.suppressions.blocked(rows, trx);
        for (const row of rows) {
          if (blocked.has(row.id)) {
            await trx('outbound_emails')
              .where('id', row.id)
              .update({ status: 'suppressed', last_error: 'suppressed before sending' });
            continue;
          }
          try {
            await this.transport.sendMail({
              from: this.from,
              to: row.to_address,
              subject: row.subject,
              text: row.text_body,
              html: row.html_body ?? undefined,
              headers: row.headers ?? undefined,
              // One Message-ID per outbox row, so a receiver can tell a retried copy from a new message.
              messageId: `<outbox-${row.id}-${row.created_at instanceof Date ? row.created_at.getTime() : 0}@padside.mail>`,
            });
            await trx('outbound_emails')
              .where('id', row.id)
              .update({ status: 'sent', sent_at: trx.fn.now(), attempts: row.attempts + 1, last_error: null });
            ok++;
          } catch (err) {
            const attempts = row.attempts + 1;
            const e = err as { message?: string; responseCode?: number; response?: string };
            const verdict = smtpVerdict(e.responseCode, e.response ?? e.message);
            if (verdict !== 'retry') {
              // The server answered and refused for good: never retry, and never mail the address again.
              await trx('outbound_emails')
                .where('id', row.id)
                .update({ attempts, status: 'failed', last_error: String(e.message).slice(0, 500) });
              await this.suppressions.add(trx, row.to_address, verdict, { detail: e.response ?? e.message });
              continue;
            }
            await trx('outbound_emails')
              .where('id', row.id)
              .update({
                attempts,
                last_error: String(e.message).slice(0, 500),
                status: attempts >= MAX_ATTEMPTS ? 'failed' : 'queued',
                next_attempt_at: trx.raw(`now() + make_interval(secs => ?)`, [retryDelaySeconds(attempts)]),
              });
            // The server is down: leave the rest of the batch for the next pass instead of timing each one out.
            return { sent: ok, more: false };
          }
        }
        return { sent: ok, more: rows.length > 0 };
      });
      sent += n.sent;
      if (!n.more) return sent;
    }
  }
}
