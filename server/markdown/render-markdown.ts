import { Marked, type Token, type TokenizerAndRendererExtension, type Tokens } from 'marked';
import sanitizeHtml from 'sanitize-html';

/**
 * The one Markdown pipeline (editor preview, public pages, feeds, product descriptions): marked with GFM, then
 * sanitize-html with an allow-list. Raw HTML in the source is sanitized like everything else.
 *
 * Padside's own credit marker is a line of its own: `%thanks <sponsor-slug>` or `%thanks <sponsor-slug> | a note`.
 * It renders an acknowledgement card and tells the ledger which sponsors a post credits.
 *
 * The flight marker is a line of its own too: `%flight <id>`. It renders an empty placeholder that the post page
 * fills with that flight's chart and summary; elsewhere (feeds, previews) a short line of text stands in.
 */
const CREDIT_LINE = /^%thanks +([a-z0-9][a-z0-9-]{0,79})(?: *\| *([^\n]*))?(?:\n+|$)/;

interface CreditToken extends Tokens.Generic {
  type: 'psCredit';
  slug: string;
  note: string;
  sponsorName?: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const creditMarker: TokenizerAndRendererExtension = {
  name: 'psCredit',
  level: 'block',
  start: (src) => /^%thanks /m.exec(src)?.index,
  tokenizer(src) {
    const m = CREDIT_LINE.exec(src);
    if (!m) return undefined;
    return { type: 'psCredit', raw: m[0], slug: m[1], note: (m[2] ?? '').trim() } satisfies CreditToken;
  },
  renderer(token) {
    const t = token as CreditToken;
    const name = t.sponsorName ?? t.slug;
    return (
      `<aside class="ps-credit" data-sponsor="${escapeHtml(t.slug)}"><span class="ps-credit-label">With thanks to</span>` +
      `<div class="ps-credit-body"><strong>${escapeHtml(name)}</strong>${t.note ? ` — ${escapeHtml(t.note)}` : ''}</div></aside>\n`
    );
  },
};

const FLIGHT_LINE = /^%flight +([1-9][0-9]{0,9})[ \t]*(?:\n+|$)/;

interface FlightToken extends Tokens.Generic {
  type: 'psFlight';
  flightId: number;
}

const flightMarker: TokenizerAndRendererExtension = {
  name: 'psFlight',
  level: 'block',
  start: (src) => /^%flight /m.exec(src)?.index,
  tokenizer(src) {
    const m = FLIGHT_LINE.exec(src);
    if (!m) return undefined;
    return { type: 'psFlight', raw: m[0], flightId: Number(m[1]) } satisfies FlightToken;
  },
  renderer(token) {
    const id = (token as FlightToken).flightId;
    return `<div class="ps-flight" data-flight="${id}"><p class="ps-flight-note">Flight data: altitude and speed chart for flight ${id}.</p></div>\n`;
  },
};

const marked = new Marked({ gfm: true, breaks: false, async: false, extensions: [creditMarker, flightMarker] });

const ALLOWED_TAGS = [
  'h1', 'h2', 'h3', 'h4', 'h5', 'h6', 'p', 'br', 'hr', 'blockquote', 'pre', 'code', 'em', 'strong', 'del', 's', 'sup', 'sub',
  'ul', 'ol', 'li', 'a', 'img', 'table', 'thead', 'tbody', 'tr', 'th', 'td', 'input', 'figure', 'figcaption', 'aside', 'span', 'div',
];

const SANITIZE: sanitizeHtml.IOptions = {
  allowedTags: ALLOWED_TAGS,
  allowedAttributes: {
    a: ['href', 'title', 'rel', 'target'],
    img: ['src', 'alt', 'title', 'width', 'height', 'loading'],
    code: ['class'],
    th: ['align'],
    td: ['align'],
    ol: ['start'],
    input: ['type', 'checked', 'disabled'],
    aside: ['class', 'data-sponsor'],
    div: ['class', 'data-flight'],
    p: ['class'],
    span: ['class'],
  },
  allowedClasses: {
    code: [/^language-[a-z0-9+-]+$/],
    aside: ['ps-credit'],
    div: ['ps-credit-body', 'ps-flight'],
    span: ['ps-credit-label'],
    p: ['ps-flight-note'],
  },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: { img: ['http', 'https'] },
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
  transformTags: {
    // Task-list checkboxes only, and never editable.
    input: (tagName, attribs) => (attribs.type === 'checkbox' ? { tagName, attribs: { type: 'checkbox', disabled: '', ...(attribs.checked !== undefined ? { checked: '' } : {}) } } : { tagName: 'span', attribs: {} }),
    a: (tagName, attribs) => {
      const href = attribs.href ?? '';
      const external = /^https?:\/\//i.test(href);
      return { tagName, attribs: { ...attribs, ...(external ? { rel: 'noopener noreferrer', target: '_blank' } : {}) } };
    },
    img: (tagName, attribs) => ({ tagName, attribs: { ...attribs, loading: 'lazy' } }),
    // data-flight names a flight by its number and nothing else; any other value goes with the attribute.
    div: (tagName, attribs) => {
      const { 'data-flight': flight, ...rest } = attribs;
      return { tagName, attribs: flight !== undefined && /^[1-9][0-9]{0,9}$/.test(flight) ? { ...rest, 'data-flight': flight } : rest };
    },
  },
  exclusiveFilter: (frame) => frame.tag === 'img' && !frame.attribs.src,

};

/** Options of one rendering: the display names of sponsors that credit markers may name, by slug. */
export interface RenderOptions {
  sponsorNames?: ReadonlyMap<string, string>;
}

/** Markdown to HTML that is safe to put on a page. */
export function renderMarkdown(markdown: string, options: RenderOptions = {}): string {
  const tokens = marked.lexer(markdown);
  marked.walkTokens(tokens, (token: Token) => {
    if (token.type === 'psCredit') (token as CreditToken).sponsorName = options.sponsorNames?.get((token as CreditToken).slug);
  });
  return sanitizeHtml(marked.parser(tokens), SANITIZE);
}

/** The sponsor slugs that credit markers name, in order of appearance, once each (markers inside code do not count). */
export function creditMarkerSlugs(markdown: string): string[] {
  const slugs: string[] = [];
  marked.walkTokens(marked.lexer(markdown), (token: Token) => {
    if (token.type === 'psCredit' && !slugs.includes((token as CreditToken).slug)) slugs.push((token as CreditToken).slug);
  });
  return slugs;
}

/** The flight ids that flight markers name, in order of appearance, once each (markers inside code do not count). */
export function flightMarkerIds(markdown: string): number[] {
  const ids: number[] = [];
  marked.walkTokens(marked.lexer(markdown), (token: Token) => {
    if (token.type === 'psFlight' && !ids.includes((token as FlightToken).flightId)) ids.push((token as FlightToken).flightId);
  });
  return ids;
}

/** Sanitizes HTML produced elsewhere (for example, an extension's card markup) with the same allow-list. */
export function sanitize(html: string): string {
  return sanitizeHtml(html, SANITIZE);
}
