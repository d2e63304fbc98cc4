import { nextSteps } from '../../server/shop/next-steps';

const base = {
  status: 'paid' as const,
  pickup: false,
  runs: [],
  hasStockItems: false,
  clubName: 'Gopher Flats Rocketry Society',
  timeZone: 'America/Winnipeg',
};

describe('nextSteps', () => {
  it('gives the closing time of an open run in the club’s zone, then the printer, then tracking by e-mail', () => {
    // 2026-12-23T03:00Z is 21:00 on December 22 in Winnipeg (CST, UTC-6; IANA tz database, from memory).
    const lines = nextSteps({
      ...base,
      runs: [{ name: 'Season 3 shirt run', state: 'open', closesAt: new Date('2026-12-23T03:00:00Z') }],
    });
    expect(lines[0]).toMatch(/^Season 3 shirt run takes orders until Dec 22, 2026, 9:00 p.m. club time \(Winnipeg\)\./);
    expect(lines[0]).toContain('goes to the printer after that');
    expect(lines.at(-1)).toBe('We e-mail you the carrier and the tracking number the day it ships.');
  });

  it('says where a pickup order is handed out, and that stock items come together with a run', () => {
    const lines = nextSteps({
      ...base,
      pickup: true,
      hasStockItems: true,
      runs: [{ name: 'Season 3 shirt run', state: 'in_production', closesAt: new Date('2026-12-01T00:00:00Z') }],
    });
    expect(lines).toEqual([
      'Season 3 shirt run is at the printer; your order is packed when the prints are back.',
      'In-stock items wait for the printed ones, so everything comes together.',
      'It is handed out at the merch table at the next Gopher Flats Rocketry Society launch: bring this receipt or your order number.',
    ]);
  });

  it('says nothing for an order that is not paid or has shipped', () => {
    expect(nextSteps({ ...base, status: 'failed', hasStockItems: true })).toEqual([]);
    expect(nextSteps({ ...base, status: 'shipped', hasStockItems: true })).toEqual([]);
  });
});
