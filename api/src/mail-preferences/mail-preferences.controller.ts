import { BadRequestException, Body, Controller, Get, HttpCode, Inject, Post, Put, Query } from '@nestjs/common';
import { EntityManager } from '@mikro-orm/mariadb';
import { ApiTags } from '@nestjs/swagger';
import { IsBoolean } from 'class-validator';
import { ApiProperty } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { SkipOriginCheck } from '../common/decorators/skip-origin-check.decorator';
import { appConfig, type AppConfig } from '../config/app.config';
import { User } from '../users/user.entity';
import { isUnsubscribeToken } from './unsubscribe-token';

export class MailPreferencesDto {
  @ApiProperty({ description: 'false: no reminder e-mails (receipts, invitations, resets and bee assignments still come)' })
  @IsBoolean({ message: 'Say whether you want reminder e-mails.' })
  reminders!: boolean;
}

const BAD_LINK = 'This unsubscribe link is not valid: it may have been cut short or changed. Sign in and choose your e-mails on your profile page instead.';

@ApiTags('mail preferences')
@Controller()
export class MailPreferencesController {
  constructor(
    private readonly em: EntityManager,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  @Get('profile/mail-preferences')
  async get(@CurrentUser() user: SessionUser) {
    const u = await this.em.findOneOrFail(User, { id: user.id });
    return { reminders: !u.remindersOff };
  }

  @Put('profile/mail-preferences')
  async put(@CurrentUser() user: SessionUser, @Body() body: MailPreferencesDto) {
    const u = await this.em.findOneOrFail(User, { id: user.id });
    u.remindersOff = !body.reminders;
    await this.em.flush();
    return { reminders: !u.remindersOff };
  }

  private async fromLink(u: unknown, t: unknown): Promise<User> {
    const id = typeof u === 'string' && /^\d{1,9}$/.test(u) ? Number(u) : NaN;
    if (!isUnsubscribeToken(this.app.sessionSecret, id, t)) throw new BadRequestException(BAD_LINK);
    const user = await this.em.findOne(User, { id });
    if (!user) throw new BadRequestException(BAD_LINK);
    return user;
  }

  /** What the unsubscribe page shows before she presses the button. */
  @Public()
  @Get('unsubscribe')
  async check(@Query('u') u: unknown, @Query('t') t: unknown) {
    const user = await this.fromLink(u, t);
    return { remindersOff: user.remindersOff };
  }

  /** The page's button, and mail programs' one-click unsubscribe (RFC 8058), which carry no session or Origin. */
  @Public()
  @SkipOriginCheck()
  @Post('unsubscribe')
  @HttpCode(200)
  async unsubscribe(@Query('u') u: unknown, @Query('t') t: unknown) {
    const user = await this.fromLink(u, t);
    user.remindersOff = true;
    await this.em.flush();
    return { remindersOff: true };
  }
}
