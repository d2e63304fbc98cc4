/** The announcement lists people can ask for. */
export const TOPICS = ['drops', 'launches', 'build-logs'] as const;
export type Topic = (typeof TOPICS)[number];

/**
 * Every list a commercial mail can belong to: the sign-up topics, and the promotional roster mail members get under
 * their membership's implied consent. Each has its own unsubscribe link and suppression.
 */
export const MAIL_LISTS = [...TOPICS, 'club-news'] as const;
export type MailList = (typeof MAIL_LISTS)[number];

/** How each list is named in forms and in the mail footer. */
export const TOPIC_LABELS: Record<MailList, string> = {
  drops: 'new runs and drops',
  launches: 'launch days',
  'build-logs': 'new build logs',
  'club-news': 'club news from the roster',
};

/** Whether a string from outside (a token, a form) names one of the mail lists a person can join. */
export const isMailList = (value: string): value is MailList => (MAIL_LISTS as readonly string[]).includes(value);
