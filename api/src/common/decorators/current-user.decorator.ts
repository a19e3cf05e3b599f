import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import type { Membership } from '../../guilds/membership.entity';
import type { SessionUser } from '../../auth/session-user';

export const CurrentUser = createParamDecorator(
  (_: unknown, ctx: ExecutionContext): SessionUser => ctx.switchToHttp().getRequest<Request>().user as SessionUser,
);

/** The caller's membership in the route's guild, loaded by GuildAccessGuard. */
export const CurrentMembership = createParamDecorator(
  (_: unknown, ctx: ExecutionContext): Membership =>
    (ctx.switchToHttp().getRequest<Request>() as Request & { membership: Membership }).membership,
);
