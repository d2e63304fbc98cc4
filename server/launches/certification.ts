import type { LaunchSettings } from '../../contracts/launches/launch-schemas';

/** The level a member has when no high-power certification is recorded (the membership settings' first level). */
export const NO_CERTIFICATION = 'none';

/**
 * The certification level a range officer may rely on. Until memberships record whether a level was verified,
 * the recorded level is the one used; this is the one place to switch to the verified level.
 */
export function verifiedCertificationLevel(membership: { certification_level: string } | undefined): string | null {
  return membership?.certification_level ?? null;
}

/**
 * The impulse classes a verified level allows by the club's setting (a list covers every class up to its largest);
 * null when no level is verified, which covers model-rocket flights only.
 */
export function allowedClassesFor(level: string | null, settings: LaunchSettings): string[] | null {
  if (level === null) return null;
  return settings.classesByLevel[level] ?? settings.classesByLevel[NO_CERTIFICATION] ?? null;
}
