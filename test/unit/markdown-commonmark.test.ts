import { renderMarkdown } from '../../server/markdown/render-markdown';

// The CommonMark 0.31.2 spec examples, from the `commonmark-spec` package (tabs are written as "→" there).
type SpecExample = { markdown: string; html: string; section: string; number: number };
// eslint-disable-next-line @typescript-eslint/no-require-imports -- the package is plain CommonJS with no types
const spec: { tests: SpecExample[] } = require('commonmark-spec');

/** Raw HTML in the source is what the sanitizer exists to change, so those examples are counted apart. */
const RAW_HTML_SECTIONS = new Set(['HTML blocks', 'Raw HTML']);
const examples = spec.tests.map((t) => ({
  ...t,
  markdown: t.markdown.replace(/→/g, '\t'),
  html: t.html.replace(/→/g, '\t'),
}));
const comparable = examples.filter((e) => !RAW_HTML_SECTIONS.has(e.section) && !/<[a-zA-Z/!?]/.test(e.markdown));

/** Our pipeline adds attributes the spec does not (lazy images, rel/target on external links); whitespace after <br /> does not render. */
function normalise(html: string): string {
  return html
    .replace(/ loading="lazy"/g, '')
    .replace(/ rel="noopener noreferrer" target="_blank"/g, '')
    .replace(/<(hr|br|img)([^>]*?)\s*\/?>/g, '<$1$2 />')
    .replace(/<br \/>\s*/g, '<br />')
    .replace(/>\s+</g, '><')
    .replace(/\s+/g, ' ')
    .trim();
}

describe('Markdown rendering against the CommonMark 0.31.2 spec examples (commonmark-spec package)', () => {
  const results = comparable.map((e) => ({
    n: e.number,
    section: e.section,
    pass: normalise(renderMarkdown(e.markdown)) === normalise(e.html),
  }));

  it('passes at least 90% of the examples without raw HTML (496 of 541, 91.7%, measured 2026-12-02)', () => {
    const passed = results.filter((r) => r.pass).length;
    const rate = passed / results.length;
    const failing = results.filter((r) => !r.pass).map((r) => r.n);
    console.log(
      `CommonMark ${passed}/${results.length} passed (${(rate * 100).toFixed(1)}%); ${examples.length - comparable.length} raw-HTML examples not compared; failing examples: ${failing.join(', ')}`,
    );
    expect(examples.length).toBe(652);
    expect(rate).toBeGreaterThanOrEqual(0.9);
  });

  it('the comparison can fail: a wrong expectation is caught', () => {
    expect(normalise(renderMarkdown('*a*'))).not.toBe(normalise('<p><strong>a</strong></p>'));
  });
});
