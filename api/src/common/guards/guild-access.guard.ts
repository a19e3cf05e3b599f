import { EntityManager } from '@mikro-orm/mariadb';
import { CanActivate, ExecutionContext, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { Membership } from '../../guilds/membership.entity';
import { hasAnyRole, ROLE_LABELS, type Role } from '../../guilds/roles';
import { todayIn } from '../../dues/dues-rules';
import { syncOneMembership } from '../../offices/office-sync';
import { REQUIRED_ROLES } from '../decorators/roles.decorator';

/**
 * For routes under /api/guilds/:guildId: the caller must be an active member of that guild
 * (otherwise 404, so outsiders cannot even learn the guild exists) and hold one of the @Roles
 * (otherwise 403).
 */
@Injectable()
export class GuildAccessGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly em: EntityManager,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request & { membership?: Membership }>();
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(REQUIRED_ROLES, [
      context.getHandler(),
      context.getClass(),
    ]);
    const rawGuildId = req.params?.guildId as string | undefined;
    if (rawGuildId === undefined) {
      if (roles?.length) throw new Error('@Roles() used on a route without :guildId');
      return true;
    }
    if (!req.user) return true; // AuthenticatedGuard already let a public route through
    const guildId = /^\d{1,9}$/.test(rawGuildId) ? Number(rawGuildId) : NaN;
    const membership = Number.isFinite(guildId)
      ? await this.em.findOne(
          Membership,
          { guild: guildId, user: req.user.id, status: 'active' },
          { populate: ['guild'] },
        )
      : null;
    if (!membership) throw new NotFoundException('No such guild, or you are not a member of it.');
    // Her roles in force today (a term may have begun or ended since the last sync): one indexed read.
    const inForce = await syncOneMembership(this.em, membership, todayIn(membership.guild.timeZone));
    if (inForce !== membership.roles) await this.em.refresh(membership);
    if (roles?.length && !hasAnyRole(membership.roles, roles)) {
      const needed = roles.map((r) => ROLE_LABELS[r]).join(' or ');
      throw new ForbiddenException(`Only the guild's ${needed} can do this.`);
    }
    req.membership = membership;
    return true;
  }
}
