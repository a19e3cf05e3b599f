import { EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { Cron } from '@nestjs/schedule';
import { DateTime } from 'luxon';
import { appConfig, type AppConfig } from '../config/app.config';
import { withNamedLock } from '../database/named-lock';
import { Guild } from '../guilds/guild.entity';
import type { EmailTemplateName } from '../mail/mail-templates';
import { OutboxMessage } from '../outbox/outbox-message.entity';
import { OutboxService } from '../outbox/outbox.service';
import { duesReminderFor, reminderKey, remindersMaySendAt, type DuesReminder, type ReminderKind } from './dues-reminders';
import { DuesRuleError, formatDate, todayIn } from './dues-rules';
import { DuesSettingsRecord } from './dues-settings.entity';
import { DuesStanding } from './dues-standing.entity';
import { loadSettings, rulePlan, settingsFromRecord, withTransaction } from './dues-support';
import { formatMoney } from './money';

export const DUES_REMINDERS_LOCK = 'selvage.dues-reminders';
/** Every 15 minutes: reminders go out the morning they fall due, and a missed run is soon made up. */
export const DUES_REMINDERS_CRON = '0 */15 * * * *';

export interface DuesRemindersReport {
  soon: number;
  lapsed: number;
}

/**
 * On unless DUES_REMINDERS_ENABLED=false; off by default under NODE_ENV=test, where tests call
 * tick(now) with a chosen clock instead (DUES_REMINDERS_ENABLED=true turns it back on).
 */
export function duesRemindersEnabled(env: NodeJS.ProcessEnv = process.env): boolean {
  const flag = env.DUES_REMINDERS_ENABLED;
  if (flag === 'true' || flag === 'false') return flag === 'true';
  return env.NODE_ENV !== 'test';
}

const TEMPLATES: Record<ReminderKind, EmailTemplateName> = { soon: 'dues-renewal-soon', lapsed: 'dues-lapsed' };
/** No one lapsed longer ago than this can be due a reminder (a year, the due date's six months and grace). */
const LOOK_BACK_DAYS = 800;

interface Candidate {
  standingId: number;
  membershipId: number;
  guildId: number;
  kind: ReminderKind;
  periodEnd: string;
  key: string;
}

/**
 * The dues reminders job: "your dues run out soon" and "your membership has lapsed", each once per
 * paid period (see dues-reminders.ts for who gets which and when). Every tick runs under a MariaDB
 * named lock, so however many api instances there are one of them does the work; each message is
 * written to the outbox in its own transaction with the member's standing row locked (the lock a
 * payment takes first), and its key names the event, so a repeat tick or a second instance never
 * sends it twice.
 */
@Injectable()
export class DuesRemindersService {
  private readonly logger = new Logger(DuesRemindersService.name);

  constructor(
    private readonly orm: MikroORM,
    private readonly outbox: OutboxService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  @Cron(DUES_REMINDERS_CRON, { name: 'dues-reminders', waitForCompletion: true })
  async scheduled(): Promise<void> {
    if (!duesRemindersEnabled()) return;
    try {
      const report = await this.tick(new Date());
      if (report && report.soon + report.lapsed > 0)
        this.logger.log(`dues reminders queued: ${report.soon} renewal, ${report.lapsed} lapsed`);
    } catch (e) {
      this.logger.error(`dues reminders failed: ${e instanceof Error ? e.stack : e}`);
    }
  }

  /** One pass over every guild at `now`; null when another instance holds the lock. */
  async tick(now: Date = new Date()): Promise<DuesRemindersReport | null> {
    const report: DuesRemindersReport = { soon: 0, lapsed: 0 };
    const ran = await withNamedLock(this.orm, DUES_REMINDERS_LOCK, async () => {
      const candidates = await this.candidates(now);
      if (candidates.length === 0) return;
      // Most candidates inside a window were reminded on an earlier tick: skip those without a transaction.
      const known = await this.orm.em
        .fork()
        .find(OutboxMessage, { idempotencyKey: { $in: candidates.map((c) => c.key) } }, { fields: ['idempotencyKey'] });
      const sent = new Set(known.map((m) => m.idempotencyKey));
      const treasurers = new Map<number, string>();
      for (const c of candidates) {
        if (sent.has(c.key)) continue;
        if (!treasurers.has(c.guildId)) treasurers.set(c.guildId, await this.treasurerName(c.guildId));
        if (await this.send(c, now, treasurers.get(c.guildId)!)) report[c.kind] += 1;
      }
    });
    return ran ? report : null;
  }

  /** Everyone due a reminder at `now`, decided without locks (send() decides again under the lock). */
  private async candidates(now: Date): Promise<Candidate[]> {
    const em = this.orm.em.fork();
    const cutoff = DateTime.fromJSDate(now, { zone: 'utc' }).minus({ days: LOOK_BACK_DAYS }).toISODate()!;
    const standings = await em.find(
      DuesStanding,
      { plan: { kind: { $in: ['standard', 'household'] } }, paidThrough: { $gte: cutoff }, membership: { status: 'active' } },
      { populate: ['plan', 'membership.guild'], orderBy: { id: 'asc' } },
    );
    if (standings.length === 0) return [];
    const guildIds = [...new Set(standings.map((s) => s.membership.guild.id))];
    const records = new Map((await em.find(DuesSettingsRecord, { guild: { $in: guildIds } })).map((r) => [r.guild.id, r]));

    const out: Candidate[] = [];
    const days = new Map<number, string | null>();
    for (const s of standings) {
      const guild: Guild = s.membership.guild;
      if (!days.has(guild.id)) days.set(guild.id, remindersMaySendAt(now, guild.timeZone) ? todayIn(guild.timeZone, now) : null);
      const today = days.get(guild.id);
      if (!today) continue;
      let reminder: DuesReminder | null;
      try {
        const settings = settingsFromRecord(guild, records.get(guild.id) ?? null);
        reminder = duesReminderFor({ plan: rulePlan(s.plan!), settings, today, paidThrough: s.paidThrough ?? null });
      } catch (e) {
        if (!(e instanceof DuesRuleError)) throw e;
        this.logger.warn(`dues reminder skipped for membership ${s.membership.id}: ${e.message}`);
        continue;
      }
      if (!reminder) continue;
      out.push({
        standingId: s.id,
        membershipId: s.membership.id,
        guildId: guild.id,
        kind: reminder.kind,
        periodEnd: reminder.periodEnd,
        key: reminderKey(reminder.kind, s.membership.id, reminder.periodEnd),
      });
    }
    return out;
  }

  private async treasurerName(guildId: number): Promise<string> {
    const rows: { name: string }[] = await this.orm.em.getConnection().execute(
      `SELECT u.name FROM memberships m JOIN users u ON u.id = m.user_id
       WHERE m.guild_id = ? AND m.status = 'active' AND JSON_CONTAINS(m.roles, '"treasurer"')
       ORDER BY m.id LIMIT 1`,
      [guildId],
    );
    return rows[0]?.name ?? '';
  }

  /**
   * Decides again with her standing row locked (a payment in flight either committed before, and she
   * is no longer due, or waits until this commits) and queues the message. False when nothing new went
   * into the outbox.
   */
  private async send(c: Candidate, now: Date, treasurerName: string): Promise<boolean> {
    return withTransaction(this.orm.em as unknown as EntityManager, async (tx) => {
      await tx.execute('SELECT id FROM dues_standings WHERE id = ? FOR UPDATE', [c.standingId]);
      const standing = await tx.findOne(
        DuesStanding,
        { id: c.standingId },
        { refresh: true, populate: ['plan', 'household', 'membership.user', 'membership.guild'] },
      );
      const membership = standing?.membership;
      if (!standing?.plan || !membership || membership.status !== 'active') return false;
      const email = membership.user.email?.trim();
      if (!email || !email.includes('@')) return false;
      const guild = membership.guild;
      const settings = await loadSettings(tx, guild);
      const [{ through }] = await tx.execute<{ through: string | null }[]>(
        `SELECT DATE_FORMAT(MAX(covers_through), '%Y-%m-%d') AS through FROM dues_invoices
         WHERE membership_id = ? AND status IN ('paid', 'partially_refunded')`,
        [membership.id],
      );
      const reminder = duesReminderFor({
        plan: rulePlan(standing.plan),
        settings,
        today: todayIn(guild.timeZone, now),
        paidThrough: standing.paidThrough ?? null,
        paidInvoicesThrough: through,
      });
      if (!reminder || reminder.kind !== c.kind || reminder.periodEnd !== c.periodEnd) return false;

      const { quote } = reminder;
      const money = (cents: number) => formatMoney(cents, quote.currency);
      const common = {
        name: membership.user.name,
        guildName: guild.name,
        yearLabel: reminder.yearLabel,
        totalText: money(quote.totalCents),
        paidThroughText: formatDate(reminder.periodEnd),
        duesUrl: `${this.app.origin}/guilds/${guild.id}/dues`,
        lines: quote.lines.map((l) => ({ label: l.label, amountText: money(l.amountCents) })),
        householdName: standing.plan.kind === 'household' ? (standing.household?.name ?? '') : '',
        treasurerName,
      };
      const context =
        reminder.kind === 'soon'
          ? {
              ...common,
              renewByText: formatDate(reminder.renewBy),
              graceEndsOnText: reminder.graceEndsOn ? formatDate(reminder.graceEndsOn) : '',
              lateFeeText: reminder.graceEndsOn && reminder.lateFeeCents > 0 ? money(reminder.lateFeeCents) : '',
            }
          : { ...common, lapsedOnText: formatDate(reminder.lapsedOn) };
      return this.outbox.enqueue(tx, { idempotencyKey: c.key, template: TEMPLATES[c.kind], to: email, context });
    });
  }
}
