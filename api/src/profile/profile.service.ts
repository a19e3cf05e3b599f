import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable } from '@nestjs/common';
import { hashPassword, normaliseEmail, verifyPassword } from '../auth/passwords';
import type { SessionUser } from '../auth/session-user';
import { endSessionsOf } from '../sessions/sessions';
import { User } from '../users/user.entity';

const WRONG_CURRENT = { message: 'Please check the highlighted fields.', errors: { currentPassword: ['That is not your current password.'] } };

@Injectable()
export class ProfileService {
  constructor(private readonly em: EntityManager) {}

  private toDto(u: User): SessionUser {
    return { id: u.id, email: u.email ?? '', name: u.name };
  }

  async get(id: number): Promise<SessionUser> {
    return this.toDto(await this.em.findOneOrFail(User, { id }));
  }

  async directory(id: number) {
    const u = await this.em.findOneOrFail(User, { id });
    return { phone: u.phone ?? null, town: u.town ?? null, showEmail: u.showEmail, showPhone: u.showPhone, showTown: u.showTown };
  }

  async setDirectory(id: number, d: { phone?: string | null; town?: string | null; showEmail: boolean; showPhone: boolean; showTown: boolean }) {
    const u = await this.em.findOneOrFail(User, { id });
    u.phone = d.phone?.trim() || null;
    u.town = d.town?.trim() || null;
    u.showEmail = d.showEmail;
    u.showPhone = d.showPhone;
    u.showTown = d.showTown;
    await this.em.flush();
    return this.directory(id);
  }

  async rename(id: number, name: string): Promise<SessionUser> {
    const user = await this.em.findOneOrFail(User, { id });
    user.name = name.trim();
    await this.em.flush();
    return this.toDto(user);
  }

  private async checkCurrent(id: number, password: string): Promise<User> {
    const user = await this.em.findOneOrFail(User, { id }, { populate: ['passwordHash'] });
    if (!user.passwordHash || !(await verifyPassword(user.passwordHash, password))) throw new BadRequestException(WRONG_CURRENT);
    return user;
  }

  async changeEmail(id: number, rawEmail: string, currentPassword: string): Promise<SessionUser> {
    const email = normaliseEmail(rawEmail);
    const user = await this.checkCurrent(id, currentPassword);
    if (email !== user.email && (await this.em.count(User, { email })) > 0)
      throw new ConflictException({
        message: 'Please check the highlighted fields.',
        errors: { email: ['Another account already uses that address.'] },
      });
    user.email = email;
    await this.em.flush();
    return this.toDto(user);
  }

  /** Changes the password and signs out every other device; this one stays signed in. */
  async changePassword(id: number, currentPassword: string, newPassword: string, sessionId: string): Promise<void> {
    const user = await this.checkCurrent(id, currentPassword);
    user.passwordHash = await hashPassword(newPassword);
    await this.em.flush();
    await endSessionsOf(this.em, id, sessionId);
  }
}
