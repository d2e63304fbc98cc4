import path from 'node:path';
import type { Knex } from 'knex';
import { loadConfig } from '../server/config';
import { DiskStorage } from '../server/uploads/disk-storage';
import { ImageUploads } from '../server/uploads/image-uploads';
import { noseConePin, season2Shirt, season3Shirt, stickerSheet, type ArtPiece } from './shop-art/product-art';
import { storeProductArt } from './shop-art/store-art';

const ART: Record<string, () => ArtPiece[]> = {
  'season-3-shirt': season3Shirt,
  'season-2-shirt': season2Shirt,
  'nose-cone-pin': noseConePin,
  'sticker-sheet': stickerSheet,
};

/** Photos of our own making for the demo merch, for each demo product that has none yet. */
export async function seed(knex: Knex): Promise<void> {
  const uploads = new ImageUploads(knex, new DiskStorage(path.join(loadConfig().dataDir, 'uploads')));
  for (const [slug, draw] of Object.entries(ART)) {
    const product = await knex('shop_products').where('slug', slug).first('id', 'images');
    if (!product || (Array.isArray(product.images) && product.images.length)) continue;
    await storeProductArt(knex, uploads, Number(product.id), draw());
  }
}
