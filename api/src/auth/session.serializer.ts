import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { PassportSerializer } from '@nestjs/passport';
import { User } from '../users/user.entity';
import type { SessionUser } from './session-user';

/** The session holds the user id only; name and e-mail are read fresh on each request. */
@Injectable()
export class SessionSerializer extends PassportSerializer {
  constructor(private readonly em: EntityManager) {
    super();
  }

  serializeUser(user: SessionUser, done: (err: Error | null, id?: number) => void): void {
    done(null, user.id);
  }

  async deserializeUser(id: number, done: (err: Error | null, user?: SessionUser | false) => void): Promise<void> {
    try {
      const user = await this.em.fork().findOne(User, { id }, { fields: ['id', 'email', 'name'] });
      // A member kept on paper, or one whose data was erased, has no address and holds no session.
      done(null, user?.email ? { id: user.id, email: user.email, name: user.name } : false);
    } catch (e) {
      done(e as Error);
    }
  }
}
