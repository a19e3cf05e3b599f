import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Inject,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { hashPassword, normaliseEmail } from '../auth/passwords';
import type { SessionUser } from '../auth/session-user';
import { hashToken, newToken } from '../auth/tokens';
import { appConfig, type AppConfig } from '../config/app.config';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { normaliseRoles, type Role } from '../guilds/roles';
import { todayIn } from '../dues/dues-rules';
import { OfficeTerm } from '../offices/office-term.entity';
import { OutboxService } from '../outbox/outbox.service';
import { User } from '../users/user.entity';
import { Invitation } from './invitation.entity';

export const INVITATION_VALID_DAYS = 14;

const GONE = 'This invitation link has expired, was already used, or was withdrawn. Ask the guild for a new one.';

@Injectable()
export class InvitationsService {
  constructor(
    private readonly em: EntityManager,
    private readonly outbox: OutboxService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  async listPending(guild: Guild) {
    const rows = await this.em.find(
      Invitation,
      { guild, acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
      { populate: ['invitedBy'], orderBy: { createdAt: 'desc' } },
    );
    return rows.map((i) => ({
      id: i.id,
      email: i.email,
      roles: i.roles,
      invitedByName: i.invitedBy?.name ?? null,
      createdAt: i.createdAt,
      expiresAt: i.expiresAt,
    }));
  }

  async invite(inviter: Membership, invitedBy: SessionUser, rawEmail: string, roles: Role[] = []) {
    const email = normaliseEmail(rawEmail);
    return this.em.transactional(async (em) => {
      const guild = inviter.guild;
      // Serialise invitations to one guild so two officers cannot invite the same person twice.
      await em.findOneOrFail(Guild, { id: guild.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      const existing = await em.findOne(Membership, { guild, user: { email }, status: 'active' }, { populate: ['user.passwordHash'] });
      // A member the officers added (by hand or from the roster import) has no password yet: the
      // invitation is how she comes to sign in for the first time.
      if (existing?.user.passwordHash) throw new ConflictException(`${email} is already a member of ${guild.name}.`);
      const pending = await em.findOne(Invitation, {
        guild,
        email,
        acceptedAt: null,
        revokedAt: null,
        expiresAt: { $gt: new Date() },
      });
      if (pending)
        throw new ConflictException(
          `${email} already has an invitation waiting. Withdraw it first if you want to send a new one.`,
        );
      const { token, hash } = newToken();
      const expiresAt = new Date(Date.now() + INVITATION_VALID_DAYS * 24 * 60 * 60 * 1000);
      const invitation = em.create(Invitation, {
        guild,
        email,
        roles: normaliseRoles(roles),
        tokenHash: hash,
        invitedBy: invitedBy.id,
        expiresAt,
      });
      await em.flush();
      await this.outbox.enqueue(em, {
        idempotencyKey: `invitation:${invitation.id}`,
        template: 'invitation',
        to: email,
        context: {
          inviteeEmail: email,
          guildName: guild.name,
          invitedByName: invitedBy.name,
          acceptUrl: `${this.app.origin}/invitations/${token}`,
          expiresOn: expiresAt.toLocaleDateString('en-US', {
            dateStyle: 'long',
            timeZone: guild.timeZone,
          }),
        },
      });
      return {
        id: invitation.id,
        email,
        roles: invitation.roles,
        invitedByName: invitedBy.name,
        createdAt: invitation.createdAt,
        expiresAt,
      };
    });
  }

  async revoke(guild: Guild, invitationId: number): Promise<void> {
    const n = await this.em.nativeUpdate(
      Invitation,
      { id: invitationId, guild, acceptedAt: null, revokedAt: null },
      { revokedAt: new Date() },
    );
    if (n !== 1) throw new NotFoundException('No such pending invitation.');
  }

  private async findUsable(em: EntityManager, token: string): Promise<Invitation> {
    const invitation = await em.findOne(
      Invitation,
      { tokenHash: hashToken(token) },
      { populate: ['guild', 'invitedBy'] },
    );
    if (!invitation || invitation.acceptedAt || invitation.revokedAt || invitation.expiresAt < new Date())
      throw new NotFoundException(GONE);
    return invitation;
  }

  async describe(token: string) {
    const invitation = await this.findUsable(this.em, token);
    const user = await this.em.findOne(User, { email: invitation.email }, { populate: ['passwordHash'] });
    const hasAccount = Boolean(user?.passwordHash);
    return {
      guildName: invitation.guild.name,
      guildTown: invitation.guild.town,
      email: invitation.email,
      invitedByName: invitation.invitedBy?.name ?? null,
      hasAccount,
      expiresAt: invitation.expiresAt,
    };
  }

  /** Returns the user to sign in (a new account) or the signed-in user who accepted. */
  async accept(
    token: string,
    signedIn: SessionUser | undefined,
    details: { name?: string; password?: string },
  ): Promise<{ user: SessionUser; guildId: number; created: boolean }> {
    const passwordHash = details.password ? await hashPassword(details.password) : undefined;
    return this.em.transactional(async (em) => {
      const invitation = await this.findUsable(em, token);
      let user = await em.findOne(User, { email: invitation.email }, { populate: ['passwordHash'] });
      let created = false;
      if (user?.passwordHash) {
        if (!signedIn)
          throw new ForbiddenException(`You already have an account. Sign in as ${invitation.email} to accept.`);
        if (signedIn.id !== user.id)
          throw new ForbiddenException(
            `This invitation is for ${invitation.email}. Sign out, then sign in with that address to accept.`,
          );
      } else {
        if (signedIn && signedIn.email !== invitation.email)
          throw new ForbiddenException(
            `This invitation is for ${invitation.email}. Sign out first, then open the link again.`,
          );
        const errors: Record<string, string[]> = {};
        if (!details.name?.trim()) errors.name = ['Enter your name.'];
        if (!passwordHash) errors.password = ['Choose a password of at least 10 characters.'];
        if (Object.keys(errors).length)
          throw new BadRequestException({ message: 'Please check the highlighted fields.', errors });
        if (user) {
          // Kept by the officers until now (added by hand or imported): she chooses her password today.
          user.name = details.name!.trim();
          user.passwordHash = passwordHash!;
        } else user = em.create(User, { email: invitation.email, name: details.name!.trim(), passwordHash: passwordHash! });
        created = true;
      }
      // Single use: only the request that still sees it unaccepted goes on.
      const claimed = await em.nativeUpdate(
        Invitation,
        { id: invitation.id, acceptedAt: null, revokedAt: null },
        { acceptedAt: new Date() },
      );
      if (claimed !== 1) throw new NotFoundException(GONE);
      let membership = await em.findOne(Membership, { guild: invitation.guild, user });
      const wasActive = membership?.status === 'active';
      const newRoles = invitation.roles.filter((r) => !wasActive || !membership!.roles.includes(r));
      if (membership) {
        membership.status = 'active';
        membership.leftAt = null;
        membership.eraseRequestedAt = null;
        membership.roles = normaliseRoles([...(wasActive ? membership.roles : []), ...invitation.roles]);
      } else {
        membership = em.create(Membership, { user, guild: invitation.guild, roles: invitation.roles, joinedAt: new Date() });
      }
      // Each office she was invited to is a term from today, so the roles follow the guild's record of
      // terms (a former officer's ended term would otherwise take the role away again).
      const today = todayIn(invitation.guild.timeZone);
      for (const role of newRoles)
        em.create(OfficeTerm, { guild: invitation.guild, membership, role, startsOn: today, note: 'Given with her invitation' });
      await em.flush();
      await this.outbox.enqueue(em, {
        idempotencyKey: `welcome:${invitation.id}`,
        template: 'welcome',
        to: user.email,
        context: { name: user.name, guildName: invitation.guild.name, dashboardUrl: `${this.app.origin}/` },
      });
      return { user: { id: user.id, email: invitation.email, name: user.name }, guildId: invitation.guild.id, created };
    });
  }
}
