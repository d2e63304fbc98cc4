import type { Knex } from 'knex';
import type { PlanRow } from './membership-repository';

/** Reads and writes of the membership plans the club offers. */
export class PlanRepository {
  constructor(private readonly db: Knex) {}

  /** Every plan, retired ones too, in the order the club lists them. */
  allPlans(): Promise<PlanRow[]> {
    return this.db<PlanRow>('membership_plans').orderBy([{ column: 'sort_order' }, { column: 'id' }]);
  }

  /** The plans a member can join or renew on now, in the order the club lists them. */
  offeredPlans(): Promise<PlanRow[]> {
    return this.db<PlanRow>('membership_plans')
      .where('active', true)
      .orderBy([{ column: 'sort_order' }, { column: 'id' }]);
  }

  /** One plan by id, active or not, since old payments and members still point at retired ones. */
  plan(id: number, db: Knex = this.db): Promise<PlanRow | undefined> {
    return db<PlanRow>('membership_plans').where('id', id).first();
  }

  /** Adds a plan; the unique code index refuses a second plan with the same code. */
  async insertPlan(trx: Knex.Transaction, row: Omit<PlanRow, 'id'>): Promise<PlanRow> {
    const [created] = await trx<PlanRow>('membership_plans').insert(row).returning('*');
    return created;
  }

  /** Writes the given plan columns and the update time. */
  async updatePlan(
    trx: Knex.Transaction,
    id: number,
    patch: Partial<Omit<PlanRow, 'id'>>,
  ): Promise<PlanRow | undefined> {
    const [row] = await trx<PlanRow>('membership_plans')
      .where('id', id)
      .update({ ...patch, updated_at: trx.fn.now() } as Partial<PlanRow>)
      .returning('*');
    return row;
  }
}
