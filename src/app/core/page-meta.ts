import { DOCUMENT, Injectable, inject } from '@angular/core';
import { Meta, Title } from '@angular/platform-browser';
import { NavigationStart, Router } from '@angular/router';

/** The picture a page is shared with when it has none of its own (a raster copy of the mark, 1200 × 630). */
export const SHARE_IMAGE = { url: '/share-card.png', width: 1200, height: 630, alt: 'Padside' };

/** What one public page says about itself to link previews and search engines. */
export interface PageDescription {
  /** The page's own title; " — Padside" is added. */
  title: string;
  description: string;
  /** The page's canonical path ('/shop/p/pad-shirt'). */
  path: string;
  type: 'website' | 'product' | 'article';
  image?: { url: string; width?: number; height?: number; alt?: string } | null;
  /** schema.org JSON-LD for the page. */
  data?: object | null;
  /** The page's largest image, fetched before the script needs it. */
  preload?: { href: string; srcset?: string; sizes?: string } | null;
}

/** Marks what PageMeta wrote into <head>, so the next page removes it. */
const OWNED = 'data-ps-page';
const OG = [
  'og:title',
  'og:description',
  'og:type',
  'og:url',
  'og:image',
  'og:image:width',
  'og:image:height',
  'og:image:alt',
  'og:site_name',
];
const CARD = ['twitter:card', 'twitter:title', 'twitter:description', 'twitter:image', 'twitter:image:alt'];

/**
 * Title, description, canonical link, Open Graph and summary-card tags, JSON-LD and the image preload of a public page.
 * The server render writes them into the HTML a link preview or crawler reads; in the browser they follow navigation.
 */
@Injectable({ providedIn: 'root' })
export class PageMeta {
  private readonly doc = inject(DOCUMENT);
  private readonly meta = inject(Meta);
  private readonly title = inject(Title);

  constructor() {
    // A page that says nothing about itself must not keep the previous page's preview.
    inject(Router).events.subscribe((e) => e instanceof NavigationStart && this.clear());
  }

  /** An absolute address on this site. */
  absolute(path: string): string {
    return new URL(path, this.doc.location.origin).toString();
  }

  describe(page: PageDescription): void {
    this.clear();
    const url = this.absolute(page.path);
    const image = page.image ?? SHARE_IMAGE;
    const imageUrl = this.absolute(image.url);
    this.title.setTitle(`${page.title} — Padside`);
    this.meta.updateTag({ name: 'description', content: page.description });
    const og: Record<string, string | undefined> = {
      'og:title': page.title,
      'og:description': page.description,
      'og:type': page.type,
      'og:url': url,
      'og:image': imageUrl,
      'og:image:width': image.width ? String(image.width) : undefined,
      'og:image:height': image.height ? String(image.height) : undefined,
      'og:image:alt': image.alt,
      'og:site_name': 'Padside',
    };
    for (const [property, content] of Object.entries(og))
      if (content) this.meta.addTag({ property, content, [OWNED]: '' });
    const card: Record<string, string | undefined> = {
      'twitter:card': 'summary_large_image',
      'twitter:title': page.title,
      'twitter:description': page.description,
      'twitter:image': imageUrl,
      'twitter:image:alt': image.alt,
    };
    for (const [name, content] of Object.entries(card)) if (content) this.meta.addTag({ name, content, [OWNED]: '' });
    this.addToHead('link', { rel: 'canonical', href: url });
    if (page.preload) {
      this.addToHead('link', {
        rel: 'preload',
        as: 'image',
        href: page.preload.href,
        fetchpriority: 'high',
        ...(page.preload.srcset ? { imagesrcset: page.preload.srcset, imagesizes: page.preload.sizes ?? '100vw' } : {}),
      });
    }
    if (page.data) {
      // A data block, not a script: the CSP does not apply to it, and `<` is escaped so no text can close it.
      const script = this.addToHead('script', { type: 'application/ld+json' });
      script.textContent = JSON.stringify(page.data).replace(/</g, '\\u003c');
    }
  }

  /** Removes what the last page wrote. */
  clear(): void {
    for (const key of [...OG, ...CARD]) this.meta.removeTag(`${key.startsWith('og:') ? 'property' : 'name'}="${key}"`);
    this.doc.head.querySelectorAll(`[${OWNED}]`).forEach((el) => el.remove());
  }

  private addToHead(tag: string, attributes: Record<string, string>): HTMLElement {
    const el = this.doc.createElement(tag);
    for (const [k, v] of Object.entries(attributes)) el.setAttribute(k, v);
    el.setAttribute(OWNED, '');
    this.doc.head.appendChild(el);
    return el;
  }
}
