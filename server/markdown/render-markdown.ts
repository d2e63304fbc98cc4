import { Marked, type Token } from 'marked';
import { sanitize } from './markdown-allow-list';
import { creditMarker, flightMarker, type CreditToken, type FlightToken } from './markdown-markers';
import { escapeHtml } from './escape-html';

/**
 * The one Markdown pipeline (editor preview, public pages, feeds, product descriptions): marked with GFM, then
 * sanitize-html with an allow-list. Raw HTML in the source is sanitized like everything else.
 * The markers are in markdown-markers.ts, the allow-list in markdown-allow-list.ts.
 */
const marked = new Marked({ gfm: true, breaks: false, async: false, extensions: [creditMarker, flightMarker] });

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
    return sanitize(marked.parser(tokens));
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
