import type { Knex } from 'knex';
import type { Topic } from './topics';

/** One announcement or drop notice, as stored. */
export interface AnnouncementRow {
  id: number;
  kind: 'announcement' | 'drop_notice';
  topic: Topic;
  subject: string;
  markdown: string;
  status: 'draft' | 'sending';
  product_id: number | null;
  run_id: number | null;
  created_by: number | null;
  recipients: number;
  skipped_suppressed: number;
  created_at: Date;
  updated_at: Date;
  sent_at: Date | null;
}

/** How an announcement's mail stands in the outbox. */
export interface DeliveryCounts {
  queued: number;
  sent: number;
  failed: number;
  suppressed: number;
}

/** A run that opened and has had no drop notice yet. */
export interface OpenedRun {
  run_id: number;
  run_name: string;
  product_id: number;
  product_name: string;
  slug: string;
  closes_at: Date;
}

/** SQL for announcements and their delivery counts. */
export class AnnouncementRepository {
  constructor(private readonly db: Knex) {}

  /** Inserts an announcement and returns the stored row. */
  async insert(trx: Knex.Transaction, row: Partial<AnnouncementRow>): Promise<AnnouncementRow> {
    const [created] = await trx('announcements').insert(row).returning('*');
    return created;
  }

  /** Records a run's drop notice; null when the run already has one (another process got there first). */
  async insertDropNotice(trx: Knex.Transaction, row: Partial<AnnouncementRow>): Promise<AnnouncementRow | null> {
    const inserted = await trx('announcements').insert(row).onConflict('run_id').ignore().returning('*');
    return (inserted[0] as AnnouncementRow | undefined) ?? null;
  }

  /** An announcement by id. */
  byId(id: number, db: Knex = this.db): Promise<AnnouncementRow | undefined> {
    return db('announcements').where('id', id).first();
  }

  /** An announcement locked for update, so a change and a send cannot interleave. */
  lockById(trx: Knex.Transaction, id: number): Promise<AnnouncementRow | undefined> {
    return trx('announcements').where('id', id).forUpdate().first();
  }

  /** Writes the changed fields, stamps the change time and returns the stored row. */
  async update(trx: Knex.Transaction, id: number, patch: Partial<AnnouncementRow>): Promise<AnnouncementRow> {
    const [row] = await trx('announcements')
      .where('id', id)
      .update({ ...patch, updated_at: trx.fn.now() })
      .returning('*');
    return row;
  }

  /** One page of announcements in the chosen order (newest first as the tie-break), with the total count. */
  async page(q: {
    page: number;
    pageSize: number;
    sort: 'created' | 'subject' | 'topic';
    dir: 'asc' | 'desc';
  }): Promise<{ rows: AnnouncementRow[]; total: number }> {
    const [{ count }] = await this.db('announcements').count<{ count: number }[]>('* as count');
    const column = { created: 'id', subject: 'subject', topic: 'topic' }[q.sort];
    const rows = await this.db('announcements')
      .orderBy([
        { column, order: q.dir },
        { column: 'id', order: 'desc' },
      ])
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize);
    return { rows, total: count };
  }

  /** Outbox counts per announcement. */
  async counts(ids: number[]): Promise<Map<number, DeliveryCounts>> {
    const out = new Map<number, DeliveryCounts>(
      ids.map((id) => [id, { queued: 0, sent: 0, failed: 0, suppressed: 0 }]),
    );
    if (ids.length === 0) return out;
    const rows = await this.db('outbound_emails')
      .whereIn('announcement_id', ids)
      .groupBy('announcement_id', 'status')
      .select('announcement_id', 'status')
      .count('* as n');
    for (const r of rows as { announcement_id: number; status: keyof DeliveryCounts; n: number }[])
      out.get(r.announcement_id)![r.status] = r.n;
    return out;
  }

  /** Runs open now that opened within the last two days and have no drop notice (older ones are not news). */
  openedRunsWithoutNotice(now: Date): Promise<OpenedRun[]> {
    return this.db('shop_runs as r')
      .join('shop_products as p', 'p.id', 'r.product_id')
      .where('r.opens_at', '<=', now)
      .andWhere('r.opens_at', '>', new Date(now.getTime() - 2 * 86_400_000))
      .andWhere('r.closes_at', '>', now)
      .whereIn('r.state', ['scheduled', 'open'])
      .andWhere('p.active', true)
      .whereNotExists((q) => q.select(1).from('announcements as a').whereRaw('a.run_id = r.id'))
      .orderBy('r.id')
      .select(
        'r.id as run_id',
        'r.name as run_name',
        'p.id as product_id',
        'p.name as product_name',
        'p.slug',
        'r.closes_at',
      );
  }
}
