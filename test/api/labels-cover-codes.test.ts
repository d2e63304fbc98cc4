import { DELIVERABLE_KIND_LABELS } from '../../contracts/labels/deliverable-kinds';
import {
  FLIGHT_OUTCOME_LABELS,
  FLIGHT_STATUS_LABELS,
  LAUNCH_STATUS_LABELS,
  RECOVERY_LABELS,
} from '../../contracts/labels/launch-statuses';
import {
  DUES_ENTRY_LABELS,
  DUES_PAYMENT_STATUS_LABELS,
  MEMBERSHIP_STATUS_LABELS,
  PLAN_ELIGIBILITY_LABELS,
} from '../../contracts/labels/membership-statuses';
import { MOVEMENT_KIND_LABELS, MOVEMENT_SOURCE_LABELS } from '../../contracts/labels/money-movements';
import { ORDER_STATUS_LABELS } from '../../contracts/labels/order-statuses';
import { PAYMENT_METHOD_LABELS } from '../../contracts/labels/payment-methods';
import { POST_STATUS_LABELS } from '../../contracts/labels/post-states';
import { REFUND_ORIGIN_LABELS, REFUND_STATE_LABELS } from '../../contracts/labels/refund-states';
import { ROLE_LABELS } from '../../contracts/labels/roles';
import { RUN_STATE_LABELS } from '../../contracts/labels/run-states';
import { SHIPPING_METHOD_LABELS } from '../../contracts/labels/shipping-methods';
import { buildTestApp, type TestApp } from '../helpers/test-app';

// The codes the database allows are read from its CHECK constraints, so a migration that adds a code without a
// label fails here rather than showing `snake_case` to a person.
let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

const COVERED: [constraint: string, labels: Readonly<Record<string, string>>][] = [
  ['agreement_deliverables_kind', DELIVERABLE_KIND_LABELS],
  ['shop_runs_state', RUN_STATE_LABELS],
  ['posts_status', POST_STATUS_LABELS],
  ['shop_orders_status', ORDER_STATUS_LABELS],
  ['membership_payments_method', PAYMENT_METHOD_LABELS],
  ['membership_payments_status', DUES_PAYMENT_STATUS_LABELS],
  ['membership_payments_entry', DUES_ENTRY_LABELS],
  ['memberships_status', MEMBERSHIP_STATUS_LABELS],
  ['membership_plans_eligibility', PLAN_ELIGIBILITY_LABELS],
  ['shop_refunds_state', REFUND_STATE_LABELS],
  ['shop_refunds_origin', REFUND_ORIGIN_LABELS],
  ['launches_status', LAUNCH_STATUS_LABELS],
  ['flights_status', FLIGHT_STATUS_LABELS],
  ['flights_outcome', FLIGHT_OUTCOME_LABELS],
  ['flights_recovery', RECOVERY_LABELS],
  ['money_movements_kind', MOVEMENT_KIND_LABELS],
  ['money_movements_source', MOVEMENT_SOURCE_LABELS],
  ['users_roles_known', ROLE_LABELS],
  ['shop_shipping_methods_code', SHIPPING_METHOD_LABELS],
];

async function allowedCodes(constraint: string): Promise<string[]> {
  const row = await t.deps
    .db('pg_constraint')
    .where('conname', constraint)
    .first(t.deps.db.raw('pg_get_constraintdef(oid) AS def'));
  if (!row) throw new Error(`no constraint ${constraint}`);
  return [...String(row.def).matchAll(/'([^']+)'::(?:character varying|text)/g)].map((m) => m[1]);
}

describe('the label maps', () => {
  it.each(COVERED)('label every code %s allows', async (constraint, labels) => {
    const codes = await allowedCodes(constraint);
    expect(codes.length).toBeGreaterThan(1);
    expect(codes.filter((c) => !(c in labels))).toEqual([]);
  });
});
