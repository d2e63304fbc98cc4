import { DEFAULT_CERTIFICATION_LEVELS } from '../../contracts/membership/certification-levels';
import { MembershipSettingsSchema, type MembershipSettings } from '../../contracts/membership/club-rules-schemas';
import { defineSetting } from '../settings/settings-service';

export type { MembershipSettings };

export const MEMBERSHIP_SETTINGS = defineSetting<MembershipSettings>('membership', MembershipSettingsSchema, {
  termRule: 'calendar',
  lateSeasonFrom: '09-01',
  graceDays: 30,
  prorate: false,
  waiverVersion: '2026-1',
  waiverText:
    'I take part in club launches at my own risk. I will follow the safety code of your national rocketry association, ' +
    'the local aviation and fire rules, and every instruction of the range safety officer, whose word on the range is final. ' +
    'I will fly only motors my certification allows and will keep my association membership current while I fly.',
  safetyCodeVersion: '2026-1',
  associationName: 'your national rocketry association',
  certificationLevels: [...DEFAULT_CERTIFICATION_LEVELS],
});
