import { needsHazardNotice } from '../../server/build-logs/hazard-rule';
import { slugify, uniqueSlug } from '../../server/platform/slug';
import { deliverableToCredit, ledgerLines, nextDue, summaryByKind } from '../../server/sponsors/sponsor-ledger';
import { seasonOf, tierFor } from '../../server/sponsors/sponsor-tiers';

const TIERS = [
  { name: 'Launch Pad', minCents: 0 },
  { name: 'Boost Phase', minCents: 50_000 },
  { name: 'Apogee', minCents: 150_000 },
];

describe('tierFor (thresholds are staff settings; "at the threshold reaches it" is common practice, no source)', () => {
  it('places totals below, at and above each threshold', () => {
    expect([49_999, 50_000, 50_001, 149_999, 150_000, 0].map((c) => tierFor(c, TIERS)?.name)).toEqual([
      'Launch Pad',
      'Boost Phase',
      'Boost Phase',
      'Boost Phase',
      'Apogee',
      'Launch Pad',
    ]);
  });
  it('gives no tier below the lowest threshold, whatever the order of the list', () => {
    expect(
      tierFor(99, [
        { name: 'B', minCents: 500 },
        { name: 'A', minCents: 100 },
      ]),
    ).toBeNull();
    expect(
      tierFor(600, [
        { name: 'B', minCents: 500 },
        { name: 'A', minCents: 100 },
      ])?.name,
    ).toBe('B');
  });
  it('reads the season from the club date', () => {
    expect(seasonOf('2026-12-31')).toBe('2026');
  });
});

describe('ledgerLines', () => {
  const d = (
    id: number,
    kind: 'build_log_credit' | 'video_mention',
    quantity: number,
    dueOn: string,
    delivered: number,
  ) => ({ id, kind, quantity, dueOn, delivered });

  it('marks short deliverables overdue only after the due date', () => {
    const lines = ledgerLines(
      [
        d(1, 'build_log_credit', 2, '2026-11-20', 1),
        d(2, 'build_log_credit', 1, '2026-11-19', 1),
        d(3, 'video_mention', 1, '2026-11-19', 0),
      ],
      '2026-11-20',
    );
    expect(lines.map((l) => [l.id, l.overdue])).toEqual([
      [2, false],
      [3, true],
      [1, false],
    ]);
    expect(ledgerLines([d(1, 'build_log_credit', 2, '2026-11-20', 1)], '2026-11-21')[0].overdue).toBe(true);
  });

  it('sums promised and delivered per kind and finds the next due', () => {
    const lines = ledgerLines(
      [
        d(1, 'build_log_credit', 2, '2026-12-01', 1),
        d(2, 'build_log_credit', 1, '2027-01-01', 0),
        d(3, 'video_mention', 1, '2026-10-01', 0),
      ],
      '2026-11-20',
    );
    expect(summaryByKind(lines)).toEqual([
      { kind: 'build_log_credit', promised: 3, delivered: 1 },
      { kind: 'video_mention', promised: 1, delivered: 0 },
    ]);
    expect(nextDue(lines, '2026-11-20')?.id).toBe(1);
  });

  it('credits the earliest-due open deliverable of the kind', () => {
    const list = [
      d(1, 'build_log_credit', 1, '2026-12-01', 1),
      d(2, 'build_log_credit', 2, '2027-01-01', 0),
      d(3, 'build_log_credit', 1, '2026-12-15', 0),
      d(4, 'video_mention', 1, '2026-01-01', 0),
    ];
    expect(deliverableToCredit(list, 'build_log_credit')?.id).toBe(3);
    expect(deliverableToCredit([d(1, 'build_log_credit', 1, '2026-12-01', 1)], 'build_log_credit')).toBeNull();
  });

  it('credits the deliverable a marker named when it is open and of the kind, and falls back to the earliest due otherwise', () => {
    const list = [
      d(1, 'build_log_credit', 1, '2026-12-01', 1),
      d(2, 'build_log_credit', 2, '2027-01-01', 0),
      d(3, 'build_log_credit', 1, '2026-12-15', 0),
      d(4, 'video_mention', 1, '2026-01-01', 0),
    ];
    expect(deliverableToCredit(list, 'build_log_credit', 2)?.id).toBe(2);
    expect(deliverableToCredit(list, 'build_log_credit', 1)?.id).toBe(3); // delivered in full
    expect(deliverableToCredit(list, 'build_log_credit', 4)?.id).toBe(3); // another kind
    expect(deliverableToCredit(list, 'build_log_credit', 99)?.id).toBe(3); // not this sponsor's
  });
});

describe('needsHazardNotice', () => {
  const post = (over: Partial<{ title: string; summary: string; markdown: string; tags: string[] }>) => ({
    title: 'Painting',
    summary: '',
    markdown: 'Primer.',
    tags: [],
    ...over,
  });
  it('is required for the rocketry tag and for motor, flight and launch words', () => {
    expect(
      [
        post({ tags: ['Rocketry'] }),
        post({ markdown: 'the motor tube' }),
        post({ title: 'Flight two' }),
        post({ summary: 'We launched it' }),
        post({ markdown: 'ejection timing' }),
      ].map(needsHazardNotice),
    ).toEqual([true, true, true, true, true]);
  });
  it('is not required for a post about something else', () => {
    expect([post({}), post({ markdown: 'Motorway traffic and flighty cats' })].map(needsHazardNotice)).toEqual([
      false,
      false,
    ]);
  });
});

describe('slugify', () => {
  it('makes readable ASCII slugs and unique ones', () => {
    expect(slugify('Spoolgoblin Filament Co.')).toBe('spoolgoblin-filament-co');
    expect(slugify('Thrust & Filament: Crème brûlée')).toBe('thrust-and-filament-creme-brulee');
    expect(slugify('!!!')).toBe('untitled');
    expect(uniqueSlug('a', new Set(['a', 'a-2']))).toBe('a-3');
  });
});
