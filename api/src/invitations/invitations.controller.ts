import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Req } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Request } from 'express';
import { startSession } from '../auth/start-session';
import type { SessionUser } from '../auth/session-user';
import { CurrentMembership, CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { AcceptInvitationDto } from './dto/accept-invitation.dto';
import { CreateInvitationDto } from './dto/create-invitation.dto';
import { InvitationsService } from './invitations.service';

@ApiTags('invitations')
@Controller('guilds/:guildId/invitations')
export class GuildInvitationsController {
  constructor(private readonly invitations: InvitationsService) {}

  @Roles('admin', 'membership_chair')
  @Get()
  list(@CurrentMembership() me: Membership) {
    return this.invitations.listPending(me.guild);
  }

  @Roles('admin', 'membership_chair')
  @Post()
  create(@CurrentMembership() me: Membership, @CurrentUser() user: SessionUser, @Body() body: CreateInvitationDto) {
    return this.invitations.invite(me, user, body.email, body.roles);
  }

  @Roles('admin', 'membership_chair')
  @Delete(':invitationId')
  @HttpCode(204)
  async revoke(
    @CurrentMembership() me: Membership,
    @Param('invitationId', new ParseIntPipe({ errorHttpStatusCode: 404 })) invitationId: number,
  ): Promise<void> {
    await this.invitations.revoke(me.guild, invitationId);
  }
}

@ApiTags('invitations')
@Controller('invitations/:token')
export class InvitationLinksController {
  constructor(private readonly invitations: InvitationsService) {}

  @Public()
  @Get()
  describe(@Param('token') token: string) {
    return this.invitations.describe(token.slice(0, 100));
  }

  @Public()
  @Post('accept')
  @HttpCode(200)
  async accept(@Param('token') token: string, @Body() body: AcceptInvitationDto, @Req() req: Request) {
    const result = await this.invitations.accept(token.slice(0, 100), req.user, body);
    if (result.created) await startSession(req, result.user);
    return { user: result.user, guildId: result.guildId };
  }
}
