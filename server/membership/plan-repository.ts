import type { Knex } from 'knex';
import type { PlanRow } from './membership-repository';

type Db = Knex | Knex.Transaction;

/** Reads and writes of the membership plans the club offers. */
export class PlanRepository {
  constructor(private readonly db: Knex) {}

  plans(includeInactive: boolean, db: Db = this.db): Promise<PlanRow[]> {
    return db<PlanRow>('membership_plans')
      .modify((qb) => (includeInactive ? qb : qb.where('active', true)))
      .orderBy([{ column: 'sort_order' }, { column: 'id' }]);
  }

  plan(id: number, db: Db = this.db): Promise<PlanRow | undefined> {
    return db<PlanRow>('membership_plans').where('id', id).first();
  }

  async insertPlan(row: Omit<PlanRow, 'id'>, db: Db = this.db): Promise<PlanRow> {
    const [created] = await db<PlanRow>('membership_plans').insert(row).returning('*');
    return created;
  }

  async updatePlan(id: number, patch: Partial<Omit<PlanRow, 'id'>>, db: Db = this.db): Promise<PlanRow | undefined> {
    const [row] = await db<PlanRow>('membership_plans').where('id', id).update({ ...patch, updated_at: db.fn.now() } as Partial<PlanRow>).returning('*');
    return row;
  }
}
