import { DELIVERABLE_KIND_LABELS, deliverableState } from '../../contracts/labels/deliverable-kinds';
import {
  FLIGHT_OUTCOME_LABELS,
  FLIGHT_STATUS_LABELS,
  LAUNCH_STATUS_LABELS,
  RECOVERY_LABELS,
} from '../../contracts/labels/launch-statuses';
import { labelOf, yesNo } from '../../contracts/labels/label-of';
import {
  DUES_ENTRY_LABELS,
  DUES_PAYMENT_STATUS_LABELS,
  MEMBERSHIP_AUDIT_LABELS,
  MEMBERSHIP_STATUS_LABELS,
  PLAN_ELIGIBILITY_LABELS,
} from '../../contracts/labels/membership-statuses';
import { MOVEMENT_KIND_LABELS, MOVEMENT_SOURCE_LABELS } from '../../contracts/labels/money-movements';
import { ORDER_STATUS_LABELS } from '../../contracts/labels/order-statuses';
import { PAYMENT_METHOD_LABELS } from '../../contracts/labels/payment-methods';
import { POST_STATUS_LABELS, POST_VISIBILITY_LABELS, postVisibility } from '../../contracts/labels/post-states';
import { REFUND_ORIGIN_LABELS, REFUND_STATE_LABELS } from '../../contracts/labels/refund-states';
import { ROLE_LABELS } from '../../contracts/labels/roles';
import { RUN_MOVE_LABELS, RUN_STATE_LABELS } from '../../contracts/labels/run-states';
import { SHIPPING_METHOD_LABELS } from '../../contracts/labels/shipping-methods';

const MAPS: Record<string, Readonly<Record<string, string>>> = {
  DELIVERABLE_KIND_LABELS,
  FLIGHT_OUTCOME_LABELS,
  FLIGHT_STATUS_LABELS,
  LAUNCH_STATUS_LABELS,
  RECOVERY_LABELS,
  DUES_ENTRY_LABELS,
  DUES_PAYMENT_STATUS_LABELS,
  MEMBERSHIP_AUDIT_LABELS,
  MEMBERSHIP_STATUS_LABELS,
  PLAN_ELIGIBILITY_LABELS,
  MOVEMENT_KIND_LABELS,
  MOVEMENT_SOURCE_LABELS,
  ORDER_STATUS_LABELS,
  PAYMENT_METHOD_LABELS,
  POST_STATUS_LABELS,
  POST_VISIBILITY_LABELS,
  REFUND_ORIGIN_LABELS,
  REFUND_STATE_LABELS,
  ROLE_LABELS,
  RUN_MOVE_LABELS,
  RUN_STATE_LABELS,
  SHIPPING_METHOD_LABELS,
};

describe('every label map', () => {
  it.each(Object.entries(MAPS))(
    '%s reads as words: a capital first, no underscore, not the code itself',
    (_name, labels) => {
      for (const [code, label] of Object.entries(labels)) {
        expect(label).toMatch(/^[A-Z]/);
        expect(label).not.toMatch(/_/);
        expect(label).not.toBe(code);
      }
    },
  );

  it.each(Object.entries(MAPS))('%s gives each code its own label', (_name, labels) => {
    const values = Object.values(labels);
    expect(new Set(values).size).toBe(values.length);
  });
});

describe('labelOf', () => {
  it('gives the label of a known code', () => {
    expect(labelOf(DELIVERABLE_KIND_LABELS, 'sponsors_page')).toBe('Sponsors page listing');
    expect(labelOf(RUN_STATE_LABELS, 'sold_out')).toBe('Sold out');
  });

  it('turns an unknown code into words rather than show it raw', () => {
    expect(labelOf(RUN_STATE_LABELS, 'back_in_stock')).toBe('Back in stock');
    expect(labelOf(PAYMENT_METHOD_LABELS, 'GIFT-CARD')).toBe('Gift card');
  });

  it('shows nothing for no code', () => {
    expect(labelOf(RUN_STATE_LABELS, null)).toBe('');
  });
});

describe('derived codes', () => {
  it('calls a deliverable done once delivered in full, even after its due date', () => {
    expect(deliverableState({ promised: 2, delivered: 2, overdue: false })).toBe('done');
    expect(deliverableState({ promised: 2, delivered: 1, overdue: true })).toBe('overdue');
    expect(deliverableState({ promised: 2, delivered: 1, overdue: false })).toBe('open');
  });

  it('reads a members-only post as such', () => {
    expect(POST_VISIBILITY_LABELS[postVisibility(true)]).toBe('Members only');
    expect(POST_VISIBILITY_LABELS[postVisibility(false)]).toBe('Everyone');
  });

  it('says yes and no with a capital', () => {
    expect([yesNo(true), yesNo(false)]).toEqual(['Yes', 'No']);
  });
});
