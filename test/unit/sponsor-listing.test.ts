import { ledgerLines } from '../../server/sponsors/sponsor-ledger';

const listing = { id: 1, kind: 'sponsors_page' as const, quantity: 1, dueOn: '2026-06-30', delivered: 0 };

describe('ledgerLines with a standing sponsors-page listing', () => {
  it('counts the listing in full while the sponsor stands on the page', () => {
    expect(ledgerLines([{ ...listing, listedNow: true }], '2026-11-20')).toEqual([
      { id: 1, kind: 'sponsors_page', promised: 1, delivered: 1, dueOn: '2026-06-30', overdue: false, listedNow: true },
    ]);
  });

  it('leaves it late once the sponsor is off the page and nothing was recorded', () => {
    expect(ledgerLines([{ ...listing, listedNow: false }], '2026-11-20')[0]).toMatchObject({
      delivered: 0,
      overdue: true,
      listedNow: false,
    });
  });

  it('keeps a count recorded by hand above the promise as it is', () => {
    expect(ledgerLines([{ ...listing, delivered: 2, listedNow: true }], '2026-11-20')[0]).toMatchObject({
      delivered: 2,
      promised: 1,
    });
  });

  it('gives no other kind of promise credit for standing on the page', () => {
    expect(ledgerLines([{ ...listing, kind: 'video_mention', listedNow: true }], '2026-11-20')[0]).toMatchObject({
      delivered: 0,
      overdue: true,
      listedNow: false,
    });
  });
});
