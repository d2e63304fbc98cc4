import { dateInZone, type Clock } from './clock';

/**
 * The club's calendar: "today" as the club reads it, in the club's time zone. Built once in the app's deps and
 * handed to every service that judges dates, so a term ending, a reminder due and a report's "today" all agree.
 */
export class ClubCalendar {
  constructor(
    private readonly clock: Clock,
    readonly timeZone: string,
  ) {}

  /** Today's club date (`YYYY-MM-DD`). */
  today(): string {
    return dateInZone(this.clock.now(), this.timeZone);
  }
}
