/** Request bodies and queries of the launch and flight routes: the server parses with them; the app takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';
import { FLIGHT_OUTCOMES, RECOVERY_METHODS } from '../labels/launch-statuses';

const hhmm = z
  .string({ error: 'Enter a time as HH:MM.' })
  .regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use the form HH:MM (24-hour).');

const SiteSchema = z.object({
  name: z.string({ error: 'Name the site.' }).trim().min(1, 'Name the site.').max(120, 'Too long.'),
  address: fields.optionalText(400),
  lat: z
    .number({ error: 'Latitude is a number.' })
    .min(-90, 'Between -90 and 90.')
    .max(90, 'Between -90 and 90.')
    .nullish(),
  lon: z
    .number({ error: 'Longitude is a number.' })
    .min(-180, 'Between -180 and 180.')
    .max(180, 'Between -180 and 180.')
    .nullish(),
});

const LaunchFields = z.object({
  title: z
    .string({ error: 'Give the launch a title.' })
    .trim()
    .min(1, 'Give the launch a title.')
    .max(120, 'Too long.'),
  date: fields.date,
  startsAt: hhmm,
  endsAt: hhmm,
  site: SiteSchema,
  ceilingMetres: z
    .number({ error: 'Metres, a whole number.' })
    .int('Metres, a whole number.')
    .positive('Must be positive.')
    .max(30000, 'At most 30,000 m.')
    .nullish(),
  waiverVersion: fields.optionalText(32),
  notes: z.string().trim().max(4000, 'Too long.').nullish(),
});

const windowRule = (v: { startsAt?: string; endsAt?: string }) => !v.startsAt || !v.endsAt || v.startsAt < v.endsAt;
const windowIssue = { message: 'The window must end after it starts.', path: ['endsAt'] };

/** POST /api/admin/launches. */
export const NewLaunchSchema = LaunchFields.refine(windowRule, windowIssue);

/** PATCH /api/admin/launches/:id: any of the fields. */
export const LaunchPatchSchema = LaunchFields.partial().refine(windowRule, windowIssue);

/** POST /api/admin/launches/:id/call-off. */
export const CallOffSchema = z.object({
  reason: z
    .string({ error: 'Say why (wind, fire risk, airspace...).' })
    .trim()
    .min(1, 'Say why (wind, fire risk, airspace...).')
    .max(400, 'Too long.'),
});

/** GET /api/launches. */
export const ListQuery = z.object({ from: fields.date.optional(), to: fields.date.optional() });

/** POST /api/launches/:id/rsvp. */
export const RsvpSchema = z.object({ going: z.boolean({ error: 'Say whether you are coming.' }) });

/** POST /api/launches/:id/check-in. */
export const CheckInSchema = z.object({
  token: z
    .string({ error: 'Scan or paste the member card code.' })
    .trim()
    .min(1, 'Scan or paste the member card code.')
    .max(500),
});

/** POST /api/launches/:id/flights. */
export const FlightSchema = z.object({
  rocketName: z.string({ error: 'Name the rocket.' }).trim().min(1, 'Name the rocket.').max(120, 'Too long.'),
  liftoffMassGrams: z
    .number({ error: 'Liftoff mass in grams.' })
    .int('Whole grams.')
    .positive('Must be positive.')
    .max(200000, 'At most 200 kg.'),
  motors: z
    .array(z.string({ error: 'Type the designation.' }).trim().min(1, 'Type the designation.').max(40, 'Too long.'), {
      error: 'List the motor designations.',
    })
    .min(1, 'At least one motor.')
    .max(12, 'At most 12 motors.'),
  expectedAltitudeMetres: z
    .number({ error: 'Metres, a whole number.' })
    .int('Metres, a whole number.')
    .positive('Must be positive.')
    .max(200000)
    .nullish(),
  recovery: z.enum(RECOVERY_METHODS, { error: 'Choose parachute, streamer or dual deployment.' }).nullish(),
  postSlug: z
    .string()
    .trim()
    .max(120)
    .regex(/^[a-z0-9-]*$/, 'Use the build log address (letters, digits, dashes).')
    .transform((v) => v || null)
    .nullish(),
  pad: fields.optionalText(16),
  notes: z.string().trim().max(2000, 'Too long.').nullish(),
});

/** POST /api/admin/flights/:id/decision. */
export const DecisionSchema = z.object({
  approve: z.boolean({ error: 'Approve or send back.' }),
  reason: fields.optionalText(400),
});

/** POST /api/admin/flights/:id/outcome. */
export const OutcomeSchema = z.object({
  outcome: z.enum(FLIGHT_OUTCOMES, { error: 'Choose how the flight ended.' }),
  notes: fields.optionalText(2000),
});

const impulseClass = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]$/, 'Use one letter per class.');

/** PUT /api/admin/launches/settings: which motor impulse classes each certification level allows. */
export const LaunchSettingsSchema = z.object({
  // An empty list would read as "this level flies nothing", which no association means: every level flies model motors.
  classesByLevel: z.record(
    z.string().trim().min(1).max(16),
    z.array(impulseClass).min(1, 'List at least one class.').max(26),
  ),
});

/** A launch as staff write it. */
export type LaunchInput = z.input<typeof NewLaunchSchema>;
/** A flight card as the flyer files it. */
export type FlightInput = z.input<typeof FlightSchema>;
/** The impulse classes each certification level allows (a club setting: associations differ). */
export type LaunchSettings = z.infer<typeof LaunchSettingsSchema>;
