import { Body, Controller, Get, Param, ParseIntPipe, Patch, Post, Query, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { CreatePaperMemberDto, RosterPdfQueryDto, UpdateMemberDetailsDto } from './dto/paper-member.dto';
import { MembersService } from './members.service';
import { Membership } from './membership.entity';

/** Members kept by the officers on their behalf, and the printed roster (members only). */
@ApiTags('guilds')
@Controller('guilds/:guildId')
export class MembersController {
  constructor(private readonly members: MembersService) {}

  @Roles('admin', 'membership_chair')
  @Post('members')
  add(@CurrentMembership() me: Membership, @Body() body: CreatePaperMemberDto) {
    return this.members.addOnBehalf(me, body);
  }

  @Roles('admin', 'membership_chair')
  @Patch('members/:membershipId/details')
  updateDetails(
    @CurrentMembership() me: Membership,
    @Param('membershipId', new ParseIntPipe({ errorHttpStatusCode: 404 })) membershipId: number,
    @Body() body: UpdateMemberDetailsDto,
  ) {
    return this.members.updateDetails(me, membershipId, body);
  }

  @Get('roster.pdf')
  async rosterPdf(@CurrentMembership() me: Membership, @Query() query: RosterPdfQueryDto, @Res() res: Response) {
    const { filename, pdf } = await this.members.rosterPdf(me, query.paper);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  }
}
