import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Knex } from 'knex';
import sharp from 'sharp';
import type { ProductImage } from '../../contracts/shop/shop-answers';
import type { ImageUploads } from '../../server/uploads/image-uploads';
import type { ArtPiece } from './product-art';

/**
 * Rasterises a product's drawings to WebP and stores them through the uploads path (which also keeps a 480 px
 * WebP copy), then sets them as the product's photos. Returns the photos as the product now lists them.
 */
export async function storeProductArt(
  db: Knex,
  uploads: ImageUploads,
  productId: number,
  pieces: ArtPiece[],
): Promise<ProductImage[]> {
  const images: ProductImage[] = [];
  // The uploads path takes files as an upload leaves them: on disk, in a temporary folder.
  const dir = await mkdtemp(path.join(tmpdir(), 'padside-art-'));
  try {
    for (const [i, piece] of pieces.entries()) {
      const bytes = await sharp(Buffer.from(piece.svg)).webp({ quality: 82 }).toBuffer();
      const file = path.join(dir, `product-${productId}-${i + 1}.webp`);
      await writeFile(file, bytes);
      const stored = await uploads.store({ path: file, size: bytes.length, originalName: path.basename(file) }, null);
      images.push({
        url: stored.url,
        thumbnailUrl: stored.thumbnailUrl,
        alt: piece.alt,
        width: stored.width,
        height: stored.height,
      });
    }
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
  await db('shop_products')
    .where('id', productId)
    .update({ images: JSON.stringify(images) });
  return images;
}
