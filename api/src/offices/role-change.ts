import type { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, NotFoundException } from '@nestjs/common';
import { formatDate, todayIn } from '../dues/dues-rules';
import type { Guild } from '../guilds/guild.entity';
import type { Membership } from '../guilds/membership.entity';
import { normaliseRoles, ROLE_LABELS, type Role } from '../guilds/roles';
import { syncGuildTerms } from './office-sync';
import { OfficeTerm } from './office-term.entity';
import { changeLeavesNoAdmin, termCovers, termsOverlap } from './terms';

/**
 * The members page's roles list, in terms: a role added opens a term from today (until `endsOn`
 * when given: her access ends on that day), a role taken away ends its term today (access ends now).
 * Runs inside the caller's transaction; returns the member with her roles in force today.
 */
export async function changeRoles(em: EntityManager, viewer: Membership, membershipId: number, wanted: readonly Role[], endsOn?: string | null): Promise<Membership> {
  const today = todayIn(viewer.guild.timeZone);
  if (endsOn && endsOn <= today)
    throw new BadRequestException({
      message: 'Please check the highlighted fields.',
      errors: { endsOn: [`Choose a day after today (${formatDate(today)}), or leave it empty.`] },
    });
  const { memberships, terms } = await syncGuildTerms(em, viewer.guild.id, today);
  const target = memberships.find((m) => m.id === membershipId);
  if (!target) throw new NotFoundException('That member is not in this guild.');
  const next = normaliseRoles(wanted);
  const added = next.filter((r) => !target.roles.includes(r));
  const removed = target.roles.filter((r) => !next.includes(r));
  const ending = terms.filter((t) => t.membership.id === target.id && removed.includes(t.role) && termCovers(t, today));

  if (removed.includes('admin')) {
    const active = new Set(memberships.filter((m) => m.status === 'active').map((m) => m.id));
    const admin = terms.filter((t) => t.role === 'admin' && active.has(t.membership.id));
    const after = admin.map((t) => (ending.includes(t) ? { startsOn: t.startsOn, endsOn: today } : t));
    if (changeLeavesNoAdmin(admin, after, today))
      throw new ConflictException('A guild must keep at least one admin. Make someone else admin first.');
  }
  for (const role of added) {
    const candidate = { startsOn: today, endsOn: endsOn ?? null };
    const clash = terms.find((t) => t.membership.id === target.id && t.role === role && termsOverlap(t, candidate));
    if (clash)
      throw new ConflictException(
        `${target.user.name} is already due to be ${ROLE_LABELS[role]} from ${formatDate(clash.startsOn)}. Change that term on the Officers page instead.`,
      );
  }
  for (const t of ending) t.endsOn = today;
  for (const role of added)
    em.create(OfficeTerm, { guild: viewer.guild.id, membership: target, role, startsOn: today, endsOn: endsOn ?? null, recordedBy: viewer.id });
  await em.flush();
  await syncGuildTerms(em, viewer.guild.id, today);
  return target;
}

/** A new guild's founder holds the admin office from the day she starts it. */
export function recordFounder(em: EntityManager, guild: Guild, membership: Membership): void {
  em.create(OfficeTerm, { guild, membership, role: 'admin', startsOn: todayIn(guild.timeZone), recordedBy: membership });
}
