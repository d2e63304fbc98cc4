import { LaunchSettingsSchema, type LaunchSettings } from '../../contracts/launches/launch-schemas';
import { defineSetting } from '../settings/settings-service';

const upTo = (last: string) => Array.from({ length: last.charCodeAt(0) - 64 }, (_v, i) => String.fromCharCode(65 + i));

/**
 * Which motor impulse classes each certification level allows. Associations differ, so the club sets it; the
 * defaults follow the usual split (from memory: model rocketry to G, level 1 adds H and I, level 2 J to L,
 * level 3 M and up).
 */
export const LAUNCH_SETTINGS = defineSetting<LaunchSettings>('launches', LaunchSettingsSchema, {
  classesByLevel: { none: upTo('G'), L1: upTo('I'), L2: upTo('L'), L3: upTo('O') },
});
