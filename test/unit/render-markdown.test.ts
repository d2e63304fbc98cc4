import { renderMarkdown } from '../../server/markdown/render-markdown';

describe('renderMarkdown', () => {
  it('should render GFM tables, task lists and fenced code', () => {
    const html = renderMarkdown('| a | b |\n|---|---|\n| 1 | 2 |\n\n- [x] done\n- [ ] open\n\n```ts\nconst x = 1;\n```');
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
