export const ROLES = ['member', 'moderator', 'admin'] as const;
export type Role = (typeof ROLES)[number];

const rank: Record<Role, number> = { member: 0, moderator: 1, admin: 2 };

/** True when the viewer's role is at least `role` (an admin may do what a moderator may). */
export function hasRole(viewer: { role: Role }, role: Role): boolean {
  return rank[viewer.role] >= rank[role];
}
