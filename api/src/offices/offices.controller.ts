import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { CreateTermDto } from './dto/create-term.dto';
import { HandoverDto } from './dto/handover.dto';
import { UpdateTermDto } from './dto/update-term.dto';
import { OfficesService } from './offices.service';

/** Who holds each office and for how long. Every member may see her officers; admins record terms. */
@ApiTags('offices')
@Controller('guilds/:guildId/offices')
export class OfficesController {
  constructor(private readonly offices: OfficesService) {}

  @Get()
  list(@CurrentMembership() me: Membership) {
    return this.offices.offices(me);
  }

  @Get('history')
  history(@CurrentMembership() me: Membership) {
    return this.offices.history(me);
  }

  @Roles('admin')
  @Post('terms')
  create(@CurrentMembership() me: Membership, @Body() body: CreateTermDto) {
    return this.offices.createTerm(me, body);
  }

  @Roles('admin')
  @Patch('terms/:termId')
  update(
    @CurrentMembership() me: Membership,
    @Param('termId', new ParseIntPipe({ errorHttpStatusCode: 404 })) termId: number,
    @Body() body: UpdateTermDto,
  ) {
    return this.offices.updateTerm(me, termId, body);
  }

  @Roles('admin')
  @Post('handover')
  @HttpCode(200)
  handover(@CurrentMembership() me: Membership, @Body() body: HandoverDto) {
    return this.offices.handover(me, body);
  }
}
