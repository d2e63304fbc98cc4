/** The club's membership rules as staff save them (PUT /api/admin/members/settings) and every answer reads them. */
import { z } from 'zod';

/** Certification levels a member can record; associations differ, so staff can change the list. */
const levelCode = z
  .string()
  .trim()
  .min(1)
  .max(16)
  .regex(/^[a-z0-9-]+$/i, 'Use letters, digits and dashes.');

/**
 * The club's membership rules. The late-season date (joining from it covers the rest of the year and all of next)
 * is common club practice, no source; the demo club uses Sep 1 and a 30-day grace.
 */
export const MembershipSettingsSchema = z.object({
  termRule: z.enum(['calendar', 'anniversary']),
  lateSeasonFrom: z.string().regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'Use MM-DD.'),
  graceDays: z.number().int().min(0).max(180),
  prorate: z.boolean(),
  waiverVersion: z.string().trim().min(1).max(32),
  waiverText: z.string().trim().min(1).max(8000),
  safetyCodeVersion: z.string().trim().min(1).max(32),
  associationName: z.string().trim().min(1).max(120),
  certificationLevels: z
    .array(z.object({ code: levelCode, label: z.string().trim().min(1).max(80) }))
    .min(1)
    .max(12),
});

export type MembershipSettings = z.infer<typeof MembershipSettingsSchema>;

/** The level a member has when they give none; joining without a level records it, so it cannot go. */
const NO_CERTIFICATION = 'none';

/**
 * What staff may save. Stricter than the stored schema on purpose: a list saved before these rules must still
 * load, or every membership page would fail.
 */
export const MembershipSettingsInputSchema = MembershipSettingsSchema.superRefine((s, ctx) => {
  if (s.certificationLevels[0]?.code !== NO_CERTIFICATION) {
    ctx.addIssue({
      code: 'custom',
      path: ['certificationLevels', 0, 'code'],
      message: `The first level must be "${NO_CERTIFICATION}": members who give no level get it.`,
    });
  }
  // Codes are matched exactly, but "l1" beside "L1" would read as one level on every screen.
  const seen = new Set<string>();
  s.certificationLevels.forEach((l, i) => {
    const key = l.code.toLowerCase();
    if (seen.has(key))
      ctx.addIssue({
        code: 'custom',
        path: ['certificationLevels', i, 'code'],
        message: 'This code is already in the list.',
      });
    seen.add(key);
  });
});
