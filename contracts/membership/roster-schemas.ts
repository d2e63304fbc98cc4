/** The staff roster's query and roster e-mail body: the server parses with them; the console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';

/** The columns the roster table sorts by. */
export const ROSTER_SORT_KEYS = ['memberNumber', 'name', 'termEnd', 'status', 'plan', 'associationExpires'] as const;
export type RosterSortKey = (typeof ROSTER_SORT_KEYS)[number];

// The console's filter form sends '' for a filter not set.
const unset = () => z.literal('').transform(() => undefined);

// Strict: these filters choose whom an e-mail goes to and what an export holds, so a misspelt key must not
// quietly widen the choice to every member.
/** GET /api/admin/members and its CSV export. */
export const RosterQuerySchema = z.strictObject({
  status: z.enum(['pending', 'active', 'lapsing', 'lapsed']).optional().or(unset()),
  planId: fields.id.optional().or(unset()),
  certificationLevel: z
    .string()
    .trim()
    .max(16)
    .optional()
    .transform((v) => v || undefined),
  associationExpiresBefore: fields.date.optional().or(unset()),
  q: z
    .string()
    .trim()
    .max(100)
    .optional()
    .transform((v) => v || undefined),
  sort: z.enum(ROSTER_SORT_KEYS).default('memberNumber'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: fields.page,
  pageSize: fields.pageSize,
});

/** POST /api/admin/members/email: a message to the members the filters choose. */
export const RosterEmailBody = z.strictObject({
  filters: RosterQuerySchema.default(RosterQuerySchema.parse({})),
  subject: z.string().trim().min(1, 'Subject is required.').max(200),
  text: z.string().trim().min(1, 'Message is required.').max(20000),
  // News is promotional and follows the consent rules; club business (dues, launches replied to) is transactional.
  purpose: z.enum(['news', 'club-business'], { error: 'Choose news or club business.' }).default('news'),
});

type ParsedRosterQuery = z.infer<typeof RosterQuerySchema>;
/** Which members a roster query chooses and how they are sorted: the query without its paging. */
export type RosterQuery = Omit<ParsedRosterQuery, 'page' | 'pageSize'>;
/** The roster query as the console's filter form holds it: every field present, '' for a filter not set. */
export type RosterFormQuery = {
  [K in keyof ParsedRosterQuery]-?: undefined extends ParsedRosterQuery[K]
    ? Exclude<ParsedRosterQuery[K], undefined> | ''
    : ParsedRosterQuery[K];
};
/** Why a roster e-mail is sent, which decides the consent rules it follows. */
export type RosterMailPurpose = z.infer<typeof RosterEmailBody>['purpose'];
