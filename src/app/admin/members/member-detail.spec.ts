import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { MemberDetail } from './member-detail';
import type { MemberDetail as MemberDetailView } from '@contracts/membership/staff-member-answers';

const detail: MemberDetailView = {
  member: {
    id: 7,
    memberNumber: '01007',
    status: 'active',
    legalName: 'Odalys Fenwick-Tarrant',
    email: 'odalys@example.test',
    planName: 'Adult',
    termStart: '2026-01-01',
    termEnd: '2026-12-31',
    graceEnds: '2027-01-30',
    renewalOpensOn: '2026-12-01',
    renewalOpen: false,
    planId: 1,
    planCode: 'adult',
    dateOfBirth: '1990-04-02',
    address: '3 Sod House Lane, Gopher Flats, MB',
    phone: '204-555-0131',
    emergencyContact: 'Rhys Fenwick 204-555-0132',
    associationNumber: null,
    associationExpires: null,
    certificationLevel: 'none',
    certificationDate: null,
    waiverVersion: '2026-1',
    waiverAcceptedAt: '2026-01-04T17:00:00Z',
    safetyCodeVersion: '2026-1',
    safetyCodeAcceptedAt: '2026-01-04T17:00:00Z',
    associationVerifiedAt: null,
    certificationVerifiedAt: null,
    waiverCurrent: true,
    autoRenew: false,
    hasSavedCard: false,
    savedCard: null,
    renewalFailed: false,
    mailOptOut: false,
  },
  verifications: { association: null, certification: null },
  familyMembers: [],
  payments: [],
  audit: [],
};

/** Dates on the page follow club time, which SiteNames asks `/api/site` for. */
const flushSiteNames = (http: HttpTestingController) =>
  http
    .match('/api/site')
    .forEach((r) =>
      r.flush({ teamName: 'Nozzle & Nylon', clubName: 'Skywhomp Rocketry Club', timeZone: 'America/Winnipeg' }),
    );

describe('MemberDetail', () => {
  let fixture: ComponentFixture<MemberDetail>;
  let http: HttpTestingController;
  let el: HTMLElement;

  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  };

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(MemberDetail);
    fixture.componentRef.setInput('id', '7');
    fixture.detectChanges();
    http.expectOne('/api/admin/members/7').flush(detail);
    await settle();
    flushSiteNames(http);
    await settle();
    el = fixture.nativeElement as HTMLElement;
  });
  afterEach(() => http.verify());

  const type = (control: string, value: string) => {
    const input = el.querySelector<HTMLInputElement>(`[formcontrolname=${control}]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  };

  it('should send a cash payment typed as "45.00" as 4500 cents, and show the server’s amount message beside the dollars field', async () => {
    type('amount', '45.00');
    type('receiptNumber', 'GF-512');
    el.querySelector<HTMLButtonElement>('form button[type=submit]')!.click();
    const req = http.expectOne('/api/admin/members/7/payments');
    expect(req.request.body).toEqual({ amountCents: 4500, method: 'cash', receiptNumber: 'GF-512' });
    req.flush(
      {
        error: {
          code: 'bad_request',
          message: 'Check the amount.',
          fields: { amountCents: 'Enter the dues for one term.' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    const field = el.querySelector('[formcontrolname=amount]')!.closest('mat-form-field')!;
    expect(field.querySelector('mat-error')?.textContent?.trim()).toBe('Enter the dues for one term.');
  });
});

describe('MemberDetail flying claims', () => {
  let fixture: ComponentFixture<MemberDetail>;
  let http: HttpTestingController;
  let el: HTMLElement;
  const claimed: MemberDetailView = {
    ...detail,
    member: {
      ...detail.member,
      associationNumber: 'NA-2044',
      associationExpires: '2027-03-31',
      certificationLevel: 'L2',
    },
    verifications: {
      association: null,
      certification: { at: '2026-05-02T15:00:00Z', by: 'Tess Treasurer', against: 'Level 2 certificate' },
    },
  };

  const settle = async () => {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
  };

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(MemberDetail);
    fixture.componentRef.setInput('id', '7');
    fixture.detectChanges();
    http.expectOne('/api/admin/members/7').flush(claimed);
    await settle();
    flushSiteNames(http);
    await settle();
    el = fixture.nativeElement as HTMLElement;
  });
  afterEach(() => http.verify());

  it('should show a claim in words and a check with who, when and against what', () => {
    expect(el.querySelector('[data-testid=association-record]')!.textContent).toContain(
      'claimed by the member, not yet checked',
    );
    // Whitespace collapsed as a browser shows it: the template's line breaks are not part of the words.
    expect(el.querySelector('[data-testid=certification-record]')!.textContent!.replace(/\s+/g, ' ')).toContain(
      'checked May 2, 2026 by Tess Treasurer against Level 2 certificate',
    );
  });

  it('should send the document and the values on screen when staff mark the association checked', async () => {
    const button = Array.from(el.querySelectorAll<HTMLButtonElement>('[data-testid=association-record] button')).find(
      (b) => b.textContent?.includes('Mark checked'),
    )!;
    button.click();
    await settle();
    const input = el.querySelector<HTMLInputElement>('[formcontrolname=against]')!;
    input.value = 'association card, seen at the field';
    input.dispatchEvent(new Event('input'));
    el.querySelector<HTMLFormElement>('form[aria-label="Mark the association checked"]')!
      .querySelector<HTMLButtonElement>('button[type=submit]')!
      .click();
    const req = http.expectOne('/api/admin/members/7/verifications');
    expect(req.request.body).toEqual({
      what: 'association',
      against: 'association card, seen at the field',
      associationNumber: 'NA-2044',
      associationExpires: '2027-03-31',
    });
    req.flush(
      {
        error: {
          code: 'record_changed',
          message: 'The record changed since you loaded it; reload the page and check again.',
          fields: { what: 'The record changed since you loaded it.' },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('record changed');
  });
});
