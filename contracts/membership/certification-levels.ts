/**
 * The high-power certification levels a new club starts with, "none" first (members who give no level get it). The
 * club renames or trims them in its rules; the levels themselves are the national associations' (from memory).
 */
export const DEFAULT_CERTIFICATION_LEVELS: readonly { code: string; label: string }[] = [
  { code: 'none', label: 'No high-power certification' },
  { code: 'L1', label: 'Level 1' },
  { code: 'L2', label: 'Level 2' },
  { code: 'L3', label: 'Level 3' },
];
