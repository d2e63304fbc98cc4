/** The roles a Padside account can hold (the `users.roles` codes). */
export const ROLES = ['fan', 'member', 'sponsor', 'editor', 'treasurer', 'admin', 'range_officer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  fan: 'Fan',
  member: 'Member',
  sponsor: 'Sponsor',
  editor: 'Editor',
  treasurer: 'Treasurer',
  admin: 'Admin',
  range_officer: 'Range officer',
};
