export const ROLES = ['member', 'moderator', 'admin'] as const;
export type Role = (typeof ROLES)[number];

const rank: Record<Role, number> = { member: 0, moderator: 1, admin: 2 };

/** True when the viewer's role is at least `role` (an admin may do what a moderator may). */
export function hasRole(viewer: { role: Role }, role: Role): boolean {
  return rank[viewer.role] >= rank[role];
}

type Person = { id: string; role: Role };

/**
 * Who may suspend whom, everywhere (the member API, the moderation queue and its buttons):
 * moderators suspend members, admins suspend members and moderators, nobody suspends an admin
 * (an admin is first made a moderator by another admin) and nobody suspends themselves.
 * Returns why not, or null when `actor` may.
 */
export function suspensionRefusal(actor: Person, target: Person): string | null {
  if (!hasRole(actor, 'moderator')) return 'Only moderators can suspend members.';
  if (actor.id === target.id) return 'You cannot suspend yourself.';
  if (target.role === 'admin') return 'An admin cannot be suspended.';
  if (target.role === 'moderator' && !hasRole(actor, 'admin')) return 'Only an admin can suspend a moderator.';
  return null;
}

export function canSuspend(actor: Person, target: Person): boolean {
  return suspensionRefusal(actor, target) === null;
}
