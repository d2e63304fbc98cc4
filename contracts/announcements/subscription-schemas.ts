/** Bodies and queries of the public subscription routes (/api/subscriptions): the server parses with them; the
 * sign-up form takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';
import { TOPICS } from './topics';

/** One of the lists, as every body names it. */
export const TopicField = z.enum(TOPICS, { error: 'Choose a list: drops, launches or build-logs.' });

/** POST /api/subscriptions. */
export const SignUpSchema = z.strictObject({
  email: fields.email,
  topics: z
    .array(TopicField, { error: 'Tick at least one list.' })
    .min(1, 'Tick at least one list.')
    .max(TOPICS.length, 'Each list once.'),
  productId: fields.id.optional(),
  page: z.enum(['home', 'product', 'account'], { error: 'Unknown page.' }).default('home'),
});

/** `?token=` of the confirmation and unsubscribe links. */
export const TokenQuery = z.strictObject({
  token: z
    .string({ error: 'The link is missing its token.' })
    .min(1, 'The link is missing its token.')
    .max(600, 'Not a valid link.'),
});

/** A sign-up as the server takes it (the page filled in). */
export type SignUp = z.infer<typeof SignUpSchema>;
/** A sign-up as a form sends it. */
export type SignUpInput = z.input<typeof SignUpSchema>;
/** The page a sign-up form sits on. */
export type SignUpPage = SignUp['page'];
