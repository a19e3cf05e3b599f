import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, ForbiddenException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import { appConfig, type AppConfig } from '../config/app.config';
import { Membership } from '../guilds/membership.entity';
import { OutboxService } from '../outbox/outbox.service';
import { Round } from '../rounds/round.entity';
import { BeeMember } from './bee-member.entity';
import { BeeSlot } from './bee-slot.entity';
import { Bee } from './bee.entity';
import type { CreateBeeDto, RotationDto, UpdateBeeDto } from './dto/bee.dto';
import { compareMonths, monthOf, monthsFrom, newSeed, planRotation, RotationError, seededShuffle, swapSlots, type Slot } from './rotation';

export interface BeeAccess {
  bee: Bee;
  me: Membership;
  myBeeMember: BeeMember | null;
  isOrganiser: boolean;
}

@Injectable()
export class BeesService {
  constructor(
    private readonly em: EntityManager,
    private readonly outbox: OutboxService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  /** The bee in the caller's guild (404 otherwise), with what the caller is to it. */
  async access(me: Membership, beeId: number, em: EntityManager = this.em): Promise<BeeAccess> {
    const bee = await em.findOne(Bee, { id: beeId, guild: me.guild }, { populate: ['organiser.user', 'guild'] });
    if (!bee) throw new NotFoundException('No such bee in this guild.');
    const myBeeMember = await em.findOne(BeeMember, { bee, membership: me });
    return { bee, me, myBeeMember, isOrganiser: bee.organiser.id === me.id };
  }

  assertOrganiser(a: BeeAccess): void {
    if (!a.isOrganiser) throw new ForbiddenException("Only the bee's organiser can do this.");
  }

  /** The month in progress in the guild's time zone; it and earlier months are history. */
  currentMonth(bee: Bee, now = new Date()): string {
    return monthOf(now, bee.guild.timeZone);
  }

  async list(me: Membership) {
    const bees = await this.em.find(Bee, { guild: me.guild }, { populate: ['organiser.user'], orderBy: { name: 'asc' } });
    const members = bees.length
      ? await this.em.find(BeeMember, { bee: { $in: bees.map((b) => b.id) }, status: { $ne: 'left' } })
      : [];
    return bees.map((b) => {
      const mine = members.find((m) => m.bee.id === b.id && m.membership.id === me.id);
      return {
        id: b.id,
        name: b.name,
        description: b.description ?? null,
        handover: b.handover,
        startMonth: b.startMonth,
        months: b.months,
        organiser: { membershipId: b.organiser.id, name: b.organiser.user.name },
        memberCount: members.filter((m) => m.bee.id === b.id && m.status === 'active').length,
        myStatus: b.organiser.id === me.id ? 'organiser' : (mine?.status ?? null),
      };
    });
  }

  async create(me: Membership, dto: CreateBeeDto) {
    const bee = await this.em.transactional(async (em) => {
      const bee = em.create(Bee, {
        guild: me.guild,
        name: dto.name.trim(),
        description: dto.description?.trim() || null,
        organiser: me,
        handover: dto.handover,
        startMonth: dto.startMonth,
        months: dto.months,
        skippedMonths: [],
        rotationOrder: [me.id],
      });
      em.create(BeeMember, { bee, membership: me, status: 'active', joinedAt: new Date() });
      await em.flush();
      await this.replan(em, bee);
      return bee;
    });
    return this.detail(me, bee.id);
  }

  async update(me: Membership, beeId: number, dto: UpdateBeeDto) {
    const a = await this.access(me, beeId);
    this.assertOrganiser(a);
    if (dto.name !== undefined) a.bee.name = dto.name.trim();
    if (dto.description !== undefined) a.bee.description = dto.description.trim() || null;
    if (dto.handover !== undefined) a.bee.handover = dto.handover;
    await this.em.flush();
    return this.detail(me, beeId);
  }

  async detail(me: Membership, beeId: number) {
    const a = await this.access(me, beeId);
    const { bee } = a;
    const [members, slots, rounds] = await Promise.all([
      this.em.find(BeeMember, { bee }, { populate: ['membership.user', 'membership.user.passwordHash'], orderBy: { membership: { user: { name: 'asc' } } } }),
      this.em.find(BeeSlot, { bee }, { populate: ['queen.user'], orderBy: { month: 'asc' } }),
      this.em.find(Round, { bee }, { fields: ['month', 'status', 'title', 'sentAt'] }),
    ]);
    const current = this.currentMonth(bee);
    // For the organiser: guild members who do not sign in and are not making in the bee, whom she can add herself.
    const inBee = new Set(members.filter((m) => m.status === 'active').map((m) => m.membership.id));
    const addable = a.isOrganiser
      ? (await this.em.find(Membership, { guild: me.guild, status: 'active', user: { passwordHash: null } }, { populate: ['user'], orderBy: { user: { name: 'asc' } } }))
          .filter((m) => !inBee.has(m.id))
          .map((m) => ({ membershipId: m.id, name: m.user.name }))
      : [];
    return {
      id: bee.id,
      name: bee.name,
      description: bee.description ?? null,
      handover: bee.handover,
      startMonth: bee.startMonth,
      months: bee.months,
      skippedMonths: bee.skippedMonths,
      seed: bee.rotationSeed ?? null,
      currentMonth: current,
      organiser: { membershipId: bee.organiser.id, name: bee.organiser.user.name },
      isOrganiser: a.isOrganiser,
      myStatus: a.isOrganiser ? 'organiser' : (a.myBeeMember?.status ?? null),
      members: members
        .filter((m) => m.status !== 'left')
        .map((m) => ({ membershipId: m.membership.id, name: m.membership.user.name, status: m.status, onPaper: !m.membership.user.passwordHash })),
      addable,
      rotation: slots.map((s) => {
        const round = rounds.find((r) => r.month === s.month);
        return {
          month: s.month,
          skipped: s.skipped,
          past: compareMonths(s.month, current) < 0,
          editable: compareMonths(s.month, current) > 0,
          queen: s.queen ? { membershipId: s.queen.id, name: s.queen.user.name } : null,
          round: round ? { status: round.status, title: round.title, sent: Boolean(round.sentAt) } : null,
        };
      }),
    };
  }

  // --- membership of the bee -------------------------------------------------------------

  async invite(me: Membership, beeId: number, membershipIds: number[]) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      this.assertOrganiser(a);
      const ids = [...new Set(membershipIds)];
      const people = await em.find(Membership, { id: { $in: ids }, guild: me.guild, status: 'active' }, { populate: ['user'] });
      if (people.length !== ids.length) throw new BadRequestException({
        message: 'Please check the highlighted fields.',
        errors: { membershipIds: ['Choose members of this guild.'] },
      });
      for (const person of people) {
        const existing = await em.findOne(BeeMember, { bee: a.bee, membership: person });
        if (existing?.status === 'active' || existing?.status === 'invited') continue;
        if (existing) existing.status = 'invited';
        else em.create(BeeMember, { bee: a.bee, membership: person, status: 'invited' });
        await em.flush();
        const invite = existing ?? (await em.findOneOrFail(BeeMember, { bee: a.bee, membership: person }));
        await this.outbox.enqueue(em, {
          // A fresh invitation after she left is a new message; a repeated click is not.
          idempotencyKey: `bee-invitation:${invite.id}:${invite.leftAt?.getTime() ?? 0}`,
          template: 'bee-invitation',
          to: person.user.email,
          context: {
            name: person.user.name,
            beeName: a.bee.name,
            guildName: a.bee.guild.name,
            organiserName: a.bee.organiser.user.name,
            beeUrl: `${this.app.origin}/guilds/${a.bee.guild.id}/bees/${a.bee.id}`,
          },
        });
      }
    });
    return this.detail(me, beeId);
  }

  /**
   * The organiser adds members who do not sign in (no e-mail address, or no password yet) straight
   * to the bee as active makers: they cannot accept an invitation, so she acts on their behalf.
   */
  async addOnBehalf(me: Membership, beeId: number, membershipIds: number[]) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      this.assertOrganiser(a);
      const ids = [...new Set(membershipIds)];
      const people = await em.find(Membership, { id: { $in: ids }, guild: me.guild, status: 'active' }, { populate: ['user', 'user.passwordHash'] });
      if (people.length !== ids.length) throw new BadRequestException({
        message: 'Please check the highlighted fields.',
        errors: { membershipIds: ['Choose members of this guild.'] },
      });
      const signsIn = people.filter((p) => p.user.passwordHash);
      if (signsIn.length)
        throw new ConflictException(
          `${signsIn.map((p) => p.user.name).join(', ')} ${signsIn.length === 1 ? 'signs' : 'sign'} in to Selvage; invite ${signsIn.length === 1 ? 'her' : 'them'} instead, so ${signsIn.length === 1 ? 'she chooses' : 'they choose'} to join.`,
        );
      let changed = false;
      for (const person of people) {
        const existing = await em.findOne(BeeMember, { bee: a.bee, membership: person });
        if (existing?.status === 'active') continue;
        if (existing) {
          existing.status = 'active';
          existing.joinedAt = new Date();
          existing.leftAt = null;
        } else em.create(BeeMember, { bee: a.bee, membership: person, status: 'active', joinedAt: new Date() });
        if (!a.bee.rotationOrder.includes(person.id)) a.bee.rotationOrder = [...a.bee.rotationOrder, person.id];
        changed = true;
      }
      if (!changed) return;
      await em.flush();
      await this.replan(em, a.bee);
    });
    return this.detail(me, beeId);
  }

  async join(me: Membership, beeId: number) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      if (a.myBeeMember?.status === 'active') return;
      if (a.myBeeMember?.status !== 'invited')
        throw new ForbiddenException('You need an invitation from the organiser to join this bee.');
      a.myBeeMember.status = 'active';
      a.myBeeMember.joinedAt = new Date();
      a.myBeeMember.leftAt = null;
      if (!a.bee.rotationOrder.includes(me.id)) a.bee.rotationOrder = [...a.bee.rotationOrder, me.id];
      await em.flush();
      await this.replan(em, a.bee);
    });
    return this.detail(me, beeId);
  }

  async leave(me: Membership, beeId: number) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      if (a.isOrganiser)
        throw new ConflictException('The organiser cannot leave the bee. Ask a guild admin to hand the bee to someone else first.');
      if (!a.myBeeMember || a.myBeeMember.status === 'left') throw new NotFoundException('You are not in this bee.');
      await this.removeMember(em, a.bee, a.myBeeMember);
    });
    return this.detail(me, beeId);
  }

  async remove(me: Membership, beeId: number, membershipId: number) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      this.assertOrganiser(a);
      if (membershipId === a.bee.organiser.id) throw new ConflictException('The organiser cannot be removed from her own bee.');
      const member = await em.findOne(BeeMember, { bee: a.bee, membership: membershipId, status: { $ne: 'left' } });
      if (!member) throw new NotFoundException('That person is not in this bee.');
      await this.removeMember(em, a.bee, member);
    });
    return this.detail(me, beeId);
  }

  private async removeMember(em: EntityManager, bee: Bee, member: BeeMember) {
    member.status = 'left';
    member.leftAt = new Date();
    bee.rotationOrder = bee.rotationOrder.filter((id) => id !== member.membership.id);
    await em.flush();
    await this.replan(em, bee);
  }

  // --- the rotation ----------------------------------------------------------------------

  async setRotation(me: Membership, beeId: number, dto: RotationDto) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      this.assertOrganiser(a);
      const active = await this.activeMemberIds(em, a.bee);
      if (dto.mode === 'shuffle') {
        const seed = dto.seed ?? newSeed();
        a.bee.rotationSeed = seed;
        a.bee.rotationOrder = seededShuffle(active, seed);
      } else {
        const order = dto.order ?? [];
        const same = order.length === active.length && new Set(order).size === order.length && order.every((id) => active.includes(id));
        if (!same)
          throw new BadRequestException({
            message: 'Please check the highlighted fields.',
            errors: { order: ['List every maker of the bee exactly once.'] },
          });
        a.bee.rotationSeed = null;
        a.bee.rotationOrder = order;
      }
      await em.flush();
      await this.replan(em, a.bee);
    });
    return this.detail(me, beeId);
  }

  async setSkipped(me: Membership, beeId: number, month: string, skipped: boolean) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      this.assertOrganiser(a);
      this.assertEditableMonth(a.bee, month);
      const set = new Set(a.bee.skippedMonths);
      if (skipped) set.add(month);
      else set.delete(month);
      a.bee.skippedMonths = [...set].sort();
      await em.flush();
      await this.replan(em, a.bee);
    });
    return this.detail(me, beeId);
  }

  async swap(me: Membership, beeId: number, monthA: string, monthB: string) {
    await this.em.transactional(async (em) => {
      const a = await this.access(me, beeId, em);
      this.assertOrganiser(a);
      const slots = await em.find(BeeSlot, { bee: a.bee }, { orderBy: { month: 'asc' }, lockMode: LockMode.PESSIMISTIC_WRITE });
      let swapped: Slot[];
      try {
        swapped = swapSlots(slots.map(toSlot), monthA, monthB, this.firstEditableMonth(a.bee));
      } catch (e) {
        if (e instanceof RotationError) throw new BadRequestException(e.message);
        throw e;
      }
      // Carry the swap into the order too, so a later re-plan (someone joins or leaves) keeps it.
      const future = swapped.filter((s) => compareMonths(s.month, this.firstEditableMonth(a.bee)) >= 0 && s.queenId !== null);
      const head = [...new Set(future.map((s) => s.queenId as number))];
      a.bee.rotationOrder = [...head, ...a.bee.rotationOrder.filter((id) => !head.includes(id))];
      for (const slot of slots) {
        const next = swapped.find((s) => s.month === slot.month)!;
        slot.queen = next.queenId ? em.getReference(Membership, next.queenId) : null;
      }
      await em.flush();
      await this.syncRoundQueens(em, a.bee);
    });
    return this.detail(me, beeId);
  }

  /** Months after this one can always change; this month only until its round is published. */
  private firstEditableMonth(bee: Bee): string {
    return monthsFrom(this.currentMonth(bee), 2)[1];
  }

  private assertEditableMonth(bee: Bee, month: string) {
    const months = monthsFrom(bee.startMonth, bee.months);
    if (!months.includes(month)) throw new BadRequestException(`${month} is not one of this bee's months.`);
    if (compareMonths(month, this.firstEditableMonth(bee)) < 0)
      throw new BadRequestException('That month has already begun or passed; only later months can change.');
  }

  private async activeMemberIds(em: EntityManager, bee: Bee): Promise<number[]> {
    const rows = await em.find(BeeMember, { bee, status: 'active' }, { orderBy: { membership: { id: 'asc' } } });
    return rows.map((r) => r.membership.id);
  }

  /**
   * Rebuilds the months that have not begun from the bee's order and skips; months that have
   * begun (or passed) keep their queen.
   */
  async replan(em: EntityManager, bee: Bee): Promise<void> {
    const months = monthsFrom(bee.startMonth, bee.months);
    const existing = await em.find(BeeSlot, { bee }, { orderBy: { month: 'asc' }, lockMode: LockMode.PESSIMISTIC_WRITE });
    const current = this.currentMonth(bee);
    // This month stays as it is once its queen has started a round (and is still in the bee);
    // before that it is re-planned with the months to come.
    const active = await this.activeMemberIds(em, bee);
    const currentRound = await em.findOne(Round, { bee, month: current });
    const keepCurrent = currentRound !== null && active.includes(currentRound.queen.id);
    const kept = existing
      .filter((s) => compareMonths(s.month, current) < 0 || (s.month === current && keepCurrent))
      .map(toSlot);
    const order = [...bee.rotationOrder.filter((id) => active.includes(id)), ...active.filter((id) => !bee.rotationOrder.includes(id))];
    const planned = planRotation({ months, skipped: new Set(bee.skippedMonths), order, kept });
    for (const slot of planned) {
      const row = existing.find((s) => s.month === slot.month);
      const queen = slot.queenId ? em.getReference(Membership, slot.queenId) : null;
      if (row) {
        row.skipped = slot.skipped;
        row.queen = queen;
      } else {
        em.create(BeeSlot, { bee, month: slot.month, skipped: slot.skipped, queen });
      }
    }
    await em.flush();
    await this.syncRoundQueens(em, bee);
  }

  /** A draft round follows its month's queen when the rotation changes; a sent one keeps hers. */
  private async syncRoundQueens(em: EntityManager, bee: Bee) {
    const [slots, rounds] = await Promise.all([em.find(BeeSlot, { bee }), em.find(Round, { bee, sentAt: null })]);
    for (const round of rounds) {
      const slot = slots.find((s) => s.month === round.month);
      if (slot?.queen && slot.queen.id !== round.queen.id) round.queen = slot.queen;
    }
    await em.flush();
  }
}

function toSlot(s: BeeSlot): Slot {
  return { month: s.month, skipped: s.skipped, queenId: s.queen?.id ?? null };
}
