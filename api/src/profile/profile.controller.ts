import { Body, Controller, Get, HttpCode, Patch, Post, Put, Req, Res } from '@nestjs/common';
import type { Request, Response } from 'express';
import { ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ChangeEmailDto, ChangePasswordDto, DirectoryDetailsDto, UpdateProfileDto } from './dto/profile.dto';
import { DataExportService } from './data-export.service';
import { ProfileService } from './profile.service';

@ApiTags('profile')
@Controller('profile')
export class ProfileController {
  constructor(
    private readonly profile: ProfileService,
    private readonly exports: DataExportService,
  ) {}

  /** Everything Selvage holds about her, as JSON. */
  @Get('export.json')
  async exportJson(@CurrentUser() user: SessionUser, @Res() res: Response) {
    res.setHeader('Content-Disposition', 'attachment; filename="selvage-my-data.json"');
    res.setHeader('Cache-Control', 'private, no-store');
    res.json(await this.exports.collect(user.id));
  }

  /** The same, as a readable PDF. */
  @Get('export.pdf')
  async exportPdf(@CurrentUser() user: SessionUser, @Res() res: Response) {
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', 'attachment; filename="selvage-my-data.pdf"');
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(await this.exports.pdf(user.id));
  }

  @Get()
  get(@CurrentUser() user: SessionUser) {
    return this.profile.get(user.id);
  }

  @Patch()
  update(@CurrentUser() user: SessionUser, @Body() body: UpdateProfileDto) {
    return this.profile.rename(user.id, body.name);
  }

  @Get('directory')
  directory(@CurrentUser() user: SessionUser) {
    return this.profile.directory(user.id);
  }

  @Put('directory')
  setDirectory(@CurrentUser() user: SessionUser, @Body() body: DirectoryDetailsDto) {
    return this.profile.setDirectory(user.id, body);
  }

  @Post('email')
  @HttpCode(200)
  changeEmail(@CurrentUser() user: SessionUser, @Body() body: ChangeEmailDto) {
    return this.profile.changeEmail(user.id, body.email, body.currentPassword);
  }

  @Post('password')
  @HttpCode(200)
  async changePassword(@CurrentUser() user: SessionUser, @Body() body: ChangePasswordDto, @Req() req: Request) {
    await this.profile.changePassword(user.id, body.currentPassword, body.newPassword, req.sessionID);
    return { message: 'Your password is changed.' };
  }
}
