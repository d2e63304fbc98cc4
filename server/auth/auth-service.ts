import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { AfterAnswer } from '../platform/after-answer';
import { AppError, badRequest } from '../platform/app-error';
import type { SessionUser } from '../platform/roles';
import type { Clock } from '../platform/clock';
import { FailureLimiter } from '../platform/rate-limit';
import { enqueueEmail } from '../mail/outbox';
import { passwordChangedEmail, passwordResetEmail, registrationAttemptEmail, verificationEmail } from './auth-emails';
import { burnVerifyTime, hashPassword, verifyPassword } from './password-hash';
import { passwordProblem } from './password-policy';
import { SignInGuard } from './sign-in-guard';
import { hashToken, newToken } from './single-use-token';
import { AuthTokenRepository, type TokenPurpose } from './auth-token-repository';
import { toSessionUser, UserRepository } from './user-repository';

const VERIFY_TTL_HOURS = 48;
const RESET_TTL_HOURS = 1;

/** Registration, sign-in checks, e-mail verification and password resets. No HTTP here. */
export class AuthService {
  readonly users: UserRepository;
  private readonly tokens: AuthTokenRepository;
  /** Sign-in failures per account and address, per address, and per account (see lockout-policy.ts). */
  readonly signInGuard: SignInGuard;
  /** Registration and reset work runs after the answer, so an existing account answers like a new one, as fast. */
  readonly afterAnswer: AfterAnswer;
  private readonly resetRequests: FailureLimiter;
  // Mail floods: registrations and verification re-sends per address and per network address (common practice, no source).
  private readonly registerPerAddress: FailureLimiter;
  private readonly registerPerIp: FailureLimiter;
  private readonly resendPerAddress: FailureLimiter;
  private readonly resendPerIp: FailureLimiter;

  constructor(
    private readonly db: Knex,
    private readonly publicUrl: string,
    private readonly clock: Clock,
    log: Pick<Logger, 'error'>,
  ) {
    this.users = new UserRepository(db);
    this.tokens = new AuthTokenRepository();
    this.signInGuard = new SignInGuard(db, clock);
    this.afterAnswer = new AfterAnswer(log);
    this.registerPerAddress = new FailureLimiter(db, 'register-address', 3, 3600);
    this.registerPerIp = new FailureLimiter(db, 'register-ip', 20, 3600);
    this.resendPerAddress = new FailureLimiter(db, 'verify-resend-address', 3, 3600);
    this.resendPerIp = new FailureLimiter(db, 'verify-resend-ip', 10, 3600);
    this.resetRequests = new FailureLimiter(db, 'reset-account', 5, 3600);
  }

  /**
   * Takes a registration. The answer is the same whether the address already has an account or not: the account is
   * created (or its owner told that someone tried) after the answer, and the password is checked before it, from the
   * input alone. Throws 429 when the address or the network address registered too often.
   */
  async register(input: { email: string; password: string; displayName: string }, ip: string): Promise<void> {
    const problem = passwordProblem(input.password, input.email);
    if (problem) throw badRequest('Choose a different password.', { password: problem });
    const email = input.email.toLowerCase();
    await Promise.all([this.registerPerAddress.check(email), this.registerPerIp.check(ip)]);
    await Promise.all([this.registerPerAddress.fail(email), this.registerPerIp.fail(ip)]);
    this.afterAnswer.start('register', () => this.createOrNotify({ ...input, email }));
  }

  private async createOrNotify(input: { email: string; password: string; displayName: string }): Promise<void> {
    const passwordHash = await hashPassword(input.password);
    try {
      await this.db.transaction(async (trx) => {
        const row = await this.users.insert(trx, { email: input.email, passwordHash, displayName: input.displayName });
        await this.queueVerification(trx, row.id, row.email, row.display_name);
      });
    } catch (err) {
      if ((err as { code?: string }).code !== '23505') throw err;
      const owner = (await this.users.byEmail(input.email))!;
      await this.db.transaction((trx) =>
        enqueueEmail(
          trx,
          registrationAttemptEmail(
            owner.email,
            owner.display_name,
            `${this.publicUrl}/account/sign-in`,
            `${this.publicUrl}/account/forgot`,
          ),
        ),
      );
    }
  }

  /** Checks a sign-in; failures count against the account and the address, a success starts the counts again. */
  async authenticate(email: string, password: string, ip: string): Promise<SessionUser> {
    const accountKey = email.toLowerCase();
    const row = await this.users.byEmail(accountKey);
    const { familiar } = await this.signInGuard.check(accountKey, ip, row ? row.id : null);
    const ok = row ? await verifyPassword(row.password_hash, password) : (await burnVerifyTime(password), false);
    if (!row || !ok) {
      await this.signInGuard.fail(accountKey, ip, familiar);
      throw new AppError(401, 'invalid_credentials', 'That e-mail and password do not match an account.');
    }
    // Told only to whoever knows the password, so it reveals nothing about the address to anyone else.
    if (row.disabled_at)
      throw new AppError(
        403,
        'account_disabled',
        'This account is disabled. Ask the club’s admin if you think that is a mistake.',
      );
    await this.signInGuard.succeed(accountKey, ip, row.id);
    return toSessionUser(row);
  }

  /** The session's user as the session should see it now: null once the account is deleted or disabled, whatever the session row still says. */
  async currentUser(id: number): Promise<SessionUser | null> {
    const row = await this.users.byId(id);
    // A deleted or disabled account's session counts as signed out, even before its session rows are gone.
    return row && !row.deleted_at && !row.disabled_at ? toSessionUser(row) : null;
  }

