import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { SessionStore } from '../core/session-store';
import { SiteNames } from '../core/site-names';

/** One kind of personal data: what it is, why Padside keeps it, and for how long. */
interface HeldData {
  what: string;
  why: string;
  kept: string;
}

/**
 * Retention as the server applies it: sessions end 14 days after the last visit (server/platform/session.ts), familiar
 * sign-in addresses are dropped 180 days after their last use (server/auth/lockout-policy.ts). The six years for the
 * books is the tax authority's general rule for business records (from memory), so the page marks it for checking.
 * The page's 30 days to answer a request is the federal law's time limit for access requests (from memory).
 */
const HELD: HeldData[] = [
  {
    what: 'Account: e-mail, password (stored only as a one-way hash), display name, roles, mail preference',
    why: 'To sign you in and show your name where you take part',
    kept: 'Until you delete your account',
  },
  {
    what: 'Orders: items, shipping name and address, e-mail, amounts, tax, refunds, tracking number',
    why: 'To ship what you bought, answer questions about it, and keep the books',
    kept: 'Amounts and tax: six years after the tax year ends*. Name, e-mail and address: until you delete your account',
  },
  {
    what: 'Membership: legal name, date of birth, address, phone, emergency contact, association number, certification, waiver acceptance',
    why: 'To run the club, check who may fly what, and reach someone if you are hurt at a launch',
    kept: 'Until you delete your account (ask the treasurer to remove a lapsed record sooner)',
  },
  {
    what: 'Dues payments and refunds',
    why: 'Receipts and the books',
    kept: 'Six years after the tax year ends*, without your details once the account is deleted',
  },
  {
    what: 'Saved card for dues (at the card processor; Padside sees only the brand and last four digits)',
    why: 'To renew dues automatically when you ask for it',
    kept: 'Until you turn auto-renew off with a new card, or delete your account',
  },
  {
    what: 'Launch replies, check-ins, flight cards and altimeter logs',
    why: 'To plan launch days and keep the club’s range record of what flew',
    kept: 'Replies: until you delete your account. Check-ins and flight cards: kept as the range record, without your name once the account is deleted',
  },
  {
    what: 'Sign-ins: addresses you signed in from, failed attempts, open sessions',
    why: 'To keep your account safe without locking you out of the places you usually use',
    kept: 'Addresses: 180 days after last use. Failed attempts: until the next good sign-in. Sessions: 14 days after your last visit',
  },
  {
    what: 'E-mails sent to you (subject and delivery state)',
    why: 'To resend a receipt and find out why a message did not arrive',
    kept: 'Until you delete your account',
  },
];

/** The public privacy page: what is collected and why, who processes it, how long it is kept, and how to ask. */
@Component({
  selector: 'ps-privacy-page',
  imports: [RouterLink],
  templateUrl: './privacy-page.html',
  styles: `
    .ps-page {
      max-width: 860px;
    }
    table {
      border-collapse: collapse;
      width: 100%;
      margin: 8px 0 16px;
    }
    th,
    td {
      border: 1px solid var(--mat-sys-outline-variant);
      padding: 8px;
      text-align: left;
      vertical-align: top;
    }
    thead th {
      background: var(--mat-sys-surface-container);
    }
    @media (max-width: 640px) {
      thead {
        position: absolute;
        width: 1px;
        height: 1px;
        overflow: hidden;
        clip: rect(0 0 0 0);
      }
      tr,
      td,
      th {
        display: block;
        border: none;
        padding: 4px 0;
      }
      tbody tr {
        border-top: 1px solid var(--mat-sys-outline-variant);
        padding: 8px 0;
      }
      td::before {
        content: attr(data-label) ': ';
        font-weight: 600;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrivacyPage {
  protected readonly site = inject(SiteNames);
  protected readonly session = inject(SessionStore);
  protected readonly held = HELD;
}
