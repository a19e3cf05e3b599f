import { Body, Controller, HttpCode, Post, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { CurrentMembership, CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { RosterImportDto, RosterInvitationsDto } from './dto/roster-import.dto';
import { RosterImportService } from './roster-import.service';
import { ROSTER_MULTER_OPTIONS, RosterUploadGate } from './roster-upload';

/** Moving a guild's spreadsheet in: preview, import, then invitations for the members with an e-mail. */
@ApiTags('roster import')
@Controller('guilds/:guildId/roster-import')
@Roles('admin', 'membership_chair')
export class RosterImportController {
  constructor(private readonly rosterImport: RosterImportService) {}

  @Post('preview')
  @HttpCode(200)
  @ApiConsumes('multipart/form-data', 'application/json')
  @UseInterceptors(RosterUploadGate, FileInterceptor('file', ROSTER_MULTER_OPTIONS))
  preview(@CurrentMembership() me: Membership, @Body() body: RosterImportDto, @UploadedFile() file: Express.Multer.File | undefined) {
    return this.rosterImport.preview(me, { dto: body, file });
  }

  @Post()
  @ApiConsumes('multipart/form-data', 'application/json')
  @UseInterceptors(RosterUploadGate, FileInterceptor('file', ROSTER_MULTER_OPTIONS))
  import(@CurrentMembership() me: Membership, @Body() body: RosterImportDto, @UploadedFile() file: Express.Multer.File | undefined) {
    return this.rosterImport.import(me, { dto: body, file });
  }

  @Post('invitations')
  @HttpCode(200)
  invite(@CurrentMembership() me: Membership, @CurrentUser() user: SessionUser, @Body() body: RosterInvitationsDto) {
    return this.rosterImport.invite(me, user, body.membershipIds);
  }
}
