import { DateTime } from 'luxon';
import { normaliseRoles, ROLES, type Role } from '../guilds/roles';

/**
 * Offices held for a while. A term runs from `startsOn` (included) to `endsOn` (excluded): her
 * access ends ON the end date. `endsOn` null means no end yet. Dates are "YYYY-MM-DD" in the guild's
 * time zone, so plain string comparison orders them.
 */
export interface TermSpan {
  startsOn: string;
  endsOn: string | null;
}

export interface RoleTerm extends TermSpan {
  role: string;
}

const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** A real calendar date written as YYYY-MM-DD (2026-02-30 is not one). */
export function isIsoDate(value: unknown): value is string {
  return typeof value === 'string' && DATE.test(value) && DateTime.fromISO(value, { zone: 'utc' }).isValid;
}

/** Does the term give her the office on `day`? */
export function termCovers(term: TermSpan, day: string): boolean {
  return term.startsOn <= day && (term.endsOn === null || day < term.endsOn);
}

/** The roles her terms give her on `today`, in the fixed role order. */
export function rolesInForce(terms: readonly RoleTerm[], today: string): Role[] {
  return normaliseRoles(terms.filter((t) => termCovers(t, today)).map((t) => t.role));
}

/**
 * What `memberships.roles` should say today. A role granted without any term record (by an older
 * code path or a script) is kept and listed in `untracked`, so the caller can record an open term
 * for it; every role that has terms follows them.
 */
export function syncedRoles(current: readonly string[], terms: readonly RoleTerm[], today: string): { roles: Role[]; untracked: Role[] } {
  const tracked = new Set(terms.map((t) => t.role));
  const untracked = normaliseRoles(current).filter((r) => !tracked.has(r));
  return { roles: normaliseRoles([...rolesInForce(terms, today), ...untracked]), untracked };
}

export function sameRoles(a: readonly string[], b: readonly string[]): boolean {
  const x = normaliseRoles(a);
  const y = normaliseRoles(b);
  return x.length === y.length && x.every((r, i) => r === y[i]);
}

/** Do two terms share at least one day? */
export function termsOverlap(a: TermSpan, b: TermSpan): boolean {
  const aBeforeB = a.endsOn !== null && a.endsOn <= b.startsOn;
  const bBeforeA = b.endsOn !== null && b.endsOn <= a.startsOn;
  return !aBeforeB && !bBeforeA;
}

/**
 * The first day on or after `from` when none of `adminTerms` covers, or null when some admin term
 * covers every day from `from` on. Coverage can only drop on a term's end date, so only `from` and
 * the end dates after it need checking.
 */
export function firstDayWithoutCover(adminTerms: readonly TermSpan[], from: string): string | null {
  const days = [from, ...adminTerms.map((t) => t.endsOn).filter((d): d is string => d !== null && d > from)].sort();
  for (const day of days) if (!adminTerms.some((t) => termCovers(t, day))) return day;
  return null;
}

/**
 * Does a change to the admin terms leave the guild without an admin on a day it had one? A gap that
 * was already there (say every admin term ends next year) only counts when the change brings it closer.
 */
export function changeLeavesNoAdmin(before: readonly TermSpan[], after: readonly TermSpan[], from: string): string | null {
  const gapAfter = firstDayWithoutCover(after, from);
  if (gapAfter === null) return null;
  const gapBefore = firstDayWithoutCover(before, from);
  return gapBefore === null || gapAfter < gapBefore ? gapAfter : null;
}

export const isRole = (value: unknown): value is Role => typeof value === 'string' && (ROLES as readonly string[]).includes(value);
