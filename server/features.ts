import type { Feature, Platform } from './platform/feature';

/** Every feature of Padside, in mounting order. Add one line per feature. */
export function buildFeatures(_platform: Platform): Feature[] {
  return [];
}
