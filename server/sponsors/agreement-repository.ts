import type { Knex } from 'knex';
import type { DeliverableKind } from './sponsor-ledger';

export interface AgreementRow {
  id: number;
  sponsor_id: number;
  season: string;
  cash_cents: number;
  cash_received_on: string | null;
  cash_movement_id: number | null;
  note: string | null;
  tax_treatment: 'promotion' | 'gift';
  tax_province: string | null;
  created_at: Date;
}

export interface InKindRow {
  id: number;
  agreement_id: number;
  description: string;
  value_cents: number;
  received_on: string | null;
}

export interface DeliverableRow {
  id: number;
  agreement_id: number;
  sponsor_id: number;
  kind: DeliverableKind;
  quantity: number;
  due_on: string;
  delivered: number;
  season: string;
}

/** Plain reads and writes of agreements, their in-kind items and their deliverables (`sponsor_agreements`, `agreement_in_kind`, `agreement_deliverables`). */
export class AgreementRepository {
  constructor(private readonly db: Knex) {}

  /** Records a season's agreement in the caller's transaction, so its in-kind items and deliverables commit with it. */
  async insertAgreement(
    trx: Knex.Transaction,
    a: {
      sponsorId: number;
      season: string;
      cashCents: number;
      cashReceivedOn: string | null;
      note: string | null;
      taxTreatment: 'promotion' | 'gift';
      taxProvince: string | null;
    },
  ): Promise<number> {
    const [row] = await trx('sponsor_agreements')
      .insert({
        sponsor_id: a.sponsorId,
        season: a.season,
        cash_cents: a.cashCents,
        cash_received_on: a.cashReceivedOn,
        note: a.note,
        tax_treatment: a.taxTreatment,
        tax_province: a.taxProvince,
      })
      .returning('id');
    return row.id;
  }

  /** An agreement, locked for the transaction, so two staff changing it take turns. */
  async lockAgreement(trx: Knex.Transaction, id: number): Promise<AgreementRow | undefined> {
    return trx<AgreementRow>('sponsor_agreements').where('id', id).forUpdate().first();
  }

  /** Sets how an agreement is taxed. */
  async setTaxTreatment(
    trx: Knex.Transaction,
    id: number,
    treatment: 'promotion' | 'gift',
    province: string | null,
  ): Promise<void> {
    await trx('sponsor_agreements').where('id', id).update({ tax_treatment: treatment, tax_province: province });
  }

  /** Records the goods and services an agreement brings, in the agreement's transaction. */
  async insertInKind(
    trx: Knex.Transaction,
    agreementId: number,
    items: readonly { description: string; valueCents: number; receivedOn: string | null }[],
  ): Promise<void> {
    if (items.length)
      await trx('agreement_in_kind').insert(
        items.map((i) => ({
          agreement_id: agreementId,
          description: i.description,
          value_cents: i.valueCents,
          received_on: i.receivedOn,
        })),
      );
  }

  /** Records what the club promised in return, in the agreement's transaction. */
  async insertDeliverables(
    trx: Knex.Transaction,
    agreementId: number,
    items: readonly { kind: DeliverableKind; quantity: number; dueOn: string }[],
  ): Promise<void> {
    if (items.length)
      await trx('agreement_deliverables').insert(
        items.map((d) => ({ agreement_id: agreementId, kind: d.kind, quantity: d.quantity, due_on: d.dueOn })),
      );
  }

  /** One agreement with its cash-received day as `YYYY-MM-DD`. */
  agreementById(id: number, trx: Knex = this.db): Promise<AgreementRow | undefined> {
    return trx<AgreementRow>('sponsor_agreements')
      .where('id', id)
      .first('*', trx.raw("to_char(cash_received_on, 'YYYY-MM-DD') as cash_received_on"));
  }

  /** Records the day the cash arrived and its money movement, in the transaction that books it. */
  async markCashReceived(
    trx: Knex.Transaction,
    id: number,
    receivedOn: string,
    movementId: number | null,
  ): Promise<void> {
    await trx('sponsor_agreements')
      .where('id', id)
      .update({ cash_received_on: receivedOn, cash_movement_id: movementId });
  }

  /** Agreements of one sponsor, or of everyone when `sponsorId` is null. */
  agreements(sponsorId: number | null, trx: Knex = this.db): Promise<AgreementRow[]> {
    return trx<AgreementRow>('sponsor_agreements')
      .modify((q) => sponsorId !== null && q.where('sponsor_id', sponsorId))
      .select('*', trx.raw("to_char(cash_received_on, 'YYYY-MM-DD') as cash_received_on"))
      .orderBy([
        { column: 'season', order: 'desc' },
        { column: 'id', order: 'desc' },
      ]);
  }

  /** The in-kind items of these agreements, with received days as `YYYY-MM-DD`. */
  inKind(agreementIds: readonly number[], trx: Knex = this.db): Promise<InKindRow[]> {
    if (!agreementIds.length) return Promise.resolve([]);
    return trx<InKindRow>('agreement_in_kind')
      .whereIn('agreement_id', agreementIds)
      .select('*', trx.raw("to_char(received_on, 'YYYY-MM-DD') as received_on"))
      .orderBy('id');
  }

  /** Deliverables with their live credit counts, of one sponsor or (null) of every sponsor. */
  deliverables(sponsorId: number | null, trx: Knex = this.db): Promise<DeliverableRow[]> {
    return trx('agreement_deliverables as d')
      .join('sponsor_agreements as a', 'a.id', 'd.agreement_id')
      .modify((q) => sponsorId !== null && q.where('a.sponsor_id', sponsorId))
      .select(
        'd.id',
        'd.agreement_id',
        'a.sponsor_id',
        'a.season',
        'd.kind',
        'd.quantity',
        trx.raw("to_char(d.due_on, 'YYYY-MM-DD') as due_on"),
        trx.raw(
          '(SELECT count(*) FROM sponsor_credits c WHERE c.deliverable_id = d.id AND c.withdrawn_at IS NULL) as delivered',
        ),
      )
      .orderBy([{ column: 'd.due_on' }, { column: 'd.id' }]);
  }

  /** The sponsor each of these deliverables was promised to, by deliverable id (unknown ids are left out). */
  async deliverableSponsors(deliverableIds: readonly number[], trx: Knex = this.db): Promise<Map<number, number>> {
    if (!deliverableIds.length) return new Map();
    const rows: { id: number; sponsor_id: number }[] = await trx('agreement_deliverables as d')
      .join('sponsor_agreements as a', 'a.id', 'd.agreement_id')
      .whereIn('d.id', deliverableIds)
      .select('d.id', 'a.sponsor_id');
    return new Map(rows.map((r) => [Number(r.id), Number(r.sponsor_id)]));
  }

  /** Season totals per sponsor id: cash plus declared in-kind value. */
  async seasonTotals(season: string, trx: Knex = this.db): Promise<Map<number, number>> {
    const rows = await trx('sponsor_agreements as a')
      .where('a.season', season)
      .select(
        'a.sponsor_id',
        trx.raw(
          'sum(a.cash_cents + coalesce((SELECT sum(value_cents) FROM agreement_in_kind i WHERE i.agreement_id = a.id), 0))::bigint as total',
        ),
      )
      .groupBy('a.sponsor_id');
    return new Map(rows.map((r: { sponsor_id: number; total: number }) => [r.sponsor_id, r.total]));
  }
}
