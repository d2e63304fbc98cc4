import type { DatabaseNotifications } from '../../server/platform/database-notifications';
import { ALWAYS, NotifiedCache, readyJson } from '../../server/platform/notified-cache';
import type { ProductBundle } from '../../server/shop/catalogue-repository';
import { viewValidity } from '../../server/shop/product-view';

/** A stand-in for the LISTEN connection: `notify()` is a commit arriving, `listening` whether the connection is up. */
function fakeNotifications() {
  const watchers: (() => void)[] = [];
  const fake = {
    listening: true,
    watch: (_channel: string, fn: () => void) => void watchers.push(fn),
    caughtUp: async () => fake.listening,
    notify: () => watchers.forEach((fn) => fn()),
  };
  return fake;
}

const at = (iso: string) => new Date(iso);

describe('NotifiedCache', () => {
  it('builds once, serves the copy, and builds again after a notification', async () => {
    const n = fakeNotifications();
    const cache = new NotifiedCache<number>(n as unknown as DatabaseNotifications, 'test');
    let reads = 0;
    const build = async () => ({ value: ++reads, ...ALWAYS });
    expect(await cache.get('k', at('2026-12-01T00:00:00Z'), build)).toBe(1);
    expect(await cache.get('k', at('2026-12-01T00:00:00Z'), build)).toBe(1);
    n.notify();
    expect(await cache.get('k', at('2026-12-01T00:00:00Z'), build)).toBe(2);
  });

  it('does not keep what was being read while a change came in', async () => {
    const n = fakeNotifications();
    const cache = new NotifiedCache<string>(n as unknown as DatabaseNotifications, 'test');
    let release!: () => void;
    const slow = () =>
      new Promise<{ value: string; validFrom: number; validUntil: number }>(
        (r) => (release = () => r({ value: 'before the change', ...ALWAYS })),
      );
    const pending = cache.get('k', at('2026-12-01T00:00:00Z'), slow);
    await Promise.resolve();
    n.notify();
    release();
    expect(await pending).toBe('before the change');
    expect(
      await cache.get('k', at('2026-12-01T00:00:00Z'), async () => ({ value: 'after the change', ...ALWAYS })),
    ).toBe('after the change');
  });

  it('shares one build among reads that arrive while it runs', async () => {
    const n = fakeNotifications();
    const cache = new NotifiedCache<number>(n as unknown as DatabaseNotifications, 'test');
    let reads = 0;
    const build = async () => {
      reads++;
      await new Promise((r) => setTimeout(r, 10));
      return { value: reads, ...ALWAYS };
    };
    const answers = await Promise.all([1, 2, 3].map(() => cache.get('k', at('2026-12-01T00:00:00Z'), build)));
    expect(answers).toEqual([1, 1, 1]);
    expect(reads).toBe(1);
  });

  it('reads every time while it cannot listen', async () => {
    const n = fakeNotifications();
    n.listening = false;
    const cache = new NotifiedCache<number>(n as unknown as DatabaseNotifications, 'test');
    let reads = 0;
    const build = async () => ({ value: ++reads, ...ALWAYS });
    await cache.get('k', at('2026-12-01T00:00:00Z'), build);
    await cache.get('k', at('2026-12-01T00:00:00Z'), build);
    expect(reads).toBe(2);
  });

  it('builds again once `now` leaves the window the value was true in, and keeps nothing for null', async () => {
    const n = fakeNotifications();
    const cache = new NotifiedCache<string>(n as unknown as DatabaseNotifications, 'test');
    const window = {
      validFrom: at('2026-12-01T00:00:00Z').getTime(),
      validUntil: at('2026-12-02T00:00:00Z').getTime(),
    };
    expect(await cache.get('k', at('2026-12-01T12:00:00Z'), async () => ({ value: 'open', ...window }))).toBe('open');
    expect(await cache.get('k', at('2026-12-01T23:59:59Z'), async () => ({ value: 'not read', ...window }))).toBe(
      'open',
    );
    expect(await cache.get('k', at('2026-12-02T00:00:00Z'), async () => ({ value: 'closed', ...ALWAYS }))).toBe(
      'closed',
    );
    let reads = 0;
    await cache.get('none', at('2026-12-01T12:00:00Z'), async () => (reads++, null));
    await cache.get('none', at('2026-12-01T12:00:00Z'), async () => (reads++, null));
    expect(reads).toBe(2);
  });
});

describe('readyJson', () => {
  it('names equal content with equal versions and different content with different ones', () => {
    expect(readyJson({ a: 1 })).toEqual(readyJson({ a: 1 }));
    expect(readyJson({ a: 1 }).version).not.toBe(readyJson({ a: 2 }).version);
    expect(readyJson({ a: 1 }).json).toBe('{"a":1}');
  });
});

describe('viewValidity', () => {
  const bundle = (opens: string, closes: string) =>
    ({ run: { opens_at: at(opens), closes_at: at(closes) } }) as unknown as ProductBundle;

  it('spans from the last opening or closing at or before now to the next one after it', () => {
    const bundles = [
      bundle('2026-12-01T00:00:00Z', '2026-12-10T00:00:00Z'),
      bundle('2026-12-05T00:00:00Z', '2026-12-20T00:00:00Z'),
    ];
    expect(viewValidity(bundles, at('2026-12-03T00:00:00Z'))).toEqual({
      validFrom: at('2026-12-01T00:00:00Z').getTime(),
      validUntil: at('2026-12-05T00:00:00Z').getTime(),
    });
    // At the very instant a run opens, its state is already open (effectiveRunState: now >= opensAt).
    expect(viewValidity(bundles, at('2026-12-05T00:00:00Z'))).toEqual({
      validFrom: at('2026-12-05T00:00:00Z').getTime(),
      validUntil: at('2026-12-10T00:00:00Z').getTime(),
    });
  });

  it('is unbounded for products without runs', () => {
    expect(viewValidity([{ run: null } as unknown as ProductBundle], at('2026-12-03T00:00:00Z'))).toEqual({
      validFrom: -Infinity,
      validUntil: Infinity,
    });
  });
});
