/** A build log's publishing state (the `posts.status` codes). */
export type PostStatus = 'draft' | 'scheduled' | 'published';

export const POST_STATUS_LABELS: Readonly<Record<PostStatus, string>> = {
  draft: 'Draft',
  scheduled: 'Scheduled',
  published: 'Published',
};

/** Who may read a post: everyone, or signed-in club members only (`posts.members_only`). */
export type PostVisibility = 'everyone' | 'members';

export const POST_VISIBILITY_LABELS: Readonly<Record<PostVisibility, string>> = {
  everyone: 'Everyone',
  members: 'Members only',
};

/** The visibility code of a post's `membersOnly` flag. */
export function postVisibility(membersOnly: boolean): PostVisibility {
  return membersOnly ? 'members' : 'everyone';
}
