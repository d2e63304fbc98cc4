import { timeLeft } from './countdown';

describe('timeLeft', () => {
  const now = Date.parse('2026-12-02T12:00:00Z');
  it('words days, hours and minutes, and says closed once past', () => {
    expect(timeLeft('2026-12-05T16:30:00Z', now)).toBe('3 days 4 h left');
    expect(timeLeft('2026-12-02T14:05:00Z', now)).toBe('2 h 5 min left');
    expect(timeLeft('2026-12-02T12:09:59Z', now)).toBe('9 min left');
    expect(timeLeft('2026-12-02T11:00:00Z', now)).toBe('closed');
  });
});
