import type { Router } from 'express';
import { ACCESS_TABLE } from '../access/access-table';
import { CALLERS, type Caller, type RouteAccess } from '../access/access-types';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { Client, createUser } from '../helpers/users';

let t: TestApp;
const clients = new Map<Caller, Client>();

beforeAll(async () => {
  t = buildTestApp();
  for (const caller of CALLERS) {
    const client = new Client(t.app);
    if (caller !== 'anonymous')
      await client.signIn(await createUser(t.deps.db, caller === 'member' ? ['fan', 'member'] : [caller]));
    clients.set(caller, client);
  }
});
afterAll(() => t.close());

interface RouteLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: unknown[] };
}

/** Every method and full path registered through the app's recorded mounts. */
function registeredRoutes(): { method: string; path: string }[] {
  const out: { method: string; path: string }[] = [];
  for (const { prefix, router } of t.app.mounts) {
    for (const layer of (router as Router & { stack: RouteLayer[] }).stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods))
          if (m !== '_all')
            out.push({
              method: m.toUpperCase(),
              path: prefix + (layer.route.path === '/' ? '' : layer.route.path) || '/',
            });
      } else if (layer.handle?.stack) {
        throw new Error(`${prefix} mounts a nested router; mount flat routers so every route can be listed`);
      }
    }
  }
  return out;
}

const key = (r: { method: string; path: string }) => `${r.method} ${r.path}`;

describe('the access table (OWASP ASVS 4.0.3 4.1.1, 4.1.3: access enforced on the server for every route)', () => {
  it('names every registered route, and names no route that is not registered', () => {
    const registered = registeredRoutes().map(key).sort();
    const declared = ACCESS_TABLE.map(key).sort();
    expect(registered).toEqual(declared);
  });

  const fill = (path: string) =>
    path.replace(/:(\w+)/g, (_m, name: string) => (/id$/i.test(name) ? '999999' : 'no-such-thing'));

  describe.each(ACCESS_TABLE.filter((r) => r.allow !== 'public'))('$method $path', (route: RouteAccess) => {
    it.each(CALLERS)('answers %s as declared', async (caller) => {
      const client = clients.get(caller)!;
      const url = fill(route.path);
      const res = await (route.method === 'GET'
        ? client.get(url)
        : client[route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete'](url, {}));
      if (route.allow === 'owner') {
        // Nobody owns id 999999: every caller, staff included, gets the not-found answer.
        expect(res.status).toBe(404);
        return;
      }
      const allowed =
        route.allow === 'signedIn' ? caller !== 'anonymous' : (route.allow as readonly Caller[]).includes(caller);
      if (allowed) expect([401, 403]).not.toContain(res.status);
      else expect(res.status).toBe(caller === 'anonymous' ? 401 : 403);
      expect(res.status).toBeLessThan(500);
    });
  });
});
