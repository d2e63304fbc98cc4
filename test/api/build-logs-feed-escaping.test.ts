import { DomUtils, parseDocument } from 'htmlparser2';
import Parser from 'rss-parser';
import { buildTestApp, fixedClock, type TestApp } from '../helpers/test-app';
import { Client, signedIn } from '../helpers/users';

let t: TestApp;
const marker = Date.now().toString(36);
const title = `Night flight ${marker} ]]><script>alert(1)</script> & <b>bold</b>`;
const summary = `Summary ${marker} ]]><script>alert(2)</script><img src=x onerror=alert(3)>`;

beforeAll(async () => {
  t = buildTestApp({ clock: fixedClock('2027-02-05T18:00:00Z') });
  const editor = (await signedIn(t.app, t.deps.db, ['fan', 'editor'])).client;
  const res = await editor.post('/api/admin/posts', { title, summary, markdown: 'A calm body.', status: 'published' });
  expect(res.status).toBe(201);
});
afterAll(() => t.close());

/** Every element name in a piece of HTML, as a browser-like parser reads it. */
const allElements = (doc: ReturnType<typeof parseDocument>) => DomUtils.findAll(() => true, doc.children);
const elementsIn = (html: string) => allElements(parseDocument(html)).map((e) => e.name);
const textOf = (html: string) => DomUtils.textContent(parseDocument(html, { decodeEntities: true }));

// OWASP ASVS 4.0.3 5.3.1 (output encoded for the context it lands in): both feeds declare titles and summaries as
// HTML, so a title holding ]]><script> reached feed readers as markup.
describe('ASVS 5.3.1: feed titles and summaries are text, not markup', () => {
  it.each(['/feeds/build-logs.rss', '/feeds/build-logs.atom'])(
    "%s: the feed readers' parser gives the title back as literal text",
    async (url) => {
      const res = await new Client(t.app).get(url);
      expect(res.status).toBe(200);
      const feed = await new Parser().parseString(res.text);
      const item = feed.items.find((i) => i.title?.includes(marker));
      expect(item).toBeDefined();
      // Both formats mark the title as HTML (Atom type="html"; RSS readers treat it so): what a reader shows is its text.
      expect(elementsIn(item!.title!)).toEqual([]);
      expect(textOf(item!.title!)).toBe(title);
      const shownSummary = url.endsWith('.rss') ? item!.content! : item!.summary!;
      expect(elementsIn(shownSummary)).toEqual([]);
      expect(textOf(shownSummary)).toBe(summary);
    },
  );

  it.each(['/feeds/build-logs.rss', '/feeds/build-logs.atom'])(
    '%s: no script element anywhere in the feed, at any level',
    async (url) => {
      const res = await new Client(t.app).get(url);
      const xml = parseDocument(res.text, { xmlMode: true });
      expect(DomUtils.getElementsByTagName('script', xml)).toHaveLength(0);
      // Each HTML-typed text node (title, summary, content), read as HTML, holds no script or event handler either.
      for (const node of allElements(xml)) {
        if (!['title', 'description', 'summary', 'content', 'content:encoded'].includes(node.name)) continue;
        const html = DomUtils.textContent(node);
        expect(elementsIn(html)).not.toContain('script');
        expect(html).not.toMatch(/<img[^>]+onerror/i);
      }
    },
  );
});
