import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, Inject, Injectable } from '@nestjs/common';
import { appConfig, type AppConfig } from '../config/app.config';
import { OutboxService } from '../outbox/outbox.service';
import { endSessionsOf } from '../sessions/sessions';
import { User } from '../users/user.entity';
import { hashPassword, normaliseEmail } from './passwords';
import { PasswordReset } from './password-reset.entity';
import { hashToken, newToken } from './tokens';

const RESET_VALID_MS = 60 * 60 * 1000;

@Injectable()
export class AuthService {
  constructor(
    private readonly em: EntityManager,
    private readonly outbox: OutboxService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  /** Sends a reset link when the account exists; says nothing either way. */
  async requestPasswordReset(rawEmail: string): Promise<void> {
    const email = normaliseEmail(rawEmail);
    await this.em.transactional(async (em) => {
      const user = await em.findOne(User, { email });
      if (!user) return;
      const { token, hash } = newToken();
      const reset = em.create(PasswordReset, {
        user,
        tokenHash: hash,
        expiresAt: new Date(Date.now() + RESET_VALID_MS),
      });
      await em.flush();
      await this.outbox.enqueue(em, {
        idempotencyKey: `password-reset:${reset.id}`,
        template: 'password-reset',
        to: user.email,
        context: {
          name: user.name,
          resetUrl: `${this.app.origin}/reset-password?token=${encodeURIComponent(token)}`,
          validForText: '1 hour',
        },
      });
    });
  }

  async resetPassword(token: string, password: string): Promise<void> {
    const passwordHash = await hashPassword(password);
    await this.em.transactional(async (em) => {
      const reset = await em.findOne(PasswordReset, { tokenHash: hashToken(token) }, { populate: ['user'] });
      const now = new Date();
      if (!reset || reset.usedAt || reset.expiresAt < now)
        throw new BadRequestException(
          'This reset link has expired or was already used. Ask for a new one from the sign-in page.',
        );
      // Single use even when two tabs race: only the update that still sees usedAt empty wins.
      const claimed = await em.nativeUpdate(PasswordReset, { id: reset.id, usedAt: null }, { usedAt: now });
      if (claimed !== 1)
        throw new BadRequestException('This reset link was already used. Ask for a new one from the sign-in page.');
      await em.nativeUpdate(User, { id: reset.user.id }, { passwordHash });
      // Whoever might have had the old password is signed out everywhere.
      await endSessionsOf(em, reset.user.id);
    });
  }
}
