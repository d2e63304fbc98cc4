import type { StaffAgreement } from '@contracts/sponsors/sponsor-answers';
import { creditMarker, openPromises } from './credit-marker';

const line = (
  id: number,
  kind: 'build_log_credit' | 'video_mention',
  promised: number,
  delivered: number,
  dueOn: string,
) => ({ id, kind, promised, delivered, dueOn, overdue: false, listedNow: false });
const agreement = (season: string, deliverables: ReturnType<typeof line>[]): StaffAgreement => ({
  id: Number(season),
  season,
  deliverables,
  byKind: [],
  overdue: [],
  nextDue: null,
});

describe('creditMarker', () => {
  it('should write the marker with the chosen promise and the note, on one line', () => {
    expect(creditMarker('voltwhistle-electronics', 12, '  Switches and\nterminal blocks ')).toBe(
      '%thanks voltwhistle-electronics #12 | Switches and terminal blocks',
    );
  });

  it('should leave the note part out when there is none', () => {
    expect(creditMarker('voltwhistle-electronics', 12, '   ')).toBe('%thanks voltwhistle-electronics #12');
  });

  it('should leave the promise out when none is chosen (the server then picks the earliest due)', () => {
    expect(creditMarker('voltwhistle-electronics', null, 'parts')).toBe('%thanks voltwhistle-electronics | parts');
  });
});

describe('openPromises', () => {
  it('should list the open build-log promises earliest due first, as the server would pick them', () => {
    const agreements = [
      agreement('2027', [line(3, 'build_log_credit', 2, 0, '2027-03-31')]),
      agreement('2026', [
        line(1, 'build_log_credit', 2, 2, '2026-05-31'),
        line(2, 'build_log_credit', 3, 1, '2026-10-31'),
        line(4, 'video_mention', 1, 0, '2026-01-31'),
      ]),
    ];
    expect(openPromises(agreements)).toEqual([
      { deliverableId: 2, season: '2026', promised: 3, delivered: 1, dueOn: '2026-10-31', overdue: false },
      { deliverableId: 3, season: '2027', promised: 2, delivered: 0, dueOn: '2027-03-31', overdue: false },
    ]);
  });

  it('should list none when every build-log promise is delivered', () => {
    expect(openPromises([agreement('2026', [line(1, 'build_log_credit', 1, 1, '2026-05-31')])])).toEqual([]);
  });
});
