import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { DateTime } from 'luxon';
import { User } from '../users/user.entity';
import type { CreatePaperMemberDto, UpdateMemberDetailsDto } from './dto/paper-member.dto';
import { GuildsService, type MemberRow } from './guilds.service';
import { Membership } from './membership.entity';
import { paperFor, renderRoster, type Paper } from './roster-pdf';

const invalid = (errors: Record<string, string[]>) => new BadRequestException({ message: 'Please check the highlighted fields.', errors });


/**
 * Members the officers keep on their behalf: she may have no e-mail address and does not sign in, so
 * an admin or the membership chair adds her and keeps her details. And the printed roster.
 */
@Injectable()
export class MembersService {
  constructor(
    private readonly em: EntityManager,
    private readonly guilds: GuildsService,
  ) {}

  async addOnBehalf(me: Membership, dto: CreatePaperMemberDto): Promise<MemberRow> {
    const guild = me.guild;
    const email = dto.email ? dto.email.trim().toLowerCase() : null;
    let joinedAt = new Date();
    if (dto.memberSince) {
      const day = DateTime.fromISO(dto.memberSince, { zone: guild.timeZone });
      if (!day.isValid) throw invalid({ memberSince: ['That date does not exist.'] });
      const today = DateTime.now().setZone(guild.timeZone).toISODate()!;
      if (dto.memberSince > today) throw invalid({ memberSince: ['The date she joined cannot be after today.'] });
      if (dto.memberSince < '1900-01-01') throw invalid({ memberSince: ['Check the year she joined.'] });
      joinedAt = day.set({ hour: 12 }).toJSDate();
    }
    const id = await this.taken(email, () => this.em.transactional(async (em) => {
      if (email) {
        const holder = await em.findOne(User, { email });
        if (holder) {
          const member = await em.findOne(Membership, { user: holder, guild });
          if (member?.status === 'active') throw new ConflictException(`${email} is already a member of ${guild.name}.`);
          throw new ConflictException(`${email} already has an account; invite her instead.`);
        }
      }
      const user = em.create(User, {
        email,
        name: dto.name.trim(),
        passwordHash: null,
        phone: dto.phone ?? null,
        town: dto.town ?? null,
        showEmail: false,
        showPhone: dto.showPhone ?? false,
        showTown: dto.showTown ?? false,
      });
      const membership = em.create(Membership, { user, guild, roles: [], status: 'active', joinedAt });
      await em.flush();
      return membership.id;
    }));
    return this.row(me, id);
  }

  async updateDetails(me: Membership, membershipId: number, dto: UpdateMemberDetailsDto): Promise<MemberRow> {
    await this.taken(dto.email?.trim().toLowerCase() ?? null, () => this.em.transactional(async (em) => {
      const member = await em.findOne(Membership, { id: membershipId, guild: me.guild }, { populate: ['user', 'user.passwordHash'] });
      if (!member) throw new NotFoundException('That person is not in this guild.');
      const user = member.user;
      if (user.passwordHash) throw new ConflictException('She keeps her own details on her profile page.');
      if (dto.email !== undefined) {
        const email = dto.email ? dto.email.trim().toLowerCase() : null;
        if (email && email !== user.email) {
          const holder = await em.findOne(User, { email, id: { $ne: user.id } });
          if (holder) throw new ConflictException(`${email} belongs to another account. Use a different address, or leave it empty.`);
        }
        user.email = email;
      }
      if (dto.name !== undefined) user.name = dto.name.trim();
      if (dto.phone !== undefined) user.phone = dto.phone ?? null;
      if (dto.town !== undefined) user.town = dto.town ?? null;
      if (dto.showEmail !== undefined) user.showEmail = dto.showEmail;
      if (dto.showPhone !== undefined) user.showPhone = dto.showPhone;
      if (dto.showTown !== undefined) user.showTown = dto.showTown;
      await em.flush();
    }));
    return this.row(me, membershipId);
  }

  /** Two officers saving the same new address at once: the database's unique key decides, as a 409. */
  private async taken<T>(email: string | null, work: () => Promise<T>): Promise<T> {
    try {
      return await work();
    } catch (e) {
      if (e instanceof UniqueConstraintViolationException && email)
        throw new ConflictException(`${email} belongs to another account. Use a different address, or leave it empty.`);
      throw e;
    }
  }

  /** One member as the officer's list shows her. */
  private async row(me: Membership, membershipId: number): Promise<MemberRow> {
    const rows = await this.guilds.listMembers(me);
    const row = rows.find((r) => r.membershipId === membershipId);
    if (!row) throw new NotFoundException('That person is not in this guild.');
    return row;
  }

  /** The roster on paper, with exactly what the viewer sees on the members page (listMembers decides). */
  async rosterPdf(me: Membership, paper?: Paper): Promise<{ filename: string; pdf: Buffer }> {
    const guild = me.guild;
    const rows = (await this.guilds.listMembers(me)).filter((r) => r.status === undefined || r.status === 'active');
    const chosen: Paper = paper ?? paperFor(guild.currency);
    const printedOn = DateTime.now().setZone(guild.timeZone).setLocale('en-GB').toFormat('d LLLL yyyy');
    const pdf = await renderRoster({
      guildName: guild.name,
      guildTown: guild.town,
      printedOn,
      paper: chosen,
      members: rows.map((r) => ({ name: r.name, email: r.email ?? null, phone: r.phone ?? null, town: r.town ?? null })),
    });
    const slug = guild.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'guild';
    return { filename: `${slug}-roster.pdf`, pdf };
  }
}
