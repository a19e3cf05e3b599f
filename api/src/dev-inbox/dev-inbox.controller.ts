import { Controller, Get, Inject, NotFoundException, Param, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { Public } from '../common/decorators/public.decorator';
import { mailConfig, type MailConfig } from '../config/app.config';

/**
 * Reads the local SMTP fake's inbox so developers and tests can follow links in e-mails.
 * Exists only where SMTP_FAKE_INBOX_URL is set; with a real mail service it answers 404.
 */
@ApiTags('development')
@Controller()
export class DevInboxController {
  constructor(@Inject(mailConfig.KEY) private readonly mail: MailConfig) {}

  @Public()
  @Get('meta')
  meta() {
    return { devInbox: Boolean(this.mail.fakeInboxUrl) };
  }

  private async fetchInbox(path: string): Promise<unknown> {
    if (!this.mail.fakeInboxUrl) throw new NotFoundException('The development inbox is not configured here.');
    const res = await fetch(new URL(path, this.mail.fakeInboxUrl), { signal: AbortSignal.timeout(5000) }).catch(() => null);
    if (!res) throw new NotFoundException('The local SMTP fake is not answering.');
    if (res.status === 404) throw new NotFoundException('No such message.');
    return res.json();
  }

  @Public()
  @Get('dev/inbox')
  list(@Query('to') to?: string) {
    const q = typeof to === 'string' && to ? `?to=${encodeURIComponent(to.slice(0, 254))}` : '';
    return this.fetchInbox(`/messages${q}`);
  }

  @Public()
  @Get('dev/inbox/:id')
  show(@Param('id') id: string) {
    if (!/^[A-Za-z0-9_-]{1,64}$/.test(id)) throw new NotFoundException('No such message.');
    return this.fetchInbox(`/messages/${id}`);
  }
}
