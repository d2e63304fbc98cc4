import { needsHazardNotice } from '../../server/build-logs/hazard-rule';

const post = (markdown: string, title = 'Bench day', summary = '') => ({
  title,
  summary,
  markdown,
  tags: ['electronics'],
});

describe('needsHazardNotice', () => {
  describe('when the words of an untagged post are about ejection charges', () => {
    it.each([
      'We weigh the black powder on a jeweller’s scale.',
      'Each e-match gets a shunt until the rocket is on the pad.',
      'Two ematches per channel, taped to the bulkhead.',
      'The drogue charge sits in a printed charge well.',
      'Run a continuity test on every channel before arming.',
      'We check the pyro channels with the board on the bench.',
      'The main charges go in last.',
      'Pyrodex is what the vendor stocks locally.',
    ])('is on for %j', (markdown) => {
      expect(needsHazardNotice(post(markdown))).toBe(true);
    });

    it('is on for the post the issue names, even in the title only', () => {
      expect(
        needsHazardNotice(
          post(
            'Crimp, solder, heat-shrink.',
            'Wiring the e-matches',
            'Continuity tests and black powder, step by step',
          ),
        ),
      ).toBe(true);
    });
  });

  describe('when the words only look alike', () => {
    it.each([
      'The battery charged overnight.',
      'Stickers are free of charge with every shirt.',
      'We took the motorway to the print shop.',
      'The altimeter board is in charge of logging.',
      'The powder coat on the rail guide is black.',
      'We tested the continuity of our colour scheme.',
      'A flyer for the open house.',
    ])('stays off for %j', (markdown) => {
      expect(needsHazardNotice(post(markdown))).toBe(false);
    });
  });
});
