import { Marked, type Token, type TokenizerAndRendererExtension, type Tokens } from 'marked';
import sanitizeHtml from 'sanitize-html';

/**
 * The one Markdown pipeline (editor preview, public pages, feeds, product descriptions): marked with GFM, then
 * sanitize-html with an allow-list. Raw HTML in the source is sanitized like everything else.
 *
 * Padside's own credit marker is a line of its own: `%thanks <sponsor-slug>` or `%thanks <sponsor-slug> | a note`, with
 * an optional `#<deliverable id>` after the slug (`%thanks <sponsor-slug> #12 | a note`) naming the promise the credit
 * counts against; without it the credit counts against the sponsor's earliest-due open one. It renders an
 * acknowledgement card (the same with or without the id, which readers never see) and tells the ledger which
 * sponsors a post credits.
 *
 * The flight marker is a line of its own too: `%flight <id>`. It renders an empty placeholder that the post page
 * fills with that flight's chart and summary; elsewhere (feeds, previews) a short line of text stands in.
 */
const CREDIT_LINE = /^%thanks +([a-z0-9][a-z0-9-]{0,79})(?: +#([1-9][0-9]{0,9}))?(?: *\| *([^\n]*))?[ \t]*(?:\n+|$)/;

interface CreditToken extends Tokens.Generic {
  type: 'psCredit';
  slug: string;
  /** The deliverable the marker names, or null when it leaves the choice to the ledger. */
  deliverableId: number | null;
  note: string;
  sponsorName?: string;
}

/** Text made safe to put inside HTML. */
export const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const creditMarker: TokenizerAndRendererExtension = {
  name: 'psCredit',
  level: 'block',
  start: (src) => /^%thanks /m.exec(src)?.index,
  tokenizer(src) {
    const m = CREDIT_LINE.exec(src);
    if (!m) return undefined;
    return {
      type: 'psCredit',
      raw: m[0],
      slug: m[1],
      deliverableId: m[2] ? Number(m[2]) : null,
      note: (m[3] ?? '').trim(),
    } satisfies CreditToken;
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
  'h1',
  'h2',
  'h3',
  'h4',
  'h5',
  'h6',
  'p',
  'br',
  'hr',
  'blockquote',
  'pre',
  'code',
  'em',
  'strong',
  'del',
  's',
  'sup',
  'sub',
  'ul',
  'ol',
  'li',
  'a',
  'img',
  'table',
  'thead',
  'tbody',
  'tr',
  'th',
  'td',
  'input',
  'figure',
  'figcaption',
  'aside',
  'span',
  'div',
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
    input: (tagName, attribs) =>
      attribs.type === 'checkbox'
        ? {
            tagName,
            attribs: { type: 'checkbox', disabled: '', ...(attribs.checked !== undefined ? { checked: '' } : {}) },
          }
        : { tagName: 'span', attribs: {} },
    // Browsers ignore spaces around an href, so the check must too (" https://x" is external); any link that opens
    // another browsing context cannot hand it window.opener, whatever rel the author wrote.
    a: (tagName, attribs) => {
      const { rel, ...rest } = attribs;
      const href = (attribs.href ?? '').trim();
      const external = /^https?:\/\//i.test(href);
      const target = external ? '_blank' : rest.target;
      const withHref = attribs.href === undefined ? rest : { ...rest, href };
      if (target !== undefined) return { tagName, attribs: { ...withHref, rel: 'noopener noreferrer', target } };
      return { tagName, attribs: { ...withHref, ...(rel !== undefined ? { rel } : {}) } };
    },
    img: (tagName, attribs) => ({ tagName, attribs: { ...attribs, loading: 'lazy' } }),
    // data-flight names a flight by its number and nothing else; any other value goes with the attribute.
    div: (tagName, attribs) => {
      const { 'data-flight': flight, ...rest } = attribs;
      return {
        tagName,
        attribs: flight !== undefined && /^[1-9][0-9]{0,9}$/.test(flight) ? { ...rest, 'data-flight': flight } : rest,
      };
    },
  },
  exclusiveFilter: (frame) => frame.tag === 'img' && !frame.attribs.src,
};

/** Options of one rendering: the display names of sponsors that credit markers may name, by slug. */
export interface RenderOptions {
  sponsorNames?: ReadonlyMap<string, string>;
}

/** The longest Markdown any field stores (the post body); the shorter fields have their own caps in their schemas. */
export const MAX_MARKDOWN_LENGTH = 200_000;

/**
 * How deep the token tree may go. marked and the HTML serialiser recurse per level, so a few thousand nested quotes
 * or lists overflow the stack; 48 levels is far beyond what a build log uses (a list nested ten deep is about 30).
 */
export const MAX_MARKDOWN_DEPTH = 48;

/** Markdown that the pipeline refuses to render: too long, nested too deep, or beyond the renderer's stack. */
export class UnrenderableMarkdown extends Error {}

const childrenOf = (t: Record<string, unknown>): unknown[] => {
  const rows = Array.isArray(t.rows) ? (t.rows as unknown[]).flat() : [];
  return [
    ...(Array.isArray(t.tokens) ? t.tokens : []),
    ...(Array.isArray(t.items) ? t.items : []),
    ...(Array.isArray(t.header) ? t.header : []),
    ...rows,
  ];
};

/** The depth of a token tree, walked with an explicit stack so the walk itself cannot overflow. */
function tokenDepth(tokens: unknown[]): number {
  let deepest = 0;
  const stack: [unknown, number][] = tokens.map((t) => [t, 1]);
  while (stack.length) {
    const [t, depth] = stack.pop()!;
    if (depth > deepest) deepest = depth;
    if (deepest > MAX_MARKDOWN_DEPTH) return deepest;
    if (t && typeof t === 'object')
      for (const c of childrenOf(t as Record<string, unknown>)) stack.push([c, depth + 1]);
  }
  return deepest;
}

function lex(markdown: string): Token[] {
  if (markdown.length > MAX_MARKDOWN_LENGTH)
    throw new UnrenderableMarkdown(
      `The text is too long (at most ${MAX_MARKDOWN_LENGTH.toLocaleString('en-CA')} characters).`,
    );
  const tooDeep = () =>
    new UnrenderableMarkdown(
      `The text is nested too deeply (quotes, lists or emphasis more than ${MAX_MARKDOWN_DEPTH} levels inside each other).`,
    );
  let tokens: Token[];
  try {
    tokens = marked.lexer(markdown);
  } catch (err) {
    if (err instanceof RangeError) throw tooDeep();
    throw err;
  }
  if (tokenDepth(tokens) > MAX_MARKDOWN_DEPTH) throw tooDeep();
  return tokens;
}

/**
 * Markdown to HTML that is safe to put on a page, for text about to be stored: throws UnrenderableMarkdown (with a
 * message for the author) for text the pipeline cannot render, so it is refused before it is saved.
 */
export function renderMarkdownChecked(markdown: string, options: RenderOptions = {}): string {
  const tokens = lex(markdown);
  marked.walkTokens(tokens, (token: Token) => {
    if (token.type === 'psCredit')
      (token as CreditToken).sponsorName = options.sponsorNames?.get((token as CreditToken).slug);
  });
  try {
    return sanitizeHtml(marked.parser(tokens), SANITIZE);
  } catch (err) {
    if (err instanceof RangeError) throw new UnrenderableMarkdown('The text is nested too deeply to show.');
    throw err;
  }
}

/** Why this Markdown cannot be stored, or null when it renders (the write paths' check). */
export function markdownProblem(markdown: string): string | null {
  try {
    renderMarkdownChecked(markdown);
    return null;
  } catch (err) {
    if (err instanceof UnrenderableMarkdown) return err.message;
    throw err;
  }
}

/**
 * Markdown to HTML for reading: a value stored before the checks (or by a path that skipped them) never breaks the
 * page; it is shown as escaped plain text instead.
 */
export function renderMarkdown(markdown: string, options: RenderOptions = {}): string {
  try {
    return renderMarkdownChecked(markdown, options);
  } catch (err) {
    if (!(err instanceof UnrenderableMarkdown)) throw err;
    return `<p>${escapeHtml(markdown.slice(0, MAX_MARKDOWN_LENGTH))}</p>`;
  }
}

/** One credit marker as the ledger reads it: the sponsor's address and the deliverable it names, if any. */
export interface CreditMarker {
  slug: string;
  deliverableId: number | null;
}

/**
 * The credit markers of a text, in order of appearance, once per sponsor (the first marker of a sponsor decides its
 * deliverable; markers inside code do not count).
 */
export function creditMarkers(markdown: string): CreditMarker[] {
  const markers: CreditMarker[] = [];
  let tokens: Token[];
  try {
    tokens = lex(markdown);
  } catch (err) {
    // Text that cannot be rendered credits nobody; the write paths refuse it before this matters.
    if (err instanceof UnrenderableMarkdown) return [];
    throw err;
  }
  marked.walkTokens(tokens, (token: Token) => {
    if (token.type !== 'psCredit') return;
    const t = token as CreditToken;
    if (!markers.some((m) => m.slug === t.slug)) markers.push({ slug: t.slug, deliverableId: t.deliverableId });
  });
  return markers;
}

/** The sponsor slugs that credit markers name, in order of appearance, once each. */
export function creditMarkerSlugs(markdown: string): string[] {
  return creditMarkers(markdown).map((m) => m.slug);
}

/** The flight ids that flight markers name, in order of appearance, once each (markers inside code do not count). */
export function flightMarkerIds(markdown: string): number[] {
  const ids: number[] = [];
  marked.walkTokens(marked.lexer(markdown), (token: Token) => {
    if (token.type === 'psFlight' && !ids.includes((token as FlightToken).flightId))
      ids.push((token as FlightToken).flightId);
  });
  return ids;
}

/** Sanitizes HTML produced elsewhere (for example, an extension's card markup) with the same allow-list. */
export function sanitize(html: string): string {
  return sanitizeHtml(html, SANITIZE);
}
