/**
 * Checks JSON-LD against the schema.org vocabulary as link previews and search engines read it. schema.org itself marks
 * no property required; the required ones here are those of Google Search Central's structured-data guides for
 * product snippets and merchant listings (Product: name, offers; Offer: price, priceCurrency, availability), articles
 * (BlogPosting: headline, author, datePublished, image) and events (Event: name, startDate, location; Place: address)
 * (from memory). The enumeration members are those of schema.org/ItemAvailability and schema.org/EventStatusType.
 */
const REQUIRED: Record<string, string[]> = {
  Product: ['name', 'offers', 'image'],
  Offer: ['price', 'priceCurrency', 'availability'],
  BlogPosting: ['headline', 'author', 'datePublished', 'image'],
  Event: ['name', 'startDate', 'location'],
  Place: ['name', 'address'],
  Person: ['name'],
  Organization: ['name'],
};

/** Every member of schema.org/ItemAvailability (from memory). */
export const ITEM_AVAILABILITY = [
  'BackOrder',
  'Discontinued',
  'InStock',
  'InStoreOnly',
  'LimitedAvailability',
  'MadeToOrder',
  'OnlineOnly',
  'OutOfStock',
  'PreOrder',
  'PreSale',
  'Reserved',
  'SoldOut',
].map((m) => `https://schema.org/${m}`);
const EVENT_STATUS = ['EventCancelled', 'EventMovedOnline', 'EventPostponed', 'EventRescheduled', 'EventScheduled'].map(
  (m) => `https://schema.org/${m}`,
);

/** ISO 8601 date-time with an offset (what schema.org Date/DateTime values should carry for an instant). */
const DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;

/** What is wrong with one JSON-LD thing and everything nested in it; [] when nothing is. */
export function schemaOrgProblems(thing: unknown, where = '$'): string[] {
  if (Array.isArray(thing)) return thing.flatMap((t, i) => schemaOrgProblems(t, `${where}[${i}]`));
  if (!thing || typeof thing !== 'object') return [];
  const o = thing as Record<string, unknown>;
  const problems: string[] = [];
  if (where === '$' && o['@context'] !== 'https://schema.org')
    problems.push(`${where}: @context is not https://schema.org`);
  const type = o['@type'];
  if (typeof type === 'string') {
    for (const p of REQUIRED[type] ?? [])
      if (o[p] === undefined || o[p] === null || o[p] === '') problems.push(`${where} (${type}): no ${p}`);
    if (type === 'Offer') {
      if (typeof o.price !== 'string' || !/^\d+(\.\d{1,2})?$/.test(o.price))
        problems.push(`${where}: price ${String(o.price)} is not a plain decimal`);
      if (!/^[A-Z]{3}$/.test(String(o.priceCurrency))) problems.push(`${where}: priceCurrency is not an ISO 4217 code`);
      if (!ITEM_AVAILABILITY.includes(String(o.availability)))
        problems.push(`${where}: availability ${String(o.availability)} is not an ItemAvailability`);
    }
    if (type === 'Event' && o.eventStatus !== undefined && !EVENT_STATUS.includes(String(o.eventStatus)))
      problems.push(`${where}: eventStatus is not an EventStatusType`);
    for (const p of [
      'datePublished',
      'dateModified',
      'startDate',
      'endDate',
      'availabilityStarts',
      'availabilityEnds',
    ]) {
      if (o[p] !== undefined && !DATE_TIME.test(String(o[p])))
        problems.push(`${where}: ${p} ${String(o[p])} is not an ISO 8601 date-time with offset`);
    }
    for (const p of ['url', 'image']) {
      for (const u of [o[p]].flat())
        if (typeof u === 'string' && !/^https?:\/\//.test(u)) problems.push(`${where}: ${p} ${u} is not absolute`);
    }
  } else {
    problems.push(`${where}: no @type`);
  }
  for (const [k, v] of Object.entries(o))
    if (k !== '@context' && v && typeof v === 'object') problems.push(...schemaOrgProblems(v, `${where}.${k}`));
  return problems;
}

/** The JSON-LD blocks of an HTML page, parsed. */
export function jsonLdOf(html: string): Record<string, unknown>[] {
  return [...html.matchAll(/<script[^>]*type="application\/ld\+json"[^>]*>([\s\S]*?)<\/script>/g)].map(
    (m) => JSON.parse(m[1]) as Record<string, unknown>,
  );
}

/** The content of a <meta> tag with this `property` or `name`, or undefined. */
export function metaContent(html: string, key: string): string | undefined {
  for (const [tag] of html.matchAll(/<meta\b[^>]*>/g)) {
    if (new RegExp(`\\s(property|name)="${key.replace(/[.:]/g, '\\$&')}"`).test(tag))
      return decode(/\scontent="([^"]*)"/.exec(tag)?.[1] ?? '');
  }
  return undefined;
}

/** The href of a <link rel="..."> tag, or undefined. */
export function linkHref(html: string, rel: string): string | undefined {
  for (const [tag] of html.matchAll(/<link\b[^>]*>/g))
    if (tag.includes(`rel="${rel}"`)) return decode(/\shref="([^"]*)"/.exec(tag)?.[1] ?? '');
  return undefined;
}

function decode(text: string): string {
  return text
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&');
}
