import type { Knex } from 'knex';
import { AppError, badRequest, conflict } from '../platform/app-error';
import type { SessionUser } from '../platform/roles';
import type { Clock } from '../platform/clock';
import { FailureLimiter } from '../platform/rate-limit';
import { enqueueEmail } from '../mail/outbox';
import { passwordChangedEmail, passwordResetEmail, verificationEmail } from './auth-emails';
import { burnVerifyTime, hashPassword, verifyPassword } from './password-hash';
import { passwordProblem } from './password-policy';
import { SignInGuard } from './sign-in-guard';
import { hashToken, newToken } from './single-use-token';
import { toSessionUser, UserRepository } from './user-repository';

const VERIFY_TTL_HOURS = 48;
const RESET_TTL_HOURS = 1;

/** Registration, sign-in checks, e-mail verification and password resets. No HTTP here. */
export class AuthService {
  readonly users: UserRepository;
  /** Sign-in failures per account and address, per address, and per account (see lockout-policy.ts). */
  readonly signInGuard: SignInGuard;
  private readonly resetRequests: FailureLimiter;

  constructor(
    private readonly db: Knex,
    private readonly publicUrl: string,
    private readonly clock: Clock,
  ) {
    this.users = new UserRepository(db);
    this.signInGuard = new SignInGuard(db, clock);
    this.resetRequests = new FailureLimiter(db, 'reset-account', 5, 3600);
  }

  async register(input: { email: string; password: string; displayName: string }): Promise<SessionUser> {
    const problem = passwordProblem(input.password, input.email);
    if (problem) throw badRequest('Choose a different password.', { password: problem });
    const passwordHash = await hashPassword(input.password);
    try {
      return await this.db.transaction(async (trx) => {
        const row = await this.users.insert(trx, { email: input.email, passwordHash, displayName: input.displayName });
        await this.queueVerification(trx, row.id, row.email, row.display_name);
        return toSessionUser(row);
      });
    } catch (err) {
      if ((err as { code?: string }).code === '23505') {
        throw conflict('email_taken', 'An account with this e-mail already exists. Sign in or reset the password.', { email: 'Already registered.' });
      }
      throw err;
    }
  }

  /** Checks a sign-in; failures count against the account and the address, a success starts the counts again. */
  async authenticate(email: string, password: string, ip: string): Promise<SessionUser> {
    const accountKey = email.toLowerCase();
    const row = await this.users.byEmail(accountKey);
    const { familiar } = await this.signInGuard.check(accountKey, ip, row ? Number(row.id) : null);
    const ok = row ? await verifyPassword(row.password_hash, password) : (await burnVerifyTime(password), false);
    if (!row || !ok) {
      await this.signInGuard.fail(accountKey, ip, familiar);
      throw new AppError(401, 'invalid_credentials', 'That e-mail and password do not match an account.');
    }
    await this.signInGuard.succeed(accountKey, ip, Number(row.id));
    return toSessionUser(row);
  }

  async currentUser(id: number): Promise<SessionUser | null> {
    const row = await this.users.byId(id);
    return row ? toSessionUser(row) : null;
  }

  async resendVerification(userId: number): Promise<void> {
    const row = await this.users.byId(userId);
    if (!row || row.email_verified_at) return;
    await this.db.transaction((trx) => this.queueVerification(trx, row.id, row.email, row.display_name));
  }

