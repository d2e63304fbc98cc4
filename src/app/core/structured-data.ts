import type { BlogPosting, Event, ItemAvailability, Product as ProductThing, WithContext } from 'schema-dts';
import type { Product, ProductDetail } from '@contracts/shop/shop-answers';

/**
 * schema.org JSON-LD for the public pages, typed with `schema-dts` (the schema.org vocabulary as TypeScript types), so
 * a property or value the vocabulary does not have is a compile error. All addresses are absolute.
 */

/** What the BlogPosting builder reads of a build log (a PostDetail has it). */
export interface PostFacts {
  title: string;
  summary: string;
  publishedAt: string;
  updatedAt?: string;
  author: string | null;
  tags: string[];
  membersOnly: boolean;
}

/** What the Event builder reads of a launch day (a Launch has it). */
export interface LaunchFacts {
  title: string;
  date: string;
  startsAt: string;
  endsAt: string;
  status: string;
  notes: string;
  site: { name: string; address: string | null; lat: number | null; lon: number | null };
}

/** Text of a sanitised HTML fragment: tags dropped, the common entities read, spaces folded. */
export function plainText(html: string): string {
  const entities: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'", nbsp: ' ' };
  return html
    .replace(/<[^>]*>/g, ' ')
    .replace(/&(amp|lt|gt|quot|#39|nbsp);/g, (_m, name: string) => entities[name])
    .replace(/\s+/g, ' ')
    .trim();
}

/** At most `max` characters, cut at a word and marked with an ellipsis. */
export function clip(text: string, max = 160): string {
  if (text.length <= max) return text;
  const cut = text.slice(0, max - 1);
  return cut.slice(0, Math.max(cut.lastIndexOf(' '), max / 2)).trimEnd() + '…';
}

/** A run's state as schema.org item availability (a run is made once its window closes, so a closed one is over). */
export function availability(p: Product): ItemAvailability {
  if (!p.run) return p.orderable ? 'https://schema.org/InStock' : 'https://schema.org/OutOfStock';
  switch (p.run.state) {
    case 'open':
      return p.orderable ? 'https://schema.org/InStock' : 'https://schema.org/SoldOut';
    case 'scheduled':
      return 'https://schema.org/PreOrder';
    case 'sold_out':
      return 'https://schema.org/SoldOut';
    default:
      return 'https://schema.org/Discontinued';
  }
}

/** Cents as the decimal string schema.org's `price` takes ("32.00"). */
export function price(cents: number): string {
  return (cents / 100).toFixed(2);
}

export function productData(p: ProductDetail, url: string, images: string[], brand: string): WithContext<ProductThing> {
  const lowest = Math.min(p.priceCents, ...p.variants.map((v) => v.priceCents));
  return {
    '@context': 'https://schema.org',
    '@type': 'Product',
    name: p.name,
    description: clip(plainText(p.descriptionHtml), 500) || p.name,
    image: images,
    url,
    ...(brand ? { brand: { '@type': 'Brand', name: brand } } : {}),
    ...(p.variants.length === 1 ? { sku: p.variants[0].sku } : {}),
    offers: {
      '@type': 'Offer',
      url,
      price: price(lowest),
      priceCurrency: 'CAD',
      availability: availability(p),
      ...(p.run ? { availabilityStarts: p.run.opensAt, availabilityEnds: p.run.closesAt } : {}),
    },
  };
}

export function postData(p: PostFacts, url: string, image: string, publisher: string): WithContext<BlogPosting> {
  return {
    '@context': 'https://schema.org',
    '@type': 'BlogPosting',
    headline: p.title,
    description: p.summary,
    url,
    mainEntityOfPage: url,
    image: [image],
    datePublished: p.publishedAt,
    dateModified: p.updatedAt ?? p.publishedAt,
    author: p.author ? { '@type': 'Person', name: p.author } : { '@type': 'Organization', name: publisher },
    publisher: { '@type': 'Organization', name: publisher },
    keywords: p.tags.join(', '),
    isAccessibleForFree: !p.membersOnly,
  };
}

/**
 * A wall-clock date and time in a time zone as ISO 8601 with that zone's offset then ('2027-05-15T09:00:00-05:00'),
 * which schema.org dates take. The offset is the one in force at that local time (Intl's `longOffset`).
 */
export function zonedDateTime(date: string, time: string, timeZone: string): string {
  const local = `${date}T${time}:00`;
  // The offset at the instant the wall clock would show, read first at UTC and then again at the corrected guess.
  let offset = offsetAt(new Date(`${local}Z`), timeZone);
  offset = offsetAt(new Date(new Date(`${local}Z`).getTime() - minutes(offset) * 60_000), timeZone);
  return `${local}${offset === '+00:00' ? 'Z' : offset}`;
}

function offsetAt(instant: Date, timeZone: string): string {
  const name =
    new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' })
      .formatToParts(instant)
      .find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
  return name === 'GMT' ? '+00:00' : name.slice(3);
}

function minutes(offset: string): number {
  const sign = offset.startsWith('-') ? -1 : 1;
  return sign * (Number(offset.slice(1, 3)) * 60 + Number(offset.slice(4, 6)));
}

export function launchData(
  l: LaunchFacts,
  timeZone: string,
  url: string,
  image: string,
  organizer: string,
): WithContext<Event> {
  return {
    '@context': 'https://schema.org',
    '@type': 'Event',
    name: l.title,
    description: l.notes ? clip(l.notes, 300) : `${l.title} at ${l.site.name}.`,
    url,
    image: [image],
    startDate: zonedDateTime(l.date, l.startsAt, timeZone),
    endDate: zonedDateTime(l.date, l.endsAt, timeZone),
    eventStatus: l.status === 'called_off' ? 'https://schema.org/EventCancelled' : 'https://schema.org/EventScheduled',
    eventAttendanceMode: 'https://schema.org/OfflineEventAttendanceMode',
    location: {
      '@type': 'Place',
      name: l.site.name,
      address: l.site.address ?? l.site.name,
      ...(l.site.lat != null && l.site.lon != null
        ? { geo: { '@type': 'GeoCoordinates', latitude: l.site.lat, longitude: l.site.lon } }
        : {}),
    },
    organizer: { '@type': 'Organization', name: organizer },
  };
}
