import { creditMarkers, creditMarkerSlugs, renderMarkdown } from '../../server/markdown/render-markdown';

const names = { sponsorNames: new Map([['voltwhistle-electronics', 'Voltwhistle Electronics']]) };

describe('the %thanks credit marker', () => {
  it('reads the sponsor and the named deliverable, with and without a note', () => {
    expect(creditMarkers('%thanks voltwhistle-electronics #12 | switches\n')).toEqual([
      { slug: 'voltwhistle-electronics', deliverableId: 12 },
    ]);
    expect(creditMarkers('%thanks voltwhistle-electronics #12\n')).toEqual([
      { slug: 'voltwhistle-electronics', deliverableId: 12 },
    ]);
  });

  it('reads the old form without #id as naming no deliverable (the ledger picks the earliest due)', () => {
    expect(creditMarkers('%thanks voltwhistle-electronics | switches\n')).toEqual([
      { slug: 'voltwhistle-electronics', deliverableId: null },
    ]);
    expect(creditMarkers('%thanks voltwhistle-electronics\n')).toEqual([
      { slug: 'voltwhistle-electronics', deliverableId: null },
    ]);
  });

  it('keeps the first marker of a sponsor and ignores markers inside code', () => {
    const md = '%thanks a-co #3\n\n%thanks b-co\n\n%thanks a-co #9\n\n```\n%thanks c-co #1\n```\n';
    expect(creditMarkers(md)).toEqual([
      { slug: 'a-co', deliverableId: 3 },
      { slug: 'b-co', deliverableId: null },
    ]);
    expect(creditMarkerSlugs(md)).toEqual(['a-co', 'b-co']);
  });

  it('renders the same card with or without the id, and never shows the id to readers', () => {
    const withId = renderMarkdown('%thanks voltwhistle-electronics #12 | switches\n', names);
    expect(withId).toBe(renderMarkdown('%thanks voltwhistle-electronics | switches\n', names));
    expect(withId).toBe(
      '<aside class="ps-credit" data-sponsor="voltwhistle-electronics"><span class="ps-credit-label">With thanks to</span><div class="ps-credit-body"><strong>Voltwhistle Electronics</strong> — switches</div></aside>\n',
    );
    expect(renderMarkdown('%thanks voltwhistle-electronics #12\n', names)).toBe(
      renderMarkdown('%thanks voltwhistle-electronics\n', names),
    );
    expect(withId).not.toContain('12');
  });

  it('is not a marker when the id is not a plain positive number', () => {
    expect(creditMarkers('%thanks voltwhistle-electronics #0\n')).toEqual([]);
    expect(creditMarkers('%thanks voltwhistle-electronics #x1\n')).toEqual([]);
  });
});
