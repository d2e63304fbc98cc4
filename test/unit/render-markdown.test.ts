import {
  MAX_MARKDOWN_LENGTH,
  markdownProblem,
  renderMarkdown,
  renderMarkdownChecked,
  UnrenderableMarkdown,
} from '../../server/markdown/render-markdown';

describe('renderMarkdown', () => {
  it('should render GFM tables, task lists and fenced code', () => {
    const html = renderMarkdown(
      '| a | b |\n|---|---|\n| 1 | 2 |\n\n- [x] done\n- [ ] open\n\n```ts\nconst x = 1;\n```',
    );
    expect(html).toContain('<table>');
    expect(html).toContain('<input type="checkbox" disabled checked /> done');
    expect(html).toContain('<input type="checkbox" disabled /> open');
    expect(html).toContain('class="language-ts"');
  });

  it('should give external links rel="noopener noreferrer"', () => {
    expect(renderMarkdown('[site](https://example.test/x)')).toContain('rel="noopener noreferrer"');
    expect(renderMarkdown('[local](/shop)')).not.toContain('noopener');
  });

  it('should drop script, event handlers and javascript: URLs', () => {
    const html = [
      renderMarkdown('<script>alert(1)</script>'),
      renderMarkdown('<img src=x onerror=alert(1)>'),
      renderMarkdown('[x](javascript:alert(1))'),
      renderMarkdown('<a href="data:text/html,hi">d</a>'),
    ].join('\n');
    expect(html).not.toMatch(/<script|onerror|href="javascript:|href="data:/i);
    expect(html).toContain('<img src="x"');
  });
});

// OWASP ASVS 4.0.3 5.2.1 (untrusted HTML from editors is sanitized): a link that opens another window never keeps
// window.opener, and spaces around the address do not skip the rewrite.
describe('ASVS 5.2.1: links that open another window', () => {
  const anchors = (html: string) => html.match(/<a [^>]*>/g) ?? [];

  it('should trim the href and give rel="noopener noreferrer" despite rel="opener" and a leading space', () => {
    const [a] = anchors(renderMarkdown('<a href=" https://x.example" target="_blank" rel="opener">x</a>'));
    expect(a).toContain('href="https://x.example"');
    expect(a).toContain('rel="noopener noreferrer"');
    expect(a).not.toMatch(/rel="[^"]*\bopener\b/);
  });

  it('should give every link with a target the rel, local ones included', () => {
    const html = renderMarkdown(
      '<a href="/shop" target="shop" rel="opener">shop</a> <a href="\thttp://x.example\n" rel="opener">y</a>',
    );
    for (const a of anchors(html)) expect(a).toContain('rel="noopener noreferrer"');
    expect(anchors(html)).toHaveLength(2);
  });

  it('should keep a plain local link free of target and rel', () => {
    const [a] = anchors(renderMarkdown('[shop](/shop)'));
    expect(a).toBe('<a href="/shop">');
  });
});

// OWASP ASVS 4.0.3 5.1.4 (structured data checked against its rules, here nesting depth and length): marked recurses
// per level, so text nested a few thousand levels deep overflowed the stack on every render.
describe('ASVS 5.1.4: Markdown nested too deep', () => {
  const deep = [
    '>'.repeat(2000) + ' x',
    '> '.repeat(2000) + 'x',
    '- '.repeat(2000) + 'x',
    '*'.repeat(2000) + 'x' + '*'.repeat(2000),
  ];

  it.each(deep.map((d) => [d.slice(0, 12), d]))('should refuse %j... at the write check', (_label, md) => {
    expect(markdownProblem(md)).toMatch(/nested too deeply/);
    expect(() => renderMarkdownChecked(md)).toThrow(UnrenderableMarkdown);
  });

  it.each(deep.map((d) => [d.slice(0, 12), d]))('should still render %j... on read, as escaped text', (_label, md) => {
    const html = renderMarkdown(md);
    expect(html.startsWith('<p>')).toBe(true);
    expect(html).not.toContain('<blockquote>');
  });

  it('should refuse text longer than the longest field', () => {
    expect(markdownProblem('a'.repeat(MAX_MARKDOWN_LENGTH + 1))).toMatch(/too long/);
  });

  it('should accept ordinary nesting: a list ten levels deep inside two quotes', () => {
    const list = Array.from({ length: 10 }, (_, i) => '  '.repeat(i) + '- level ' + (i + 1)).join('\n');
    const md = list + '\n\n> > quoted **bold _and italic_** [link](https://x.example)';
    expect(markdownProblem(md)).toBeNull();
    expect(renderMarkdown(md)).toContain('level 10');
  });
});
