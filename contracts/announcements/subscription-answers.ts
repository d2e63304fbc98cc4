/** What the subscription routes answer (/api/subscriptions, /api/account/subscriptions): the server types its
 * answers with these; the app reads them. */
import type { MailList, Topic } from './topics';

/** GET /api/subscriptions/wording: the lists and the consent wording the sign-up form shows. */
export interface ConsentWording {
  version: string;
  text: string;
  topics: { code: Topic; label: string }[];
}

/** POST /api/subscriptions: the same answer whatever the address; the confirmation mail follows. */
export interface SignUpAnswer {
  queued: true;
}

/** GET /api/subscriptions/confirm: the address and the lists it confirmed. */
export interface ConfirmedSignUp {
  email: string;
  topics: Topic[];
}

/** What an unsubscribe link stops: GET /api/subscriptions/unsubscribe, and POST's `unsubscribed`. Roster mail
 * links name `club-news`, which is no sign-up topic. */
export interface UnsubscribeTarget {
  email: string;
  topic: MailList;
  label: string;
}

/** One of the signed-in person's lists (GET /api/account/subscriptions). */
export interface MySubscription {
  topic: Topic;
  label: string;
  productId: number | null;
  productName: string | null;
  status: 'pending' | 'confirmed';
  since: string;
  unsubscribeToken: string;
}