  async verifyEmail(token: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      const userId = await this.consumeToken(trx, token, 'verify_email');
      await this.users.update(userId, { email_verified_at: this.clock.now() }, trx);
    });
  }

  /** Always succeeds from the caller's view, so it cannot be used to learn which e-mails have accounts. */
  async requestPasswordReset(email: string): Promise<void> {
    const row = await this.users.byEmail(email);
    if (!row) return;
    const key = row.email;
    const limited = await this.resetRequests.check(key).then(() => false, () => true);
    if (limited) return;
    await this.resetRequests.fail(key);
    const { token, hash } = newToken();
    await this.db.transaction(async (trx) => {
      await trx('auth_tokens').where({ user_id: row.id, purpose: 'password_reset' }).whereNull('used_at').update({ used_at: this.clock.now() });
      await trx('auth_tokens').insert({ user_id: row.id, purpose: 'password_reset', token_hash: hash, expires_at: this.hoursFromNow(RESET_TTL_HOURS) });
      await enqueueEmail(trx, passwordResetEmail(row.email, row.display_name, `${this.publicUrl}/account/reset?token=${token}`));
    });
  }

  async confirmPasswordReset(token: string, password: string): Promise<void> {
    const email = await this.db.transaction(async (trx) => {
      const userId = await this.consumeToken(trx, token, 'password_reset');
      const row = (await this.users.byId(userId, trx))!;
      const problem = passwordProblem(password, row.email);
      if (problem) throw badRequest('Choose a different password.', { password: problem });
      await this.users.update(userId, { password_hash: await hashPassword(password), email_verified_at: row.email_verified_at ?? this.clock.now() }, trx);
      await this.endSessions(trx, userId);
      await enqueueEmail(trx, passwordChangedEmail(row.email, row.display_name));
      return row.email;
    });
    // A fresh password lifts the sign-in lockout on the account.
    await this.signInGuard.clear(email);
  }

  async changePassword(userId: number, current: string, next: string, keepSessionId: string): Promise<void> {
    const row = await this.users.byId(userId);
    if (!row || !(await verifyPassword(row.password_hash, current))) {
      throw badRequest('The current password is not right.', { currentPassword: 'Not your current password.' });
    }
    const problem = passwordProblem(next, row.email);
    if (problem) throw badRequest('Choose a different password.', { newPassword: problem });
    await this.db.transaction(async (trx) => {
      await this.users.update(userId, { password_hash: await hashPassword(next) }, trx);
      await this.endSessions(trx, userId, keepSessionId);
      await enqueueEmail(trx, passwordChangedEmail(row.email, row.display_name));
    });
  }

  async updateProfile(userId: number, patch: { displayName?: string; marketingOptOut?: boolean }): Promise<SessionUser> {
    const row = await this.users.update(userId, {
      ...(patch.displayName !== undefined ? { display_name: patch.displayName } : {}),
      ...(patch.marketingOptOut !== undefined ? { marketing_opt_out: patch.marketingOptOut } : {}),
    });
    return toSessionUser(row!);
  }

  /** Signs the user out everywhere except `keepSessionId` (sessions are stored as JSON with passport.user). */
  private async endSessions(trx: Knex.Transaction, userId: number, keepSessionId?: string): Promise<void> {
    await trx('session')
      .whereRaw(`(sess->'passport'->>'user') = ?`, [String(userId)])
      .modify((q) => keepSessionId && q.whereNot('sid', keepSessionId))
      .delete();
  }

  private async queueVerification(trx: Knex.Transaction, userId: string | number, email: string, name: string): Promise<void> {
    const { token, hash } = newToken();
    await trx('auth_tokens').insert({ user_id: userId, purpose: 'verify_email', token_hash: hash, expires_at: this.hoursFromNow(VERIFY_TTL_HOURS) });
    await enqueueEmail(trx, verificationEmail(email, name, `${this.publicUrl}/account/verify?token=${token}`));
  }

  private async consumeToken(trx: Knex.Transaction, token: string, purpose: string): Promise<number> {
    const row = await trx('auth_tokens').where({ token_hash: hashToken(token), purpose }).forUpdate().first();
    if (!row || row.used_at || new Date(row.expires_at) <= this.clock.now()) {
      throw badRequest('This link has expired or was already used. Ask for a new one.', { token: 'Expired or already used.' });
    }
    await trx('auth_tokens').where('id', row.id).update({ used_at: this.clock.now() });
    return Number(row.user_id);
  }

  private hoursFromNow(hours: number): Date {
    return new Date(this.clock.now().getTime() + hours * 3600_000);
  }
}
