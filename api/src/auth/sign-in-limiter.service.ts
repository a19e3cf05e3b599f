import { EntityManager } from '@mikro-orm/mariadb';
import { HttpException, HttpStatus, Inject, Injectable } from '@nestjs/common';
import { authConfig, type AuthConfig } from '../config/app.config';
import { SignInFailure } from './sign-in-attempt.entity';

/**
 * Counts failed sign-ins in MariaDB, per account and per address, over a sliding window, so
 * every api instance sees the same counts. Members at a meeting share one address, hence the
 * looser address limit.
 */
@Injectable()
export class SignInLimiter {
  constructor(
    private readonly em: EntityManager,
    @Inject(authConfig.KEY) private readonly config: AuthConfig,
  ) {}

  async assertAllowed(email: string, address: string): Promise<void> {
    const since = new Date(Date.now() - this.config.failureWindowMinutes * 60_000);
    const em = this.em.fork();
    const [byAccount, byAddress] = await Promise.all([
      em.count(SignInFailure, { email, createdAt: { $gt: since } }),
      em.count(SignInFailure, { address, createdAt: { $gt: since } }),
    ]);
    if (byAccount >= this.config.accountFailureLimit || byAddress >= this.config.addressFailureLimit) {
      throw new HttpException(
        {
          message: `Too many wrong passwords. Please wait ${this.config.failureWindowMinutes} minutes and try again, or reset your password.`,
        },
        HttpStatus.TOO_MANY_REQUESTS,
      );
    }
  }

  async recordFailure(email: string, address: string): Promise<void> {
    await this.em.fork().insert(SignInFailure, { email, address: address.slice(0, 64), createdAt: new Date() });
  }

  async purgeOlderThan(date: Date): Promise<number> {
    return this.em.fork().nativeDelete(SignInFailure, { createdAt: { $lt: date } });
  }
}
