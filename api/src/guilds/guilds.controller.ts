import { Body, Controller, Get, Param, ParseIntPipe, Patch } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { UpdateRolesDto } from './dto/update-roles.dto';
import { GuildsService } from './guilds.service';
import { Membership } from './membership.entity';

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
    return this.guilds.updateRoles(me, membershipId, body.roles);
  }
}
