import { Body, Controller, Get, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { CurrentMembership, CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { CreateGuildDto } from './dto/create-guild.dto';
import { UpdateRolesDto } from './dto/update-roles.dto';
import { GuildsService } from './guilds.service';
import { Membership } from './membership.entity';

/** Starting a guild: anyone signed in, who becomes its first admin. */
@ApiTags('guilds')
@Controller('guilds')
export class NewGuildController {
  constructor(private readonly guilds: GuildsService) {}

  @Post()
  create(@CurrentUser() user: SessionUser, @Body() body: CreateGuildDto) {
    return this.guilds.create(user.id, body);
  }
}

@ApiTags('guilds')
@Controller('guilds/:guildId')
export class GuildsController {
  constructor(private readonly guilds: GuildsService) {}

  @Get()
  show(@CurrentMembership() me: Membership) {
    const g = me.guild;
    return {
      id: g.id,
      name: g.name,
      town: g.town,
      timeZone: g.timeZone,
      currency: g.currency,
      unit: g.unit,
      yearStartMonth: g.yearStartMonth,
      myRoles: me.roles,
      myMembershipId: me.id,
    };
  }

  @Get('members')
  members(@CurrentMembership() me: Membership) {
    return this.guilds.listMembers(me);
  }

  @Roles('admin')
  @Patch('members/:membershipId/roles')
  updateRoles(
    @CurrentMembership() me: Membership,
    @Param('membershipId', new ParseIntPipe({ errorHttpStatusCode: 404 })) membershipId: number,
    @Body() body: UpdateRolesDto,
  ) {
    return this.guilds.updateRoles(me, membershipId, body.roles, body.endsOn);
  }
}
