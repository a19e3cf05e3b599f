/** Officer roles held on top of membership; every membership is a member. */
export const ROLES = ['admin', 'treasurer', 'membership_chair', 'show_chair'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  treasurer: 'Treasurer',
  membership_chair: 'Membership chair',
  show_chair: 'Show chair',
};

/** Officers who look after the roster see contact details; everyone else sees names. */
export const ROSTER_OFFICERS: readonly Role[] = ['admin', 'membership_chair'];

export function normaliseRoles(roles: readonly string[]): Role[] {
  const wanted = new Set(roles);
  return ROLES.filter((r) => wanted.has(r));
}

export function hasAnyRole(held: readonly string[], needed: readonly Role[]): boolean {
  if (needed.length === 0) return true;
  // An admin may do everything in the guild.
  if (held.includes('admin')) return true;
  return needed.some((r) => held.includes(r));
}

/** Would changing `target`'s roles to `next` leave the guild without an admin? */
export function leavesGuildWithoutAdmin(
  memberships: readonly { id: number; roles: readonly string[]; active: boolean }[],
  targetId: number,
  next: readonly string[],
): boolean {
  const admins = memberships.filter((m) => m.active && (m.id === targetId ? next : m.roles).includes('admin'));
  return admins.length === 0;
}
