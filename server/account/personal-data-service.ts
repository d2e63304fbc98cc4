import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { UserRepository } from '../auth/user-repository';
import { verifyPassword } from '../auth/password-hash';
import { enqueueEmail } from '../mail/outbox';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { AfterErase, DataSubject, PersonalDataPart, PersonalDataSection } from '../platform/personal-data';
import { FailureLimiter } from '../platform/rate-limit';
import { accountDeletedEmail } from './account-deleted-email';
import { accountPersonalData } from './account-personal-data';

/** What one download holds. */
export interface PersonalDataExport {
  email: string;
  generatedAt: Date;
  sections: PersonalDataSection[];
}

/**
 * A person's own data: the download of everything Padside holds about them, and the deletion of their account.
 * Each feature contributes its part (`Feature.personalData`). The account's own part comes first in the download
 * (the profile heads the summary) and runs last in a deletion, because it replaces the e-mail the other parts find
 * guest orders and mail by.
 */
export class PersonalDataService {
  // A signed-in session that guesses the password here is held back like a sign-in would be (common practice, no source).
  private readonly wrongPasswords: FailureLimiter;

  constructor(
    private readonly db: Knex,
    private readonly users: UserRepository,
    private readonly featureParts: PersonalDataPart[],
    private readonly clock: Clock,
    private readonly teamName: string,
    private readonly log: Pick<Logger, 'error'>,
  ) {
    this.wrongPasswords = new FailureLimiter(db, 'account-delete', 5, 3600);
  }

  /** Every part's sections, read in one snapshot so the files agree with each other. */
  async export(userId: number): Promise<PersonalDataExport> {
    return this.db.transaction(
      async (trx) => {
        const subject = await this.subject(trx, userId);
        const sections: PersonalDataSection[] = [];
        for (const part of [accountPersonalData, ...this.featureParts])
          sections.push(...(await part.export(trx, subject)));
        return { email: subject.email, generatedAt: this.clock.now(), sections };
      },
      { isolationLevel: 'repeatable read' },
    );
  }

  /**
   * Deletes the account after checking its password: 400 (field `password`) for a wrong one, 409 for the last admin
   * or while something still holds the account (an order to ship). Everything happens in one transaction; the
   * outside services (the card processor) are told after it commits.
   */
  async deleteAccount(userId: number, password: string): Promise<void> {
    const key = String(userId);
    await this.wrongPasswords.check(key);
    const row = await this.users.byId(userId);
    if (!row || row.deleted_at) throw notFound('No such account.');
    if (!(await verifyPassword(row.password_hash, password))) {
      await this.wrongPasswords.fail(key);
      throw badRequest('That password is not right.', { password: 'Not your password.' });
    }
    const after = await this.db.transaction(async (trx) => {
      // The admin rows first, always in the same order, then the account's own row: no two deletions deadlock.
      await this.refuseLastAdmin(trx, userId);
      const subject = await this.lockSubject(trx, userId);
      const holds: string[] = [];
      for (const part of this.featureParts) holds.push(...((await part.holds?.(trx, subject)) ?? []));
      if (holds.length) throw conflict('account_held', `Your account cannot be deleted yet. ${holds.join(' ')}`);
      const work: AfterErase[] = [];
      for (const part of [...this.featureParts, accountPersonalData]) {
        const next = await part.erase(trx, subject);
        if (next) work.push(next);
      }
      await enqueueEmail(trx, accountDeletedEmail(subject.email, this.teamName));
      return work;
    });
    await this.wrongPasswords.reset(key);
    for (const step of after)
      await step().catch((err) => this.log.error({ err }, 'a step after an account deletion failed'));
  }

  /** Whose data an export holds; a deleted account has nothing left to export. */
  private async subject(trx: Knex.Transaction, userId: number): Promise<DataSubject> {
    return subjectOf(userId, await this.users.live(trx, userId));
  }

  /** The same, with the account row locked for its deletion, so nothing else writes it meanwhile. */
  private async lockSubject(trx: Knex.Transaction, userId: number): Promise<DataSubject> {
    return subjectOf(userId, await this.users.lockLive(trx, userId));
  }

  /**
   * Locks every admin row in id order, so two admins deleting themselves at once take turns and the second sees the
   * first gone: the club always keeps one admin.
   */
  private async refuseLastAdmin(trx: Knex.Transaction, userId: number): Promise<void> {
    const admins = await this.users.lockAdmins(trx);
    if (admins.includes(userId) && admins.length === 1) {
      throw conflict('last_admin', 'You are the only admin. Make someone else an admin before deleting your account.');
    }
  }
}

function subjectOf(userId: number, row: { email: string; email_verified_at: Date | null } | undefined): DataSubject {
  if (!row) throw notFound('No such account.');
  return {
    userId,
    email: row.email,
    emailVerified: row.email_verified_at !== null,
    marker: `Deleted account #${userId}`,
  };
}
