import { EntityManager } from '@mikro-orm/mariadb';
import { ConflictException, Injectable } from '@nestjs/common';
import { CreateGuildDto } from './dto/create-guild.dto';
import { Guild } from './guild.entity';
import { Membership } from './membership.entity';
import { ROSTER_OFFICERS, hasAnyRole, type Role } from './roles';
import { changeRoles, recordFounder } from '../offices/role-change';

export interface MemberRow {
  membershipId: number;
  name: string;
  roles: Role[];
  /** Null for a member kept on paper (no e-mail address). */
  email?: string | null;
  /** Roster officers only: false until she has chosen a password (added by hand or imported). */
  signsIn?: boolean;
  /** Roster officers only: what she (or they, for a member kept on paper) chose to show other members. */
  showEmail?: boolean;
  showPhone?: boolean;
  showTown?: boolean;
  phone?: string | null;
  town?: string | null;
  status?: string;
  joinedAt?: Date;
  /** Roster officers only: when she left, whether she asked to be erased, and whether she was. */
  leftAt?: Date | null;
  eraseRequestedAt?: Date | null;
  erased?: boolean;
}

@Injectable()
export class GuildsService {
  constructor(private readonly em: EntityManager) {}

  /**
   * A new guild with its creator as admin, in one transaction. At most 5 new guilds per person a day,
   * so a script cannot fill the database with empty guilds.
   */
  async create(userId: number, dto: CreateGuildDto) {
    return this.em.transactional(async (em) => {
      const rows: { n: number }[] = await em.execute(
        "SELECT COUNT(*) AS n FROM memberships WHERE user_id = ? AND created_at > ? AND JSON_CONTAINS(roles, '\"admin\"')",
        [userId, new Date(Date.now() - 24 * 3600 * 1000)],
      );
      if (Number(rows[0].n) >= 5) throw new ConflictException('You have started 5 guilds today. Please try again tomorrow.');
      const guild = em.create(Guild, {
        name: dto.name.trim(),
        town: dto.town.trim(),
        timeZone: dto.timeZone,
        currency: dto.currency,
        unit: dto.unit,
        yearStartMonth: dto.yearStartMonth,
      });
      const membership = em.create(Membership, { user: userId, guild, roles: ['admin'] });
      recordFounder(em, guild, membership);
      await em.flush();
      return { id: guild.id, name: guild.name, town: guild.town, timeZone: guild.timeZone, currency: guild.currency, unit: guild.unit, yearStartMonth: guild.yearStartMonth, myRoles: membership.roles, myMembershipId: membership.id };
    });
  }

  async listMembers(viewer: Membership): Promise<MemberRow[]> {
    const officer = hasAnyRole(viewer.roles, ROSTER_OFFICERS);
    const memberships = await this.em.find(
      Membership,
      officer ? { guild: viewer.guild } : { guild: viewer.guild, status: 'active' },
      { populate: officer ? ['user', 'user.passwordHash'] : ['user'], orderBy: { user: { name: 'asc' } } },
    );
    return memberships.map((m) => {
      const u = m.user;
      const row: MemberRow = { membershipId: m.id, name: u.name, roles: m.roles };
      // Officers who keep the roster see every contact detail; other members see what each chose to show.
      if (officer)
        Object.assign(row, { email: u.email, phone: u.phone ?? null, town: u.town ?? null, status: m.status, joinedAt: m.joinedAt, signsIn: Boolean(u.passwordHash), showEmail: u.showEmail, showPhone: u.showPhone, showTown: u.showTown, leftAt: m.leftAt ?? null, eraseRequestedAt: m.eraseRequestedAt ?? null, erased: Boolean(u.erasedAt) });
      else {
        if (u.showEmail && u.email) row.email = u.email;
        if (u.showPhone && u.phone) row.phone = u.phone;
        if (u.showTown && u.town) row.town = u.town;
      }
      return row;
    });
  }

  /** Roles are offices with terms (offices/role-change.ts): added ones start today, removed ones end today. */
  async updateRoles(viewer: Membership, membershipId: number, roles: Role[], endsOn?: string | null): Promise<MemberRow> {
    return this.em.transactional(async (em) => {
      // changeRoles locks the guild's memberships, so two admins demoting each other cannot both succeed.
      const target = await changeRoles(em as EntityManager, viewer, membershipId, roles, endsOn);
      return {
        membershipId: target.id,
        name: target.user.name,
        roles: target.roles,
        email: target.user.email,
        status: target.status,
        joinedAt: target.joinedAt,
      };
    });
  }
}
