import { z } from 'zod';
import { defineSetting } from '../settings/settings-service';

const impulseClass = z.string().trim().toUpperCase().regex(/^[A-Z]$/, 'Use one letter per class.');

/**
 * Which motor impulse classes each certification level allows. Associations differ, so the club sets it; the
 * defaults follow the usual split (from memory: model rocketry to G, level 1 adds H and I, level 2 J to L,
 * level 3 M and up).
 */
export const LaunchSettingsSchema = z.object({
  // An empty list would read as "this level flies nothing", which no association means: every level flies model motors.
  classesByLevel: z.record(z.string().trim().min(1).max(16), z.array(impulseClass).min(1, 'List at least one class.').max(26)),
});

export type LaunchSettings = z.infer<typeof LaunchSettingsSchema>;

const upTo = (last: string) => Array.from({ length: last.charCodeAt(0) - 64 }, (_v, i) => String.fromCharCode(65 + i));

export const LAUNCH_SETTINGS = defineSetting<LaunchSettings>('launches', LaunchSettingsSchema, {
  classesByLevel: { none: upTo('G'), L1: upTo('I'), L2: upTo('L'), L3: upTo('O') },
});
