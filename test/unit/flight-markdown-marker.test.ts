import { flightMarkerIds, renderMarkdown } from '../../server/markdown/render-markdown';

describe('the %flight marker', () => {
  it('should render a placeholder the post page fills, with a line of text for feeds', () => {
    const html = renderMarkdown('We flew it.\n\n%flight 42\n\nIt came down in the wheat.');
    expect(html).toContain('<div class="ps-flight" data-flight="42"><p class="ps-flight-note">');
    expect(html).toContain('flight 42');
    expect(html).toContain('<p>We flew it.</p>');
    expect(html).toContain('<p>It came down in the wheat.</p>');
  });

  it('should take the marker only on a line of its own', () => {
    expect(renderMarkdown('Look at %flight 42 here')).not.toContain('ps-flight');
    expect(renderMarkdown('%flight 42 and more')).not.toContain('data-flight');
    expect(renderMarkdown('%flight abc')).not.toContain('data-flight');
    expect(renderMarkdown('%flight 0')).not.toContain('data-flight');
  });

  it('should leave markers inside code alone', () => {
    const html = renderMarkdown('```\n%flight 42\n```\n\n    %flight 43');
    expect(html).not.toContain('data-flight');
    expect(flightMarkerIds('```\n%flight 42\n```\n\n%flight 7\n\n%flight 7\n\n%flight 9')).toEqual([7, 9]);
  });

  it('should let through no other attribute or value on a raw placeholder', () => {
    const html = renderMarkdown(
      '<div class="ps-flight" data-flight="1 onclick=x" onclick="alert(1)" style="x">hi</div>',
    );
    expect(html).not.toMatch(/onclick|style=|data-flight/);
    expect(renderMarkdown('<div class="evil ps-flight">x</div>')).toContain('<div class="ps-flight">');
  });

  it('should sit beside the credit marker', () => {
    const html = renderMarkdown('%thanks gopher-flats-hardware\n\n%flight 3', {
      sponsorNames: new Map([['gopher-flats-hardware', 'Gopher Flats Hardware']]),
    });
    expect(html).toContain('class="ps-credit"');
    expect(html).toContain('data-flight="3"');
  });
});
