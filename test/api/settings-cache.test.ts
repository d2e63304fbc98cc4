import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { z } from 'zod';
import { defineSetting } from '../../server/settings/settings-service';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { recordedQueries } from '../helpers/recorded-queries';

let a: TestApp;
let b: TestApp;
beforeAll(() => {
  // Two app instances on one database, like two server processes.
  a = buildTestApp();
  b = buildTestApp();
});
afterAll(async () => {
  await a.close();
  await b.close();
});

// A key of this test's own: suites share the database and must not change settings others read.
const OWN = defineSetting(`cache-test-${randomUUID()}`, z.object({ limit: z.number().int() }), { limit: 1 });

async function settingsReads(db: Knex, fn: () => Promise<unknown>): Promise<number> {
  return (await recordedQueries(db, fn)).filter((sql) => /from "settings"/.test(sql)).length;
}

describe('SettingsService.get', () => {
  it('reads a setting once, then from the copy; a change saved on one instance is what the other reads next', async () => {
    expect(await b.app.platform.settings.get(OWN)).toEqual({ limit: 1 });
    // Other suites write other settings, each commit dropping the copies: a few tries to see one read served from it.
    let cached = false;
    for (let i = 0; i < 10 && !cached; i++)
      cached = (await settingsReads(b.deps.db, () => b.app.platform.settings.get(OWN))) === 0;
    expect(cached).toBe(true);

    await a.app.platform.settings.put(OWN, { limit: 7 });
    expect(await b.app.platform.settings.get(OWN)).toEqual({ limit: 7 });
    // Written outside the app: the trigger reports it too.
    await a.deps
      .db('settings')
      .where('key', OWN.key)
      .update({ value: JSON.stringify({ limit: 9 }) });
    expect(await b.app.platform.settings.get(OWN)).toEqual({ limit: 9 });
  });

  it('hands out copies: changing what one caller got does not change what the next gets', async () => {
    const first = await a.app.platform.settings.get(OWN);
    first.limit = 1000;
    expect((await a.app.platform.settings.get(OWN)).limit).not.toBe(1000);
  });
});
