import sanitizeHtml from 'sanitize-html';

/** What rendered Markdown may keep: the tags, attributes and URL schemes of the one allow-list. */
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

/** Sanitizes HTML produced elsewhere (for example, an extension's card markup) with the same allow-list. */
export function sanitize(html: string): string {
  return sanitizeHtml(html, SANITIZE);
}
