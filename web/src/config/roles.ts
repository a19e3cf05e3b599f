export const ROLES = ['admin', 'treasurer', 'membership_chair', 'show_chair'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  treasurer: 'Treasurer',
  membership_chair: 'Membership chair',
  show_chair: 'Show chair',
};

export const ROLE_OPTIONS = ROLES.map((value) => ({ value, label: ROLE_LABELS[value] }));

export function roleLabel(role: string): string {
  return ROLE_LABELS[role as Role] ?? role.replace(/_/g, ' ').replace(/^\w/, (c) => c.toUpperCase());
}

export const OFFICER_INVITE_ROLES: readonly Role[] = ['admin', 'membership_chair'];

/** Who keeps the dues books: ledger, roster, refunds, settings and plans. */
export const DUES_OFFICER_ROLES: readonly Role[] = ['admin', 'treasurer'];

export const isDuesOfficer = (roles: readonly string[] | undefined) => Boolean(roles?.some((r) => DUES_OFFICER_ROLES.includes(r as Role)));

export function statusLabel(status: string | null | undefined): string {
  if (!status) return '';
  const s = status.replace(/_/g, ' ');
  return s.charAt(0).toUpperCase() + s.slice(1);
}
