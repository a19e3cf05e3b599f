import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/mariadb';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { OfficeTerm } from './office-term.entity';
import { sameRoles, syncedRoles, type RoleTerm } from './terms';

/**
 * `memberships.roles` holds the roles in force today, so every reader of it keeps working; the
 * terms in `office_terms` are the record it follows. These functions bring the first in line with
 * the second.
 */

/**
 * Inside a transaction: locks the guild's memberships, records an open term from `today` for any role
 * someone holds without a term (granted by an older code path), and rewrites the roles of everyone
 * whose roles in force on `today` differ. Returns the memberships (locked, with their users) and
 * the guild's terms after the change. Callers that change terms call it again afterwards.
 */
export async function syncGuildTerms(em: EntityManager, guild: Guild | number, today: string) {
  const guildId = typeof guild === 'number' ? guild : guild.id;
  const memberships = await em.find(Membership, { guild: guildId }, { lockMode: LockMode.PESSIMISTIC_WRITE, populate: ['user'], orderBy: { id: 'asc' } });
  let terms = await em.find(OfficeTerm, { guild: guildId }, { orderBy: { id: 'asc' }, lockMode: LockMode.PESSIMISTIC_WRITE });
  const byMember = groupTerms(terms);
  let added = false;
  for (const m of memberships) {
    const { roles, untracked } = syncedRoles(m.roles, byMember.get(m.id) ?? [], today);
    if (m.status === 'active')
      for (const role of untracked) {
        em.create(OfficeTerm, { guild: guildId, membership: m, role, startsOn: today, note: 'Recorded from the roles list' });
        added = true;
      }
    // Someone who left keeps no office that starts after she went: her roles can only shrink.
    const next = m.status === 'active' ? roles : roles.filter((r) => m.roles.includes(r));
    if (!sameRoles(m.roles, next)) m.roles = next;
  }
  await em.flush();
  if (added) terms = await em.find(OfficeTerm, { guild: guildId }, { orderBy: { id: 'asc' } });
  return { memberships, terms };
}

/** Would syncGuildTerms change anything on `today`? Read without locks, to spare readers the transaction. */
export function guildOutOfSync(memberships: readonly Membership[], terms: readonly OfficeTerm[], today: string): boolean {
  const byMember = groupTerms(terms);
  return memberships.some((m) => {
    const { roles, untracked } = syncedRoles(m.roles, byMember.get(m.id) ?? [], today);
    if (m.status !== 'active') return !sameRoles(m.roles, roles.filter((r) => m.roles.includes(r)));
    return untracked.length > 0 || !sameRoles(m.roles, roles);
  });
}

export function groupTerms(terms: readonly OfficeTerm[]): Map<number, RoleTerm[]> {
  const map = new Map<number, RoleTerm[]>();
  for (const t of terms) {
    const id = t.membership.id;
    if (!map.has(id)) map.set(id, []);
    map.get(id)!.push(t);
  }
  return map;
}

/**
 * For the access guard: one indexed read of her terms; only when her stored roles are out of date
 * (a term began or ended since the last sync) does it take her row's lock and rewrite them.
 * Returns her roles in force on `today`.
 */
export async function syncOneMembership(em: EntityManager, membership: Membership, today: string): Promise<Membership['roles']> {
  const rows = await em
    .getConnection()
    .execute<{ role: string; startsOn: string; endsOn: string | null }[]>(
      "SELECT role, DATE_FORMAT(starts_on, '%Y-%m-%d') AS startsOn, DATE_FORMAT(ends_on, '%Y-%m-%d') AS endsOn FROM office_terms WHERE membership_id = ?",
      [membership.id],
    );
  const { roles, untracked } = syncedRoles(membership.roles, rows, today);
  if (untracked.length === 0 && sameRoles(membership.roles, roles)) return membership.roles;
  return em.fork().transactional(async (tx) => {
    const locked = await tx.findOneOrFail(Membership, membership.id, { lockMode: LockMode.PESSIMISTIC_WRITE });
    const terms = await tx.find(OfficeTerm, { membership: membership.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    const now = syncedRoles(locked.roles, terms, today);
    if (locked.status === 'active')
      for (const role of now.untracked)
        tx.create(OfficeTerm, { guild: locked.guild, membership: locked, role, startsOn: today, note: 'Recorded from the roles list' });
    if (!sameRoles(locked.roles, now.roles)) locked.roles = now.roles;
    await tx.flush();
    return now.roles;
  });
}
