import { PostBody as PostFields, PostPreviewBody } from '../../contracts/build-logs/post-schemas';
import { refuseUnrenderable } from '../markdown/markdown-field';

// The contract's bodies, with the one check only the server can make: Markdown its renderer cannot render is refused.
export const PostBody = PostFields.extend({ markdown: PostFields.shape.markdown.superRefine(refuseUnrenderable) });
export const PreviewBody = PostPreviewBody.extend({
  markdown: PostPreviewBody.shape.markdown.superRefine(refuseUnrenderable),
});
