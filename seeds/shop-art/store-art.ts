import type { Knex } from 'knex';
import sharp from 'sharp';
import type { ProductImage } from '../../server/shop/catalogue-repository';
import type { ImageUploads } from '../../server/uploads/image-uploads';
import type { ArtPiece } from './product-art';

/**
 * Rasterises a product's drawings to WebP and stores them through the uploads path (which also keeps a 480 px
 * WebP copy), then sets them as the product's photos. Returns the photos as the product now lists them.
 */
export async function storeProductArt(db: Knex, uploads: ImageUploads, productId: number, pieces: ArtPiece[]): Promise<ProductImage[]> {
  const images: ProductImage[] = [];
  for (const [i, piece] of pieces.entries()) {
    const bytes = await sharp(Buffer.from(piece.svg)).webp({ quality: 82 }).toBuffer();
    const stored = await uploads.store(bytes, `product-${productId}-${i + 1}.webp`, null);
    images.push({ url: stored.url, thumbnailUrl: stored.thumbnailUrl, alt: piece.alt, width: stored.width, height: stored.height });
  }
  await db('shop_products').where('id', productId).update({ images: JSON.stringify(images) });
  return images;
}
