import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { Membership } from './membership.entity';
import { leavesGuildWithoutAdmin, normaliseRoles, ROSTER_OFFICERS, hasAnyRole, type Role } from './roles';

export interface MemberRow {
  membershipId: number;
  name: string;
  roles: Role[];
  email?: string;
  status?: string;
  joinedAt?: Date;
}

@Injectable()
export class GuildsService {
  constructor(private readonly em: EntityManager) {}

  async listMembers(viewer: Membership): Promise<MemberRow[]> {
    const officer = hasAnyRole(viewer.roles, ROSTER_OFFICERS);
    const memberships = await this.em.find(
      Membership,
      officer ? { guild: viewer.guild } : { guild: viewer.guild, status: 'active' },
      { populate: ['user'], orderBy: { user: { name: 'asc' } } },
    );
    return memberships.map((m) => {
      const row: MemberRow = { membershipId: m.id, name: m.user.name, roles: m.roles };
      if (officer) Object.assign(row, { email: m.user.email, status: m.status, joinedAt: m.joinedAt });
      return row;
    });
  }

  async updateRoles(viewer: Membership, membershipId: number, roles: Role[]): Promise<MemberRow> {
    const next = normaliseRoles(roles);
    return this.em.transactional(async (em) => {
      // Lock the guild's memberships so two admins demoting each other cannot both succeed.
      const all = await em.find(Membership, { guild: viewer.guild }, { lockMode: LockMode.PESSIMISTIC_WRITE, populate: ['user'] });
      const target = all.find((m) => m.id === membershipId);
      if (!target) throw new NotFoundException('That member is not in this guild.');
      const summary = all.map((m) => ({ id: m.id, roles: m.roles, active: m.status === 'active' }));
      if (leavesGuildWithoutAdmin(summary, target.id, next))
        throw new ConflictException('A guild must keep at least one admin. Make someone else admin first.');
      target.roles = next;
      await em.flush();
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
