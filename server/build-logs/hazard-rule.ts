/**
 * Words that mean a post is about flying or about the energetics that go with it: motors, flights, launches,
 * ejection and deployment charges, black powder, e-matches, igniters, continuity checks of pyro channels.
 * Whole words only (`\b`), and `charge` only with the word that makes it a pyro charge, so a charged battery,
 * a motorway or a free-of-charge shirt does not trigger it.
 */
const FLYING_WORDS = new RegExp(
  '\\b(?:' +
    [
      'motors?',
      'flights?',
      'flew',
      'fly',
      'flying',
      'launch(?:es|ed|ing)?',
      'ejection',
      'igniters?',
      'ignitors?',
      'e-?matche?s?',
      'black[ -]powder',
      'pyrodex',
      'pyro(?:technics?|technic|gen)?',
      '(?:recovery|deployment|drogue|main|backup|apogee|separation) charges?',
      'charge wells?',
      'continuity (?:tests?|checks?|testing|checking)',
    ].join('|') +
    ')\\b',
  'i',
);

/**
 * Whether a post must carry the hazard notice: tagged `rocketry`, or its title, summary or body mentions motors,
 * flights, launches or the charges and igniters that fire them. An editor may add the notice to any other post
 * but can never remove it from these.
 */
export function needsHazardNotice(post: {
  title: string;
  summary: string;
  markdown: string;
  tags: readonly string[];
}): boolean {
  if (post.tags.some((t) => t.toLowerCase() === 'rocketry')) return true;
  return FLYING_WORDS.test(post.title) || FLYING_WORDS.test(post.summary) || FLYING_WORDS.test(post.markdown);
}

/** The notice, in Padside's words; the page, the feeds and the e-mails all use this one text. */
export const HAZARD_NOTICE =
  'Rocket motors and ejection charges burn and can injure. Fly only under your national rocketry association’s safety code and the local aviation and fire rules, ' +
  'at a sanctioned launch where the range safety officer has the final word. High-power motors need the matching certification. ' +
  'What we describe here is our own experience, not instructions.';
