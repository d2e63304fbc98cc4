import { dateInZone, type Clock } from '../platform/clock';
import type { CheckInTokens } from '../membership/check-in-token';
import { termPolicy } from '../membership/dues-settlement';
import type { MembershipRepository, MembershipRow } from '../membership/membership-repository';
import { MEMBERSHIP_SETTINGS } from '../membership/membership-settings';
import { liveStatus } from '../membership/membership-views';
import type { SettingsService } from '../settings/settings-service';
import { verifiedCertificationLevel } from './certification';

/** A member as the range table sees them. */
export interface Flyer {
  userId: number;
  memberNumber: string;
  name: string;
  status: string;
  /** Dues paid (or inside the grace period) today. */
  current: boolean;
  certificationLevel: string | null;
}

/** Reads a member's standing through the membership feature's own rules (status by the dates, the card token). */
export class FlyerStanding {
  constructor(
    private readonly memberships: MembershipRepository,
    private readonly tokens: CheckInTokens,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
    private readonly timeZone: string,
  ) {}

  /** The member a card token names, or null for a token that does not verify or a membership not yet paid. */
  async byToken(token: string): Promise<Flyer | null> {
    const verified = this.tokens.verify(token);
    const m = verified ? await this.memberships.byNumber(verified.memberNumber) : undefined;
    return m ? this.view(m) : null;
  }

  /** The standing of a signed-in member, or null for someone without a paid membership. */
  async byUser(userId: number): Promise<Flyer | null> {
    const m = await this.memberships.byUser(userId);
    return m ? this.view(m) : null;
  }

  private async view(m: MembershipRow): Promise<Flyer | null> {
    if (m.status === 'pending') return null;
    const status = liveStatus(
      m,
      dateInZone(this.clock.now(), this.timeZone),
      termPolicy(await this.settings.get(MEMBERSHIP_SETTINGS)),
    );
    return {
      userId: m.user_id,
      memberNumber: m.member_number,
      name: m.legal_name,
      status,
      current: status === 'active' || status === 'lapsing',
      certificationLevel: verifiedCertificationLevel(m),
    };
  }
}
