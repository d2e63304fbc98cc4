import { MAIL_LISTS, TOPICS, type MailList, type Topic } from '../../contracts/announcements/topics';

// The list codes are the contract's; the words for them are the server's (forms get them in the answers).
export { MAIL_LISTS, TOPICS, type MailList, type Topic };

/** How each list is named in forms and in the mail footer. */
export const TOPIC_LABELS: Record<MailList, string> = {
  drops: 'new runs and drops',
  launches: 'launch days',
  'build-logs': 'new build logs',
  'club-news': 'club news from the roster',
};

/** Whether a string from outside (a token, a form) names one of the mail lists a person can join. */
export const isMailList = (value: string): value is MailList => (MAIL_LISTS as readonly string[]).includes(value);
