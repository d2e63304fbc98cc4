/** What the build-log routes answer (public list and page, the editors' table and form). */
import type { PostStatus } from '../labels/post-states';

/** A sponsor a post credits. */
export interface PostCredit {
  sponsorId: number;
  name: string;
  slug: string;
}

/** GET /api/posts: one row of the public list. */
export interface PostSummary {
  slug: string;
  title: string;
  summary: string;
  coverUrl: string | null;
  /** The uploaded cover's sizes and WebP thumbnail; null for a cover from elsewhere or none. */
  cover?: { url: string; thumbnailUrl: string; width: number; height: number } | null;
  publishedAt: string;
  tags: string[];
  membersOnly: boolean;
}

/** GET /api/posts and GET /api/admin/posts: one page of rows with the total. */
export interface PostPage<Row> {
  items: Row[];
  total: number;
  page: number;
  pageSize: number;
}

/** GET /api/posts/:slug: a published post; `html` is null when the body is for members. */
export interface PostDetail extends PostSummary {
  author: string | null;
  /** The last edit (never before publishing). */
  updatedAt?: string;
  html: string | null;
  credits: PostCredit[];
  hazardNotice: boolean;
}

/** GET /api/admin/posts: one row of the editors' table. */
export interface AdminPostRow {
  id: number;
  slug: string;
  title: string;
  status: PostStatus;
  publishAt: string | null;
  publishedAt: string | null;
  updatedAt: string;
  membersOnly: boolean;
  tags: string[];
}

/** GET /api/admin/posts/:id: a post of any state as the editor form loads it. */
export interface AdminPost {
  id: number;
  slug: string;
  title: string;
  summary: string;
  coverUrl: string | null;
  markdown: string;
  tags: string[];
  status: PostStatus;
  publishAt: string | null;
  publishedAt: string | null;
  membersOnly: boolean;
  hazardNotice: boolean;
  hazardRequired: boolean;
  credits: PostCredit[];
  author: string | null;
}

/** POST /api/admin/posts/preview. */
export interface PostPreview {
  html: string;
  hazardNotice: boolean;
  unknownSponsors: string[];
}

/** POST /api/admin/posts and PUT /api/admin/posts/:id: the post's id and the address it is saved under. */
export interface PostSaved {
  id: number;
  slug: string;
}

/** GET /api/posts/tags: a tag on published posts with how many carry it. */
export interface TagCount {
  tag: string;
  count: number;
}
