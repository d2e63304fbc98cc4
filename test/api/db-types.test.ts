import { buildTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('values read through the app database', () => {
  it('reads ids, counts and sums as numbers and dates as YYYY-MM-DD text, in a table shaped like ours', async () => {
    await t.deps.db
      .transaction(async (trx) => {
        await trx.raw(
          'CREATE TEMP TABLE db_types_probe (id bigserial PRIMARY KEY, cents integer NOT NULL, ' +
            'big_cents bigint NOT NULL, day date NOT NULL, at timestamptz NOT NULL DEFAULT now(), ' +
            'rate numeric(7, 4) NOT NULL DEFAULT 13.0000) ON COMMIT DROP',
        );
        await trx('db_types_probe').insert([
          { cents: 1250, big_cents: 40_000_000_000, day: '2026-03-01' },
          { cents: 750, big_cents: 2, day: '2026-12-31' },
        ]);
        const [row] = await trx('db_types_probe').orderBy('id').select('*');
        expect(typeof row.id).toBe('number');
        expect(Number.isSafeInteger(row.id)).toBe(true);
        expect(row.big_cents).toBe(40_000_000_000);
        expect(row.day).toBe('2026-03-01');
        expect(row.at).toBeInstanceOf(Date);
        // numeric keeps its exact decimal text.
        expect(row.rate).toBe('13.0000');

        const [{ count }] = await trx('db_types_probe').count<{ count: number }[]>('* as count');
        expect(count).toBe(2);
        // sum(integer) is a bigint; sum(bigint) is numeric, so queries cast it back to bigint.
        const { rows } = await trx.raw<{ rows: { cents: number; big: number; raw_big: string }[] }>(
          'SELECT sum(cents) AS cents, sum(big_cents)::bigint AS big, sum(big_cents) AS raw_big FROM db_types_probe',
        );
        expect(rows[0]).toEqual({ cents: 2000, big: 40_000_000_002, raw_big: '40000000002' });

        const [last] = await trx('db_types_probe').where({ day: '2026-12-31' }).select('day');
        expect(last.day).toBe('2026-12-31');
        throw new Error('rollback');
      })
      .catch((err: Error) => {
        if (err.message !== 'rollback') throw err;
      });
  });

  it('refuses an int8 beyond 2^53 instead of rounding it or handing it over as a string', async () => {
    await expect(t.deps.db.raw('SELECT 9007199254740993::bigint AS n')).rejects.toThrow(
      /int8 value 9007199254740993 is beyond/,
    );
    await expect(t.deps.db.raw('SELECT (-9007199254740992)::bigint AS n')).rejects.toThrow(RangeError);
    // The largest exact value still reads, and the pool keeps working after the refusal.
    const { rows } = await t.deps.db.raw<{ rows: { n: number }[] }>('SELECT 9007199254740991::bigint AS n');
    expect(rows[0].n).toBe(Number.MAX_SAFE_INTEGER);
  });
});
