import type { Role } from '@/config/roles';

/** Who runs a show: set it up, review entries, keep the ballot desk. */
export const SHOW_CHAIR_ROLES: readonly Role[] = ['admin', 'show_chair'];

export const isShowChair = (roles: readonly string[] | undefined) => Boolean(roles?.some((r) => SHOW_CHAIR_ROLES.includes(r as Role)));
