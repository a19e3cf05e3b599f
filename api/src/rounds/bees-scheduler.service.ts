import { LockMode } from '@mikro-orm/core';
import { EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Inject, Injectable, Logger, OnApplicationBootstrap, OnApplicationShutdown } from '@nestjs/common';
import { BeeSlot } from '../bees/bee-slot.entity';
import { beesConfig, type BeesConfig } from '../config/app.config';
import { withNamedLock } from '../database/named-lock';
import { monthOf, monthsFrom } from '../bees/rotation';
import { RoundBlock } from './round-block.entity';
import { RoundMailer } from './round-mailer.service';
import { defaultSendAt, localDate, zonedInstant } from './round-presenter';
import { Round } from './round.entity';

const DAY = 24 * 60 * 60 * 1000;
export const CHANGE_BATCH_MS = 30 * 60 * 1000;

export interface TickReport {
  sent: number;
  queenReminders: number;
  dueReminders: number;
  changeNotices: number;
}

/**
 * The bees' clock: sends rounds on their send date, reminds queens who have not published,
 * reminds makers before the due date, and batches "changed" notices. Runs under a MariaDB named
 * lock so that, however many api instances there are, one tick runs at a time.
 */
@Injectable()
export class BeesScheduler implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(BeesScheduler.name);
  private timer?: NodeJS.Timeout;
  private running?: Promise<unknown>;
  private stopped = false;

  constructor(
    private readonly orm: MikroORM,
    private readonly mailer: RoundMailer,
    @Inject(beesConfig.KEY) private readonly config: BeesConfig,
  ) {}

  onApplicationBootstrap(): void {
    if (!this.config.schedulerEnabled) return;
    const loop = () => {
      if (this.stopped) return;
      this.running = this.tick()
        .catch((e) => this.logger.error(`bees tick failed: ${e instanceof Error ? e.stack : e}`))
        .finally(() => {
          if (!this.stopped) this.timer = setTimeout(loop, this.config.tickMs);
        });
    };
    this.timer = setTimeout(loop, 1000);
  }

  async onApplicationShutdown(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    await this.running;
  }

  /** One pass of every job; returns null when another instance holds the lock. */
  async tick(now = new Date()): Promise<TickReport | null> {
    const report: TickReport = { sent: 0, queenReminders: 0, dueReminders: 0, changeNotices: 0 };
    const ran = await withNamedLock(this.orm, 'selvage.bees-tick', async () => {
      report.sent = await this.sendDueRounds(now);
      report.queenReminders = await this.remindQueens(now);
      report.dueReminders = await this.remindMakers(now);
      report.changeNotices = await this.sendChangeNotices(now);
    });
    return ran ? report : null;
  }

  private async sendDueRounds(now: Date): Promise<number> {
    const due = await this.orm.em.fork().find(Round, { status: 'published', sentAt: null, sendAt: { $lte: now } }, { fields: ['id'] });
    let queued = 0;
    for (const { id } of due) queued += await this.orm.em.fork().transactional((em: EntityManager) => this.mailer.fanOut(em, id, now));
    return queued;
  }

  /** 7 and 2 days before the send date of a month whose round is not published yet. */
  private async remindQueens(now: Date): Promise<number> {
    const em = this.orm.em.fork();
    // Default send dates fall on the 1st, so only this month and the next two can be within 7 days.
    const months = monthsFrom(monthOf(new Date(now.getTime() - 31 * DAY), 'UTC'), 4);
    const slots = await em.find(
      BeeSlot,
      { month: { $in: months }, skipped: false, queen: { $ne: null } },
      { populate: ['bee.guild', 'bee.organiser.user', 'queen.user'] },
    );
    if (!slots.length) return 0;
    const rounds = await em.find(Round, { bee: { $in: slots.map((s) => s.bee.id) }, month: { $in: months } });
    let queued = 0;
    for (const slot of slots) {
      const round = rounds.find((r) => r.bee.id === slot.bee.id && r.month === slot.month) ?? null;
      if (round?.status === 'published') continue;
      const sendAt = round?.sendAt ?? defaultSendAt(slot.month, slot.bee.guild.timeZone);
      const until = sendAt.getTime() - now.getTime();
      const daysBefore = until <= 0 ? null : until <= 2 * DAY ? 2 : until <= 7 * DAY ? 7 : null;
      if (!daysBefore) continue;
      queued += await em.transactional((tx: EntityManager) =>
        this.mailer.remindQueen(tx, {
          round,
          beeId: slot.bee.id,
          guildId: slot.bee.guild.id,
          beeName: slot.bee.name,
          month: slot.month,
          queen: slot.queen!,
          organiser: slot.bee.organiser,
          sendAt,
          timeZone: slot.bee.guild.timeZone,
          daysBefore,
        }),
      );
    }
    return queued;
  }

  /** 7 days before the due date, to makers whose block is not on its way yet. */
  private async remindMakers(now: Date): Promise<number> {
    const em = this.orm.em.fork();
    const soon = localDate(new Date(now.getTime() + 7 * DAY), 'UTC');
    const rounds = await em.find(
      Round,
      { sentAt: { $ne: null }, dueDate: { $lte: soon, $gte: localDate(new Date(now.getTime() - DAY), 'UTC') } },
      { populate: ['bee.guild', 'queen.user'] },
    );
    let queued = 0;
    for (const round of rounds) {
      const dueStart = zonedInstant(round.dueDate, '00:00', round.bee.guild.timeZone);
      const until = dueStart.getTime() - now.getTime();
      if (until > 7 * DAY || until <= 0) continue;
      const blocks = await em.find(RoundBlock, { round, status: { $in: ['not_started', 'made'] } }, { populate: ['maker.user'] });
      for (const block of blocks)
        if (await em.transactional((tx: EntityManager) => this.mailer.remindDue(tx, round, block))) queued++;
    }
    return queued;
  }

  /** Edits to a sent round go out as one notice once 30 minutes pass without another edit. */
  private async sendChangeNotices(now: Date): Promise<number> {
    const quietSince = new Date(now.getTime() - CHANGE_BATCH_MS);
    const ids = await this.orm.em
      .fork()
      .find(Round, { sentAt: { $ne: null }, changePendingSince: { $ne: null }, lastEditedAt: { $lte: quietSince } }, { fields: ['id'] });
    let queued = 0;
    for (const { id } of ids) {
      queued += await this.orm.em.fork().transactional(async (em: EntityManager) => {
        const round = await em.findOneOrFail(Round, { id }, { populate: ['bee.guild', 'queen.user'], lockMode: LockMode.PESSIMISTIC_WRITE });
        if (!round.changePendingSince || !round.lastEditedAt || round.lastEditedAt > quietSince) return 0;
        const batch = round.changeBatch + 1;
        let n = 0;
        for (const maker of await this.mailer.makers(em, round)) if (await this.mailer.noticeChange(em, round, maker, batch)) n++;
        round.changeBatch = batch;
        round.changePendingSince = null;
        round.changedFields = [];
        await em.flush();
        return n;
      });
    }
    return queued;
  }
}
