import type { Knex } from 'knex';
import pino, { type Logger } from 'pino';
import type { Config } from './config';
import { createDb } from './db';
import { MailWorker } from './mail/mail-worker';
import { PaymentGateway } from './payments/payment-gateway';
import { createStripe } from './payments/stripe-client';
import { systemClock, type Clock } from './platform/clock';
import { ClubCalendar } from './platform/club-calendar';

/** Everything with a side effect, built once and handed down; tests build their own. */
export interface AppDeps {
  config: Config;
  db: Knex;
  clock: Clock;
  /** Today in the club's time zone, read from `clock`. */
  calendar: ClubCalendar;
  log: Logger;
  mail: MailWorker;
  payments: PaymentGateway;
}

export function createDeps(config: Config, overrides: Partial<AppDeps> = {}): AppDeps {
  const log = overrides.log ?? pino({ level: config.logLevel });
  const db = overrides.db ?? createDb(config.databaseUrl, 10, log);
  const clock = overrides.clock ?? systemClock;
  return {
    config,
    db,
    log,
    clock,
    calendar: overrides.calendar ?? new ClubCalendar(clock, config.clubTimeZone),
    mail: overrides.mail ?? new MailWorker(db, config.smtpUrl, config.mailFrom, log),
    payments: overrides.payments ?? new PaymentGateway(createStripe(config)),
  };
}

/** Closes pools and transports. */
export async function closeDeps(deps: AppDeps): Promise<void> {
  await deps.mail.stop();
  await deps.db.destroy();
}
