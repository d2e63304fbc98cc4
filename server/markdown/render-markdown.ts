import { Marked } from 'marked';
import sanitizeHtml from 'sanitize-html';

/**
 * The one Markdown pipeline (editor preview, public pages, product descriptions): marked with GFM, then
 * sanitize-html with an allow-list. Raw HTML in the source is sanitized like everything else.
 */
const marked = new Marked({ gfm: true, breaks: false, async: false });

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
    div: ['class'],
    span: ['class'],
  },
  allowedClasses: { code: [/^language-[a-z0-9+-]+$/], aside: ['ps-credit'], div: ['ps-credit-body'], span: ['ps-credit-label'] },
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
  },
  exclusiveFilter: (frame) => frame.tag === 'img' && !frame.attribs.src,
};

/** Markdown to HTML that is safe to put on a page. */
export function renderMarkdown(markdown: string): string {
  const html = marked.parse(markdown) as string;
  return sanitizeHtml(html, SANITIZE);
}

/** Sanitizes HTML produced elsewhere (for example, an extension's card markup) with the same allow-list. */
export function sanitize(html: string): string {
  return sanitizeHtml(html, SANITIZE);
}
