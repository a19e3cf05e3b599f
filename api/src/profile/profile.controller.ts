import { Body, Controller, Get, HttpCode, Patch, Post, Put, Req } from '@nestjs/common';
import type { Request } from 'express';
import { ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ChangeEmailDto, ChangePasswordDto, DirectoryDetailsDto, UpdateProfileDto } from './dto/profile.dto';
import { ProfileService } from './profile.service';

@ApiTags('profile')
@Controller('profile')
export class ProfileController {
  constructor(private readonly profile: ProfileService) {}

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
