import { commercialMailer } from '../announcements/commercial-mailer';
import { UserRepository } from '../auth/user-repository';
import type { Feature, Platform } from '../feature';
import { CardDues } from './card-dues';
import { CardOnFile } from './card-on-file';
import { CheckInTokens } from './check-in-token';
import { DuesRefunds } from './dues-refunds';
import { DuesSettlement } from './dues-settlement';
import { memberAdminRoutes, checkInRoutes } from './member-admin-routes';
import { MemberAdminService } from './member-admin-service';
import { PlanAdminService } from './plan-admin-service';
import { RosterMailService } from './roster-mail-service';
import { MemberRecordService } from './member-record-service';
import { FlyingStatusService } from './flying-status-service';
import { MembershipJobs } from './membership-jobs';
import { membershipPersonalData } from './membership-personal-data';
import { MembershipRepository } from './membership-repository';
import { PlanRepository } from './plan-repository';
import { DuesPaymentRepository } from './dues-payment-repository';
import { RosterRepository } from './roster-repository';
import { PaymentThrottle } from '../payments/payment-throttle';
import { membershipRoutes } from './membership-routes';
import { MembershipService } from './membership-service';

/** Club membership: dues, terms, reminders, auto-renew, member card and check-in, and the treasurer's roster. */
export function membershipFeature(platform: Platform): Feature {
  const { db, clock, calendar, config, payments } = platform.deps;
  const repo = new MembershipRepository(db);
  const planRepo = new PlanRepository(db);
  const paymentRepo = new DuesPaymentRepository(db);
  const rosterRepo = new RosterRepository(db);
  const settlement = new DuesSettlement(repo, planRepo, paymentRepo, new UserRepository(db), config.publicUrl);
  const cardDues = new CardDues(db, repo, paymentRepo, settlement, platform.settings, payments);
  const tokens = new CheckInTokens(config.sessionSecret);
  const cardOnFile = new CardOnFile(db, repo, cardDues);
  const members = new MembershipService(db, repo, planRepo, platform.settings, cardDues, cardOnFile, clock, calendar);
  const record = new MemberRecordService(
    db,
    repo,
    planRepo,
    platform.settings,
    settlement,
    cardOnFile,
    tokens,
    clock,
    calendar,
  );
  const admin = new MemberAdminService(
    db,
    repo,
    planRepo,
    paymentRepo,
    rosterRepo,
    platform.settings,
    settlement,
    clock,
    calendar,
  );
  const rosterMail = new RosterMailService(
    db,
    rosterRepo,
    platform.settings,
    calendar,
    commercialMailer(platform),
    config.site.clubName,
  );
  const refunds = new DuesRefunds(
    db,
    repo,
    paymentRepo,
    platform.settings,
    settlement,
    payments,
    clock,
    calendar,
    platform.deps.log,
  );
  const flying = new FlyingStatusService(db, repo, platform.settings, tokens, clock, calendar);
  const jobs = new MembershipJobs(
    db,
    repo,
    planRepo,
    rosterRepo,
    platform.settings,
    settlement,
    cardDues,
    clock,
    calendar,
  );
  return {
    name: 'membership',
    mount(api) {
      api('/membership', membershipRoutes(members, record, new PaymentThrottle(db)));
      api(
        '/admin/members',
        memberAdminRoutes(
          admin,
          new PlanAdminService(db, repo, planRepo, platform.settings),
          rosterMail,
          refunds,
          flying,
        ),
      );
      api('/admin/checkin', checkInRoutes(flying));
    },
    dashboard: {
      membersByStatus: async () => (await admin.summary()).byStatus,
      membersLapsingWithin: (days) => admin.lapsingWithin(days),
    },
    jobs: [
      { name: 'membership-reminders', cron: '0 8 * * *', run: () => jobs.sendReminders() },
      { name: 'membership-auto-renew', cron: '0 6 * * *', run: () => jobs.autoRenew() },
      { name: 'membership-reconcile-refunds', cron: '*/5 * * * *', run: () => refunds.settleStaleClaims() },
    ],
    chargeRefunds: (chargeId) => refunds.syncCharge(chargeId),
    personalData: membershipPersonalData(cardDues.savedCards, platform.deps.log),
  };
}
