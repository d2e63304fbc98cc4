import { randomUUID } from 'node:crypto';
import type { Client } from '../helpers/users';

/** A shirt with a run that is open now, created through the staff API; returns its variants. */
export async function openShirt(
  staff: Client,
  opts: { cap?: number; priceCents?: number; variantCaps?: Record<string, number> } = {},
) {
  const tag = randomUUID().slice(0, 6).toUpperCase();
  const res = await staff.post('/api/admin/products', {
    name: `Test shirt ${tag}`,
    description: 'A **test** shirt.',
    priceCents: opts.priceCents ?? 3500,
    weightGrams: 200,
    variants: [
      { label: 'M', sku: `T-${tag}-M` },
      { label: 'L', sku: `T-${tag}-L`, weightGrams: 220 },
    ],
    run: {
      cap: opts.cap ?? 50,
      opensAt: new Date(Date.now() - 86400_000).toISOString(),
      closesAt: new Date(Date.now() + 7 * 86400_000).toISOString(),
      unitCostCents: 900,
      variantCaps: opts.variantCaps,
    },
  });
  if (res.status !== 201) throw new Error(`product not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.product as {
    id: number;
    slug: string;
    run: { id: number };
    variants: { id: number; label: string; sku: string }[];
  };
}

/** A sticker sold from ordinary stock. */
export async function stockSticker(staff: Client, stock: number) {
  const tag = randomUUID().slice(0, 6).toUpperCase();
  const res = await staff.post('/api/admin/products', {
    name: `Sticker ${tag}`,
    priceCents: 400,
    weightGrams: 10,
    variants: [{ label: 'One size', sku: `S-${tag}`, stock }],
  });
  if (res.status !== 201) throw new Error(`sticker not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.product as { id: number; variants: { id: number }[] };
}

export const MB_ADDRESS = {
  name: 'Priya Test',
  line1: '12 Launch Rail Rd',
  city: 'Gopher Flats',
  province: 'MB',
  postalCode: 'R0K 1A0',
  country: 'CA',
};

/** The shipping method with this code. */
export async function methodId(client: Client, code: string): Promise<number> {
  const res = await client.get('/api/shipping-methods');
  return res.body.items.find((m: { code: string }) => m.code === code).id;
}

/** A token chain the fake understands, unique so its state is this test's alone. */
export const chain = (...tokens: string[]) => [...tokens, `tok_visa`, randomUUID().replace(/-/g, '')].join('|');
