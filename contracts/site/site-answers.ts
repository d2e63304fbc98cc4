/** What GET /api/site answers: the server types it with this; the app reads it. */

/** The team and club this Padside serves and the club's time zone. */
export interface SiteNamesView {
  teamName: string;
  clubName: string;
  /** A tz database name such as `America/Winnipeg`: every date and time is shown in club time. */
  timeZone: string;
}
