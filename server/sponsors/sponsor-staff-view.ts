import type { Role } from '../platform/roles';
import type { AgreementView } from './sponsor-views';

/** The roles that see what a sponsor gives (cash, declared in-kind values) and how to reach its contacts. */
export const SPONSOR_MONEY_ROLES: readonly Role[] = ['treasurer', 'admin'];

/** True when the caller may see sponsor money and contact e-mails. */
export const seesSponsorMoney = (roles: readonly Role[]): boolean => roles.some((r) => SPONSOR_MONEY_ROLES.includes(r));

/** What an editor needs of an agreement: the deliverables to credit, not the money or the deal's note. */
export function deliverablesOnly(a: AgreementView) {
  return {
    id: a.id,
    season: a.season,
    deliverables: a.deliverables,
    byKind: a.byKind,
    overdue: a.overdue,
    nextDue: a.nextDue,
  };
}

/** A sponsor row without its season total, for callers who do not see money. */
export function withoutTotal<T extends { seasonTotalCents: number }>(row: T): Omit<T, 'seasonTotalCents'> {
  const { seasonTotalCents: _hidden, ...rest } = row;
  return rest;
}

/** A contact without the e-mail address, for callers who do not see contact details. */
export function withoutEmail<T extends { email: string }>(contact: T): Omit<T, 'email'> {
  const { email: _hidden, ...rest } = contact;
  return rest;
}
