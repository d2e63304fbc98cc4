import type { TokenizerAndRendererExtension, Tokens } from 'marked';
import { escapeHtml } from './escape-html';

/**
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

export interface CreditToken extends Tokens.Generic {
  type: 'psCredit';
  slug: string;
  /** The deliverable the marker names, or null when it leaves the choice to the ledger. */
  deliverableId: number | null;
  note: string;
  sponsorName?: string;
}

/** The `%thanks` line: an acknowledgement card naming the sponsor. */
export const creditMarker: TokenizerAndRendererExtension = {
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

export interface FlightToken extends Tokens.Generic {
  type: 'psFlight';
  flightId: number;
}

/** The `%flight` line: the placeholder the post page fills with the flight's chart. */
export const flightMarker: TokenizerAndRendererExtension = {
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
