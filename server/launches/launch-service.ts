import type { Knex } from 'knex';
import { enqueueEmail } from '../mail/outbox';
import { conflict, notFound } from '../platform/app-error';
import { dateInZone, type Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import { addDays } from '../membership/terms';
import type { FlyerStanding } from './flyer-standing';
import { launchCalendar } from './launch-calendar';
import { launchCalledOffMail, launchReminderMail } from './launch-mail';
import type { LaunchFields, LaunchRepository, LaunchRow } from './launch-repository';
import type { CheckInAnswer, LaunchList, LaunchPage, LaunchView } from '../../contracts/launches/launch-answers';
import type { LaunchInput, LaunchSettings } from '../../contracts/launches/launch-schemas';
import { LAUNCH_SETTINGS } from './launch-settings';
import { launchView } from './launch-views';

/** Where the service finds the club's names and addresses. */
export interface LaunchContext {
  timeZone: string;
  publicUrl: string;
  clubName: string;
}

/** Reminders go out this many days before a launch (a day missed by the job catches up the day after). */
export const REMINDER_DAYS_BEFORE = 2;

const toFields = (i: Partial<LaunchInput>): Partial<LaunchFields> => ({
  ...(i.title !== undefined ? { title: i.title } : {}),
  ...(i.date !== undefined ? { launch_date: i.date } : {}),
  ...(i.startsAt !== undefined ? { starts_at: i.startsAt } : {}),
  ...(i.endsAt !== undefined ? { ends_at: i.endsAt } : {}),
  ...(i.site !== undefined
    ? {
        site_name: i.site.name,
        site_address: i.site.address ?? null,
        site_lat: i.site.lat?.toString() ?? null,
        site_lon: i.site.lon?.toString() ?? null,
      }
    : {}),
  ...(i.ceilingMetres !== undefined ? { ceiling_metres: i.ceilingMetres } : {}),
  ...(i.waiverVersion !== undefined ? { waiver_version: i.waiverVersion } : {}),
  ...(i.notes !== undefined ? { notes: i.notes ?? '' } : {}),
});

/** Launch days: the calendar, RSVPs, reminders, call-offs and check-in at the field. No HTTP here. */
export class LaunchService {
  constructor(
    private readonly db: Knex,
    private readonly repo: LaunchRepository,
    private readonly flyers: FlyerStanding,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
    private readonly ctx: LaunchContext,
  ) {}

  /** Today's date in the club's time zone, since a launch day is a local date and not an instant. */
  today(): string {
    return dateInZone(this.clock.now(), this.ctx.timeZone);
  }

  /** A launch by id, or a 404 for an unknown one; the other launch and flight rules start from here. */
  async find(id: number): Promise<LaunchRow> {
    const l = await this.repo.byId(id);
    if (!l) throw notFound('No such launch.');
    return l;
  }

  /** The public calendar: from `from` (default 90 days back) to `to`. */
  async list(range: { from?: string; to?: string }): Promise<LaunchList> {
    const from = range.from ?? addDays(this.today(), -90);
    return { items: (await this.repo.list({ from, to: range.to })).map(launchView), timeZone: this.ctx.timeZone };
  }

  /** Every launch, for the range officer's console. */
  async listAll(): Promise<LaunchList> {
    return { items: (await this.repo.list({})).map(launchView), timeZone: this.ctx.timeZone };
  }

  /** One launch; a signed-in caller also sees their own reply and check-in. */
  async show(id: number, userId: number | null): Promise<LaunchPage> {
    const l = await this.find(id);
    const me =
      userId === null
        ? null
        : { going: await this.repo.rsvpOf(id, userId), checkedIn: await this.repo.isCheckedIn(id, userId) };
    return { launch: launchView(l), me, timeZone: this.ctx.timeZone };
  }

  /** Puts a new launch on the calendar, remembering who created it. */
  async create(input: LaunchInput, userId: number): Promise<{ launch: LaunchView }> {
    const id = await this.db.transaction((trx) =>
      this.repo.insert(trx, { ...(toFields(input) as LaunchFields), created_by: userId }),
    );
    return { launch: launchView((await this.repo.byId(id))!) };
  }

  /** Changes a launch still on the calendar; one called off or done stays as it was. */
  async update(id: number, input: Partial<LaunchInput>): Promise<{ launch: LaunchView }> {
    const l = await this.find(id);
    if (l.status !== 'scheduled')
      throw conflict('launch_closed', 'Only a launch still on the calendar can be changed.');
    const merged = { ...l, ...toFields(input) };
    if (merged.starts_at >= merged.ends_at)
      throw conflict('invalid_window', 'The window must end after it starts.', { endsAt: 'Must be after the start.' });
    await this.db.transaction((trx) => this.repo.update(trx, id, toFields(input)));
    return { launch: launchView((await this.repo.byId(id))!) };
  }

  /** Calls a launch off and tells everyone who said they would come, in the same transaction. */
  async callOff(id: number, reason: string): Promise<{ launch: LaunchView; notified: number }> {
    await this.find(id);
    const notified = await this.db.transaction(async (trx) => {
      if (!(await this.repo.callOff(trx, id, reason)))
        throw conflict('launch_closed', 'This launch is already called off or done.');
      const l = (await this.repo.byId(id, trx))!;
      let queued = 0;
      for (const to of await this.repo.goingTo(id, trx)) {
        if (await enqueueEmail(trx, launchCalledOffMail(to, l, reason, this.ctx.timeZone, this.ctx.publicUrl)))
          queued++;
      }
      return queued;
    });
    return { launch: launchView((await this.repo.byId(id))!), notified };
  }

  /** Closes a launch on the calendar as flown; one already called off or done cannot be closed again. */
  async markDone(id: number): Promise<{ launch: LaunchView }> {
    await this.find(id);
    if (!(await this.db.transaction((trx) => this.repo.markDone(trx, id))))
      throw conflict('launch_closed', 'Only a launch on the calendar can be closed.');
    return { launch: launchView((await this.repo.byId(id))!) };
  }

  /** A reply to a launch on the calendar, today or later. */
  async rsvp(id: number, userId: number, going: boolean): Promise<{ going: boolean; launch: LaunchView }> {
    const l = await this.find(id);
    if (l.status !== 'scheduled' || l.launch_date < this.today())
      throw conflict('launch_closed', 'Replies close when a launch is called off or over.');
    await this.db.transaction((trx) => this.repo.setRsvp(trx, id, userId, going));
    return { going, launch: launchView((await this.repo.byId(id))!) };
  }

  /** Checks a member in at the field with their card's signed code; checking in twice is harmless. */
  async checkIn(id: number, token: string, staffId: number): Promise<CheckInAnswer> {
    const l = await this.find(id);
    if (l.status !== 'scheduled') throw conflict('launch_closed', 'This launch is called off or closed.');
    const flyer = await this.flyers.byToken(token);
    if (!flyer)
      throw conflict('unknown_card', 'Padside does not recognise this card code.', {
        token: 'Not a current member card.',
      });
    if (!flyer.current)
      throw conflict('dues_not_current', `Member ${flyer.memberNumber}'s dues are not current (${flyer.status}).`, {
        token: 'Dues not current.',
      });
    const added = await this.db.transaction((trx) =>
      this.repo.addAttendance(trx, {
        launch_id: id,
        user_id: flyer.userId,
        member_number: flyer.memberNumber,
        checked_in_by: staffId,
      }),
    );
    return {
      checkedIn: true,
      alreadyCheckedIn: !added,
      member: {
        memberNumber: flyer.memberNumber,
        name: flyer.name,
        status: flyer.status,
        certificationLevel: flyer.certificationLevel,
      },
    };
  }

  /** The check-in list of a launch for the range staff. */
  async attendance(id: number) {
    await this.find(id);
    return {
      items: (await this.repo.attendance(id)).map((a) => ({
        userId: a.user_id,
        name: a.display_name,
        memberNumber: a.member_number,
        checkedInAt: a.checked_in_at,
      })),
    };
  }

  /** Whether the person checked in at the launch, which is required before they may file a flight card. */
  async isCheckedIn(id: number, userId: number): Promise<boolean> {
    return this.repo.isCheckedIn(id, userId);
  }

  /**
   * Reminders for launches two days out (or one, if a day was missed). The job runs once across processes and
   * each mail's dedupe key names the launch and the person, so nobody gets two.
   */
  async sendReminders(): Promise<{ queued: number }> {
    const today = this.today();
    let queued = 0;
    for (const l of await this.repo.scheduledBetween(addDays(today, 1), addDays(today, REMINDER_DAYS_BEFORE))) {
      for (const to of await this.repo.goingTo(l.id)) {
        const mail = launchReminderMail(to, l, this.ctx.timeZone, this.ctx.publicUrl);
        if (await this.db.transaction((trx) => enqueueEmail(trx, mail))) queued++;
      }
    }
    return { queued };
  }

  /** The iCalendar feed of the last year's and every future launch. */
  async calendar(): Promise<string> {
    const launches = await this.repo.list({ from: addDays(this.today(), -365) });
    return launchCalendar(launches, {
      clubName: this.ctx.clubName,
      timeZone: this.ctx.timeZone,
      publicUrl: this.ctx.publicUrl,
      host: new URL(this.ctx.publicUrl).hostname,
      now: this.clock.now(),
    });
  }

  /** The launch feature's settings, with defaults for fields never saved. */
  getSettings(): Promise<LaunchSettings> {
    return this.settings.get(LAUNCH_SETTINGS);
  }

  /** Validates and saves the launch feature's settings. */
  putSettings(s: LaunchSettings): Promise<LaunchSettings> {
    return this.settings.put(LAUNCH_SETTINGS, s);
  }

  /** Launches by state and check-ins in the club's season (the calendar year), for the dashboard. */
  async season() {
    const year = this.today().slice(0, 4);
    const [from, to] = [`${year}-01-01`, `${year}-12-31`];
    const counts = Object.fromEntries((await this.repo.countsByStatus(from, to)).map((r) => [r.status, r.count]));
    return {
      season: year,
      scheduled: counts.scheduled ?? 0,
      calledOff: counts.called_off ?? 0,
      done: counts.done ?? 0,
      checkIns: await this.repo.attendanceBetween(from, to),
    };
  }
}
