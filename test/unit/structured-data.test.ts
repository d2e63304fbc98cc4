import {
  availability,
  clip,
  launchData,
  plainText,
  postData,
  price,
  productData,
  zonedDateTime,
} from '../../src/app/core/structured-data';
import type { ProductDetail } from '../../contracts/shop/shop-answers';
import { schemaOrgProblems } from '../helpers/schema-org';

const run = (state: NonNullable<ProductDetail['run']>['state']) => ({
  id: 1,
  name: 'Spring run',
  state,
  cap: 50,
  remaining: 10,
  opensAt: '2027-04-01T14:00:00.000Z',
  closesAt: '2027-04-15T04:59:00.000Z',
});
const shirt = (over: Partial<ProductDetail> = {}): ProductDetail => ({
  id: 1,
  slug: 'pad-shirt',
  name: 'Pad Shirt',
  priceCents: 3200,
  currency: 'CAD',
  weightGrams: 200,
  maxPerOrder: 20,
  images: [],
  sizeChart: null,
  orderable: true,
  run: run('open'),
  variants: [
    { id: 1, sku: 'PS-M', label: 'M', priceCents: 3200, weightGrams: 200, remaining: 5 },
    { id: 2, sku: 'PS-XL', label: 'XL', priceCents: 3000, weightGrams: 220, remaining: 5 },
  ],
  descriptionHtml: '<p>Soft <strong>cotton</strong> &amp; a printed pad.</p>',
  ...over,
});

describe('zonedDateTime', () => {
  // IANA tz database, America/Winnipeg: CST (UTC-6) in winter, CDT (UTC-5) from the second Sunday of March (from memory).
  it.each([
    ['2027-01-16', '10:00', 'America/Winnipeg', '2027-01-16T10:00:00-06:00'],
    ['2027-06-12', '09:30', 'America/Winnipeg', '2027-06-12T09:30:00-05:00'],
    ['2027-03-14', '03:30', 'America/Winnipeg', '2027-03-14T03:30:00-05:00'],
    ['2027-06-12', '09:30', 'UTC', '2027-06-12T09:30:00Z'],
    ['2027-06-12', '09:30', 'Asia/Kolkata', '2027-06-12T09:30:00+05:30'],
  ])('%s %s in %s is %s', (date, time, zone, expected) => {
    expect(zonedDateTime(date, time, zone)).toBe(expected);
  });
});

describe('availability', () => {
  it.each([
    ['open', true, 'https://schema.org/InStock'],
    ['open', false, 'https://schema.org/SoldOut'],
    ['scheduled', false, 'https://schema.org/PreOrder'],
    ['sold_out', false, 'https://schema.org/SoldOut'],
    ['closed', false, 'https://schema.org/Discontinued'],
    ['shipped', false, 'https://schema.org/Discontinued'],
  ] as const)('a run %s (orderable %s) is %s', (state, orderable, expected) => {
    expect(availability(shirt({ run: run(state), orderable }))).toBe(expected);
  });
  it('a stock product is in stock while orderable and out of stock otherwise', () => {
    expect(availability(shirt({ run: null, orderable: true }))).toBe('https://schema.org/InStock');
    expect(availability(shirt({ run: null, orderable: false }))).toBe('https://schema.org/OutOfStock');
  });
});

describe('the JSON-LD builders', () => {
  it('a product: the lowest variant price as a decimal in CAD, the run window, and nothing missing', () => {
    const data = productData(
      shirt(),
      'https://padside.example/shop/p/pad-shirt',
      ['https://padside.example/uploads/a.webp'],
      'Thrust & Filament',
    );
    expect(schemaOrgProblems(data)).toEqual([]);
    expect(data).toMatchObject({
      description: 'Soft cotton & a printed pad.',
      offers: {
        price: '30.00',
        priceCurrency: 'CAD',
        availabilityStarts: '2027-04-01T14:00:00.000Z',
        availabilityEnds: '2027-04-15T04:59:00.000Z',
      },
    });
  });

  it('a post: author or the team, dates, and a free flag for members-only bodies', () => {
    const post = {
      slug: 'fins',
      title: 'Fins',
      summary: 'Fin can.',
      coverUrl: null,
      publishedAt: '2027-02-01T12:00:00.000Z',
      updatedAt: '2027-02-03T12:00:00.000Z',
      tags: ['fins'],
      membersOnly: true,
      author: null,
      html: null,
      credits: [],
      hazardNotice: false,
    };
    const data = postData(
      post,
      'https://padside.example/build-logs/fins',
      'https://padside.example/share-card.png',
      'Thrust & Filament',
    );
    expect(schemaOrgProblems(data)).toEqual([]);
    expect(data).toMatchObject({
      author: { '@type': 'Organization', name: 'Thrust & Filament' },
      dateModified: '2027-02-03T12:00:00.000Z',
      isAccessibleForFree: false,
    });
  });

  it('a launch day called off is EventCancelled, at its place with coordinates', () => {
    const launch = {
      id: 3,
      title: 'Fall fly',
      date: '2027-10-02',
      startsAt: '10:00',
      endsAt: '16:00',
      status: 'called_off' as const,
      statusLabel: 'Called off',
      callOffReason: 'Wind',
      site: { name: 'Coulee Field', address: null, lat: 49.6, lon: -98 },
      ceilingMetres: 1500,
      waiverVersion: null,
      notes: '',
      rsvpCount: 0,
    };
    const data = launchData(
      launch,
      'America/Winnipeg',
      'https://padside.example/launches/3',
      'https://padside.example/share-card.png',
      'Gopher Flats Rocketry Society',
    );
    expect(schemaOrgProblems(data)).toEqual([]);
    expect(data).toMatchObject({
      eventStatus: 'https://schema.org/EventCancelled',
      startDate: '2027-10-02T10:00:00-05:00',
      location: { geo: { latitude: 49.6, longitude: -98 } },
    });
  });

  it('the checker itself finds what is missing or malformed', () => {
    expect(
      schemaOrgProblems({
        '@context': 'https://schema.org',
        '@type': 'Product',
        name: 'X',
        image: ['/x.png'],
        offers: { '@type': 'Offer', price: 32, priceCurrency: 'dollars', availability: 'in stock' },
      }),
    ).toEqual([
      '$: image /x.png is not absolute',
      '$.offers: price 32 is not a plain decimal',
      '$.offers: priceCurrency is not an ISO 4217 code',
      '$.offers: availability in stock is not an ItemAvailability',
    ]);
  });
});

describe('plainText and clip', () => {
  it('reads sanitised HTML as text and cuts long text at a word', () => {
    expect(plainText('<p>One &lt;two&gt;</p>\n<p>three&nbsp;four</p>')).toBe('One <two> three four');
    expect(clip('word '.repeat(50).trim(), 20)).toBe('word word word…');
    expect(price(1999)).toBe('19.99');
  });
});
