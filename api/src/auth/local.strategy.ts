import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { Request } from 'express';
import { Strategy } from 'passport-local';
import { User } from '../users/user.entity';
import { decoyHash, normaliseEmail, verifyPassword } from './passwords';
import type { SessionUser } from './session-user';
import { SignInLimiter } from './sign-in-limiter.service';

export const WRONG_CREDENTIALS = 'That e-mail address and password do not match. Check them and try again.';

@Injectable()
export class LocalStrategy extends PassportStrategy(Strategy) {
  constructor(
    private readonly em: EntityManager,
    private readonly limiter: SignInLimiter,
  ) {
    super({ usernameField: 'email', passwordField: 'password', passReqToCallback: true });
  }

  async validate(req: Request, rawEmail: string, password: string): Promise<SessionUser> {
    const email = normaliseEmail(rawEmail);
    const address = req.ip ?? 'unknown';
    await this.limiter.assertAllowed(email, address);
    const user = await this.em.fork().findOne(User, { email }, { populate: ['passwordHash'] });
    // An unknown address costs one argon2 verification too, so timing does not tell them apart.
    // A member added by an officer or an import has no password until she accepts an invitation or resets it.
    const ok = await verifyPassword(user?.passwordHash ?? (await decoyHash()), password);
    if (!user || !user.passwordHash || !ok) {
      await this.limiter.recordFailure(email, address);
      throw new UnauthorizedException(WRONG_CREDENTIALS);
    }
    return { id: user.id, email: email, name: user.name };
  }
}
