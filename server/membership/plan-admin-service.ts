import type { Knex } from 'knex';
import { conflict, notFound } from '../platform/app-error';
import type { SettingsService } from '../settings/settings-service';
import type { MembershipRepository } from './membership-repository';
import { MEMBERSHIP_SETTINGS, type MembershipSettings } from './membership-settings';
import { planView } from './membership-views';
import type { PlanRepository } from './plan-repository';
import type { NewPlanInput, PlanChanges } from '../../contracts/membership/staff-member-schemas';
import type { StaffPlanAnswer, StaffPlanList } from '../../contracts/membership/staff-member-answers';

/** The treasurer's plans and the club's membership rules. */
export class PlanAdminService {
  constructor(
    private readonly db: Knex,
    private readonly repo: MembershipRepository,
    private readonly planRepo: PlanRepository,
    private readonly settings: SettingsService,
  ) {}

  /** Every plan, retired ones too, as the treasurer edits them. */
  async plans(): Promise<StaffPlanList> {
    return { items: (await this.planRepo.allPlans()).map(planView) };
  }

  /** Plans are never deleted: payments and members point at them, so staff switch one off instead. */
  async createPlan(input: NewPlanInput): Promise<StaffPlanAnswer> {
    const taken = () =>
      conflict('duplicate_code', 'A plan with that code exists.', { code: 'A plan with that code exists.' });
    if ((await this.planRepo.allPlans()).some((p) => p.code === input.code)) throw taken();
    try {
      const row = await this.db.transaction((trx) =>
        this.planRepo.insertPlan(trx, {
          code: input.code,
          name: input.name,
          description: input.description,
          eligibility: input.eligibility,
          dues_cents: input.duesCents,
          joining_fee_cents: input.joiningFeeCents,
          active: input.active,
          sort_order: input.sortOrder,
        }),
      );
      return { plan: planView(row) };
    } catch (err) {
      // Two staff adding the same code at once: the unique index decides.
      if ((err as { code?: string }).code === '23505') throw taken();
      throw err;
    }
  }

  /** Changes the given fields of a plan; prices apply to payments from now on, never to terms already paid. */
  async updatePlan(id: number, input: Partial<PlanChanges>): Promise<StaffPlanAnswer> {
    const row = await this.db.transaction((trx) =>
      this.planRepo.updatePlan(trx, id, {
        ...(input.name !== undefined ? { name: input.name } : {}),
        ...(input.description !== undefined ? { description: input.description } : {}),
        ...(input.duesCents !== undefined ? { dues_cents: input.duesCents } : {}),
        ...(input.joiningFeeCents !== undefined ? { joining_fee_cents: input.joiningFeeCents } : {}),
        ...(input.active !== undefined ? { active: input.active } : {}),
        ...(input.sortOrder !== undefined ? { sort_order: input.sortOrder } : {}),
      }),
    );
    if (!row) throw notFound('No such plan.');
    return { plan: planView(row) };
  }

  /** The membership settings as stored, for the treasurer's settings form. */
  async getSettings(): Promise<{ settings: MembershipSettings }> {
    return { settings: await this.settings.get(MEMBERSHIP_SETTINGS) };
  }

  /** Saves the club rules; a certification level still on a member's record cannot leave the list. */
  async putSettings(value: MembershipSettings): Promise<{ settings: MembershipSettings }> {
    const held = await this.repo.levelsHeldOutside(value.certificationLevels.map((l) => l.code));
    if (held.length) {
      const list = held
        .map((h) => `${h.certification_level} (${h.count} ${h.count === 1 ? 'member' : 'members'})`)
        .join(', ');
      throw conflict('level_in_use', `Members still hold ${list}. Change their records first, or keep the level.`, {
        certificationLevels: `Still held: ${list}.`,
      });
    }
    return { settings: await this.settings.put(MEMBERSHIP_SETTINGS, value) };
  }
}
