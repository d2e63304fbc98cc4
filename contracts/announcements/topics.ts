/** The announcement lists people can ask for. */
export const TOPICS = ['drops', 'launches', 'build-logs'] as const;
export type Topic = (typeof TOPICS)[number];

/**
 * Every list a commercial mail can belong to: the sign-up topics, and the promotional roster mail members get under
 * their membership's implied consent. Each has its own unsubscribe link and suppression.
 */
export const MAIL_LISTS = [...TOPICS, 'club-news'] as const;
export type MailList = (typeof MAIL_LISTS)[number];
