import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { CurrentMembership, CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { DeparturesService } from './departures.service';
import { EraseMemberDto } from './dto/erase-member.dto';
import { LeaveGuildDto } from './dto/leave-guild.dto';

const memberId = new ParseIntPipe({ errorHttpStatusCode: 404 });

/** Leaving a guild, and erasing a departed member's personal data while the money records stay. */
@ApiTags('departures')
@Controller('guilds/:guildId')
export class DeparturesController {
  constructor(private readonly departures: DeparturesService) {}

  @Post('leave')
  @HttpCode(200)
  leave(@CurrentMembership() me: Membership, @Body() body: LeaveGuildDto) {
    return this.departures.leave(me, body.eraseRequest ?? false);
  }

  @Roles('admin', 'membership_chair')
  @Post('members/:membershipId/departure')
  @HttpCode(200)
  recordDeparture(@CurrentMembership() me: Membership, @Param('membershipId', memberId) membershipId: number) {
    return this.departures.recordDeparture(me, membershipId);
  }

  @Roles('admin')
  @Get('members/:membershipId/erasure')
  plan(@CurrentMembership() me: Membership, @Param('membershipId', memberId) membershipId: number) {
    return this.departures.plan(me, membershipId);
  }

  @Roles('admin')
  @Post('members/:membershipId/erasure')
  @HttpCode(200)
  erase(
    @CurrentMembership() me: Membership,
    @CurrentUser() user: SessionUser,
    @Param('membershipId', memberId) membershipId: number,
    @Body() _confirmed: EraseMemberDto,
  ) {
    return this.departures.erase(me, membershipId, user.name);
  }
}
