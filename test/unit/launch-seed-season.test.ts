import { launchTitleFor, seasonOf } from '../../seeds/05_launches';

// Meteorological seasons of the northern hemisphere by whole months (from memory).
describe('seasonOf', () => {
  it.each([
    ['2026-03-01', 'Spring'],
    ['2026-05-31', 'Spring'],
    ['2026-06-01', 'Summer'],
    ['2026-08-31', 'Summer'],
    ['2026-09-01', 'Autumn'],
    ['2026-11-30', 'Autumn'],
    ['2026-12-01', 'Winter'],
    ['2027-02-28', 'Winter'],
  ])('puts %s in %s', (date, season) => {
    expect(seasonOf(date)).toBe(season);
  });
});

describe('launchTitleFor', () => {
  it('names the season of the date and leaves a title without a season alone', () => {
    expect(launchTitleFor('{Season} fly day', '2026-11-12')).toBe('Autumn fly day');
    expect(launchTitleFor('{Season} fly day', '2027-01-05')).toBe('Winter fly day');
    expect(launchTitleFor('Saturday club launch', '2026-07-04')).toBe('Saturday club launch');
  });
});
