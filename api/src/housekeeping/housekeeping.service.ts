import { MikroORM } from '@mikro-orm/mariadb';
import { Injectable, Logger } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { PasswordReset } from '../auth/password-reset.entity';
import { SignInFailure } from '../auth/sign-in-attempt.entity';
import { withNamedLock } from '../database/named-lock';

/** Hourly tidy-up of rows that only matter for a short while. */
@Injectable()
export class HousekeepingService {
  private readonly logger = new Logger(HousekeepingService.name);

  constructor(private readonly orm: MikroORM) {}

  @Cron(CronExpression.EVERY_HOUR)
  async hourly(): Promise<void> {
    await withNamedLock(this.orm, 'selvage.housekeeping', async () => {
      const em = this.orm.em.fork();
      const dayAgo = new Date(Date.now() - 24 * 60 * 60 * 1000);
      const failures = await em.nativeDelete(SignInFailure, { createdAt: { $lt: dayAgo } });
      const resets = await em.nativeDelete(PasswordReset, { expiresAt: { $lt: dayAgo } });
      if (failures || resets) this.logger.log(`removed ${failures} old sign-in failures and ${resets} old reset links`);
    });
  }
}
