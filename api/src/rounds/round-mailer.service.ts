import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { Inject, Injectable } from '@nestjs/common';
import { BeeMember } from '../bees/bee-member.entity';
import { appConfig, type AppConfig } from '../config/app.config';
import { Membership } from '../guilds/membership.entity';
import { buildDueDateIcs, ICS_CONTENT_TYPE } from '../mail/ics';
import { OutboxService } from '../outbox/outbox.service';
import { instructionsText, renderInstructions } from './markdown';
import { RoundBlock } from './round-block.entity';
import { RoundFile } from './round-file.entity';
import { dateText, inchText, localDate, monthLabel, roundSizes, sizePhrase } from './round-presenter';
import { Round } from './round.entity';

/**
 * Everything the bees send by e-mail. Each message has an idempotency key naming the real-world
 * event, so however often a job or a request runs, each maker gets each message once.
 */
@Injectable()
export class RoundMailer {
  /** Test hook: called after each maker's message is queued during a fan-out. */
  afterEachQueued?: (index: number) => void | Promise<void>;

  constructor(
    private readonly outbox: OutboxService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  roundUrl(round: Round): string {
    return `${this.app.origin}/guilds/${round.bee.guild.id}/bees/${round.bee.id}/rounds/${round.month}`;
  }

  /** Active bee members other than the round's queen. */
  async makers(em: EntityManager, round: Round): Promise<Membership[]> {
    const rows = await em.find(
      BeeMember,
      { bee: round.bee, status: 'active', membership: { $ne: round.queen.id } },
      { populate: ['membership.user'], orderBy: { membership: { id: 'asc' } } },
    );
    return rows.map((r) => r.membership);
  }

  /**
   * Sends a published round to its makers: one block row and one assignment e-mail each, all in
   * one transaction with the round row locked, so two instances cannot both fan it out and a crash
   * half-way leaves nothing sent (the next tick starts again). Returns how many were queued.
   */
  async fanOut(em: EntityManager, roundId: number, now = new Date()): Promise<number> {
    const round = await em.findOne(
      Round,
      { id: roundId },
      { lockMode: LockMode.PESSIMISTIC_WRITE, populate: ['bee.guild', 'queen.user'] },
    );
    if (!round || round.status !== 'published' || round.sentAt || round.sendAt > now) return 0;
    const makers = await this.makers(em, round);
    const files = await em.find(RoundFile, { round }, { orderBy: { id: 'asc' } });
    const sizes = roundSizes(round);
    const ics = buildDueDateIcs({
      uid: `round-${round.id}-due@selvage`,
      dueDate: round.dueDate,
      summary: `Bee block due: ${round.title} for ${round.queen.user.name} (${round.bee.name})`,
      description: `Finished ${sizePhrase(sizes.finished)}; unfinished (cut) ${sizePhrase(sizes.unfinished)}. ${this.roundUrl(round)}`,
      url: this.roundUrl(round),
      timeZone: round.bee.guild.timeZone,
    });
    let queued = 0;
    for (const [index, maker] of makers.entries()) {
      await em
        .createQueryBuilder(RoundBlock)
        .insert({ round: round.id, maker: maker.id, status: 'not_started', onBehalf: false, createdAt: now, updatedAt: now })
        .onConflict(['round_id', 'maker_id'])
        .ignore()
        .execute();
      const inserted = await this.outbox.enqueue(em, {
        idempotencyKey: `round-assignment:${round.id}:${maker.id}`,
        template: 'round-assignment',
        to: maker.user.email,
        context: this.assignmentContext(round, maker, files, sizes),
        attachments: [{ filename: 'block-due-date.ics', contentType: ICS_CONTENT_TYPE, content: ics }],
      });
      if (inserted) queued++;
      await this.afterEachQueued?.(index);
    }
    round.sentAt = now;
    await em.flush();
    return queued;
  }

  private assignmentContext(round: Round, maker: Membership, files: RoundFile[], sizes: ReturnType<typeof roundSizes>) {
    const url = this.roundUrl(round);
    return {
      makerName: maker.user.name,
      queenName: round.queen.user.name,
      beeName: round.bee.name,
      guildName: round.bee.guild.name,
      monthLabel: monthLabel(round.month),
      title: round.title,
      instructionsHtml: renderInstructions(round.instructions),
      instructionsText: instructionsText(round.instructions),
      finishedText: sizePhrase(sizes.finished),
      unfinishedText: sizePhrase(sizes.unfinished),
      seamText: `${inchText(round.seamAllowanceMm)} inch`,
      toleranceText: `${inchText(round.toleranceMm)} inch`,
      trimToSize: round.trimMode === 'trim',
      swatches: round.swatches,
      background: round.background ?? null,
      queenSendsFabric: round.fabricSource === 'queen_sends',
      dueDateText: dateText(round.dueDate),
      deliveryByMail: round.deliveryMethod === 'mail',
      deliveryAddress: round.deliveryMethod === 'mail' ? (round.deliveryAddress ?? '') : '',
      meetingDetails: round.deliveryMethod === 'meeting' ? (round.meetingDetails ?? '') : '',
      patternLink: round.patternLink ?? '',
      files: files.map((f) => ({ filename: f.filename, url: `${this.app.origin}/api/guilds/${round.bee.guild.id}/bees/${round.bee.id}/rounds/${round.month}/files/${f.id}` })),
      roundUrl: url,
    };
  }

  async remindQueen(em: EntityManager, opts: { round: Round | null; beeId: number; guildId: number; beeName: string; month: string; queen: Membership; organiser: Membership; sendAt: Date; timeZone: string; daysBefore: 7 | 2 }) {
    const url = `${this.app.origin}/guilds/${opts.guildId}/bees/${opts.beeId}/rounds/${opts.month}`;
    const recipients = opts.queen.id === opts.organiser.id ? [opts.queen] : [opts.queen, opts.organiser];
    let queued = 0;
    for (const person of recipients) {
      const ok = await this.outbox.enqueue(em, {
        idempotencyKey: `round-reminder:${opts.beeId}:${opts.month}:${opts.daysBefore}:${person.id}`,
        template: 'round-reminder',
        to: person.user.email,
        context: {
          name: person.user.name,
          queenName: opts.queen.user.name,
          beeName: opts.beeName,
          monthLabel: monthLabel(opts.month),
          sendDateText: dateText(localDate(opts.sendAt, opts.timeZone)),
          daysLeft: opts.daysBefore,
          roundUrl: url,
          isQueen: person.id === opts.queen.id,
        },
      });
      if (ok) queued++;
    }
    return queued;
  }

  async remindDue(em: EntityManager, round: Round, block: RoundBlock) {
    const sizes = roundSizes(round);
    return this.outbox.enqueue(em, {
      idempotencyKey: `due-reminder:${round.id}:${block.maker.id}`,
      template: 'due-reminder',
      to: block.maker.user.email,
      context: {
        makerName: block.maker.user.name,
        queenName: round.queen.user.name,
        beeName: round.bee.name,
        title: round.title,
        dueDateText: dateText(round.dueDate),
        finishedText: sizePhrase(sizes.finished),
        unfinishedText: sizePhrase(sizes.unfinished),
        roundUrl: this.roundUrl(round),
        deliveryByMail: round.deliveryMethod === 'mail',
      },
    });
  }

  async noticeChange(em: EntityManager, round: Round, maker: Membership, batch: number) {
    return this.outbox.enqueue(em, {
      idempotencyKey: `round-changed:${round.id}:${batch}:${maker.id}`,
      template: 'round-changed',
      to: maker.user.email,
      context: {
        makerName: maker.user.name,
        queenName: round.queen.user.name,
        beeName: round.bee.name,
        title: round.title,
        monthLabel: monthLabel(round.month),
        roundUrl: this.roundUrl(round),
        changes: round.changedFields,
      },
    });
  }

  async nudge(em: EntityManager, round: Round, maker: Membership, onDate: string) {
    return this.outbox.enqueue(em, {
      idempotencyKey: `nudge:${round.id}:${maker.id}:${onDate}`,
      template: 'block-nudge',
      to: maker.user.email,
      context: {
        makerName: maker.user.name,
        queenName: round.queen.user.name,
        beeName: round.bee.name,
        title: round.title,
        dueDateText: dateText(round.dueDate),
        roundUrl: this.roundUrl(round),
      },
    });
  }
}