  /** Sends a new verification link; 429 when the address or the network address asked too often. */
  async resendVerification(userId: number, ip: string): Promise<void> {
    const row = await this.users.byId(userId);
    if (!row || row.email_verified_at) return;
    await Promise.all([this.resendPerAddress.check(row.email), this.resendPerIp.check(ip)]);
    await Promise.all([this.resendPerAddress.fail(row.email), this.resendPerIp.fail(ip)]);
    await this.db.transaction((trx) => this.queueVerification(trx, row.id, row.email, row.display_name));
  }

  /**
   * Confirms the address. It does not sign anyone in: whoever registered chose the password, and the owner of the
   * mailbox may not be that person.
   */
  async verifyEmail(token: string): Promise<void> {
    await this.db.transaction(async (trx) => {
      const userId = await this.consumeToken(trx, token, 'verify_email');
      await this.users.update(trx, userId, { email_verified_at: this.clock.now() });
    });
  }

  /**
   * Always succeeds from the caller's view, and does its work after the answer, so neither the answer nor its timing
   * tells which e-mails have accounts.
   */
  requestPasswordReset(email: string): void {
    this.afterAnswer.start('password-reset', () => this.sendResetLink(email));
  }

  private async sendResetLink(email: string): Promise<void> {
    const row = await this.users.byEmail(email);
    if (!row) return;
    const key = row.email;
    const limited = await this.resetRequests.check(key).then(
      () => false,
      () => true,
    );
    if (limited) return;
    await this.resetRequests.fail(key);
    const { token, hash } = newToken();
    await this.db.transaction(async (trx) => {
      await this.tokens.retire(trx, row.id, 'password_reset', this.clock.now());
      await this.tokens.insert(trx, {
        userId: row.id,
        purpose: 'password_reset',
        hash,
        expiresAt: this.hoursFromNow(RESET_TTL_HOURS),
      });
      await enqueueEmail(
        trx,
        passwordResetEmail(row.email, row.display_name, `${this.publicUrl}/account/reset?token=${token}`),
      );
    });
  }

  /** Sets a new password from a one-use reset token and ends every session of the account, so whoever knew the old password is signed out. */
  async confirmPasswordReset(token: string, password: string): Promise<void> {
    const email = await this.db.transaction(async (trx) => {
      const userId = await this.consumeToken(trx, token, 'password_reset');
      const row = (await this.users.byId(userId, trx))!;
      const problem = passwordProblem(password, row.email);
      if (problem) throw badRequest('Choose a different password.', { password: problem });
      await this.users.update(trx, userId, {
        password_hash: await hashPassword(password),
        email_verified_at: row.email_verified_at ?? this.clock.now(),
      });
      await this.tokens.endSessions(trx, userId);
      await enqueueEmail(trx, passwordChangedEmail(row.email, row.display_name));
      return row.email;
    });
    // A fresh password lifts the sign-in lockout on the account.
    await this.signInGuard.clear(email);
  }

  /** Changes the password after checking the current one, and signs out every other session but this one. */
  async changePassword(userId: number, current: string, next: string, keepSessionId: string): Promise<void> {
    const row = await this.users.byId(userId);
    if (!row || !(await verifyPassword(row.password_hash, current))) {
      throw badRequest('The current password is not right.', { currentPassword: 'Not your current password.' });
    }
    const problem = passwordProblem(next, row.email);
    if (problem) throw badRequest('Choose a different password.', { newPassword: problem });
    await this.db.transaction(async (trx) => {
      await this.users.update(trx, userId, { password_hash: await hashPassword(next) });
      await this.tokens.endSessions(trx, userId, keepSessionId);
      await enqueueEmail(trx, passwordChangedEmail(row.email, row.display_name));
    });
  }

  /** Saves the account's own display name and marketing choice, returning the session user with them. */
  async updateProfile(
    userId: number,
    patch: { displayName?: string; marketingOptOut?: boolean },
  ): Promise<SessionUser> {
    const row = await this.db.transaction((trx) =>
      this.users.update(trx, userId, {
        ...(patch.displayName !== undefined ? { display_name: patch.displayName } : {}),
        ...(patch.marketingOptOut !== undefined ? { marketing_opt_out: patch.marketingOptOut } : {}),
      }),
    );
    return toSessionUser(row!);
  }

  private async queueVerification(trx: Knex.Transaction, userId: number, email: string, name: string): Promise<void> {
    const { token, hash } = newToken();
    await this.tokens.insert(trx, {
      userId,
      purpose: 'verify_email',
      hash,
      expiresAt: this.hoursFromNow(VERIFY_TTL_HOURS),
    });
    await enqueueEmail(trx, verificationEmail(email, name, `${this.publicUrl}/account/verify?token=${token}`));
  }

  private async consumeToken(trx: Knex.Transaction, token: string, purpose: TokenPurpose): Promise<number> {
    const row = await this.tokens.lockByHash(trx, hashToken(token), purpose);
    if (!row || row.used_at || new Date(row.expires_at) <= this.clock.now()) {
      throw badRequest('This link has expired or was already used. Ask for a new one.', {
        token: 'Expired or already used.',
      });
    }
    await this.tokens.markUsed(trx, row.id, this.clock.now());
    return row.user_id;
  }

  private hoursFromNow(hours: number): Date {
    return new Date(this.clock.now().getTime() + hours * 3600_000);
  }
}
