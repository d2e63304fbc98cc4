import type { StaffAgreement } from '../sponsors/sponsor-admin-api';
import { creditMarker, promiseCounted } from './credit-marker';

const line = (id: number, kind: 'build_log_credit' | 'video_mention', promised: number, delivered: number, dueOn: string) => ({ id, kind, promised, delivered, dueOn, overdue: false, listedNow: false });
const agreement = (season: string, deliverables: ReturnType<typeof line>[]): StaffAgreement => ({ id: Number(season), season, deliverables, byKind: [], overdue: [], nextDue: null });

describe('creditMarker', () => {
  it('should write the marker with the note, on one line', () => {
    expect(creditMarker('voltwhistle-electronics', '  Switches and\nterminal blocks ')).toBe('%thanks voltwhistle-electronics | Switches and terminal blocks');
  });

  it('should leave the note part out when there is none', () => {
    expect(creditMarker('voltwhistle-electronics', '   ')).toBe('%thanks voltwhistle-electronics');
  });
});

describe('promiseCounted', () => {
  it('should pick the earliest-due open build-log promise, as the server does', () => {
    const agreements = [
      agreement('2027', [line(3, 'build_log_credit', 2, 0, '2027-03-31')]),
      agreement('2026', [line(1, 'build_log_credit', 2, 2, '2026-05-31'), line(2, 'build_log_credit', 3, 1, '2026-10-31'), line(4, 'video_mention', 1, 0, '2026-01-31')]),
    ];
    expect(promiseCounted(agreements)).toEqual({ season: '2026', promised: 3, delivered: 1, dueOn: '2026-10-31', overdue: false });
  });

  it('should say none when every build-log promise is delivered', () => {
    expect(promiseCounted([agreement('2026', [line(1, 'build_log_credit', 1, 1, '2026-05-31')])])).toBeNull();
  });
});
