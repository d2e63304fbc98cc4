import { Router } from 'express';
import { z } from 'zod';
import type { Clock } from '../platform/clock';
import { requireRole } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import { AdminPostListQuery, PostListQuery } from '../../contracts/build-logs/post-schemas';
import { PostBody, PreviewBody } from './post-schemas';
import type { PostReadService } from './post-read-service';
import type { PostService } from './post-service';

/** GET /api/posts, /api/posts/tags, /api/posts/:slug (public; members-only bodies withheld). */
export function postPublicRoutes(posts: PostReadService): Router {
  const r = Router();
  r.get('/', async function listPosts(req, res) {
    res.json(await posts.publicPage(parse(PostListQuery, req.query)));
  });
  r.get('/tags', async function listTags(_req, res) {
    res.json({ items: await posts.tags() });
  });
  r.get('/:slug', async function showPost(req, res) {
    const slug = parse(z.string().max(120), req.params.slug);
    res.json(await posts.publicPost(slug, req.user?.roles ?? []));
  });
  return r;
}

/** /api/admin/posts (editor, admin): the editor's list, create, replace and live preview. */
export function postAdminRoutes(posts: PostService, reads: PostReadService, clock: Clock): Router {
  const r = Router();
  r.use(requireRole('editor', 'admin'));
  r.get('/', async function listPostsAdmin(req, res) {
    res.json(await reads.adminPage(parse(AdminPostListQuery, req.query)));
  });
  r.post('/preview', async function previewPost(req, res) {
    res.json(await posts.preview(parse(PreviewBody, req.body)));
  });
  r.post('/', async function createPost(req, res) {
    res.status(201).json(await posts.create(parse(PostBody, req.body), req.user!.id, clock.now()));
  });
  r.get('/:id', async function getPostAdmin(req, res) {
    res.json(await reads.adminGet(parse(fields.id, req.params.id)));
  });
  r.put('/:id', async function replacePost(req, res) {
    res.json(await posts.update(parse(fields.id, req.params.id), parse(PostBody, req.body), clock.now()));
  });
  return r;
}
