import type { EntityManager } from '@mikro-orm/mariadb';
import { Guild } from '../guilds/guild.entity';
export { withTransaction } from '../database/transaction';
import { DuesPlan } from './dues-plan.entity';
import {
  DEFAULT_EARLY_RENEWAL_DAYS,
  formatDate,
  membershipYearStarting,
  membershipYearOf,
  type DuesSettings,
  type IsoDate,
  type Plan,
} from './dues-rules';
import { DuesSettingsRecord } from './dues-settings.entity';
import { DuesStanding } from './dues-standing.entity';
import { formatMoney } from './money';

/** What a guild without saved settings uses: its own year, due on the first day, 30 days' grace, no fee. */
export function defaultSettings(guild: Guild): DuesSettings {
  return {
    currency: guild.currency,
    yearStartMonth: guild.yearStartMonth,
    dueMonth: guild.yearStartMonth,
    dueDay: 1,
    graceDays: 30,
    lateFeeCents: 0,
    proration: [],
    earlyRenewalDays: DEFAULT_EARLY_RENEWAL_DAYS,
  };
}

export function settingsFromRecord(guild: Guild, r: DuesSettingsRecord | null): DuesSettings {
  if (!r) return defaultSettings(guild);
  return {
    currency: guild.currency,
    yearStartMonth: r.yearStartMonth,
    dueMonth: r.dueMonth,
    dueDay: r.dueDay,
    graceDays: r.graceDays,
    lateFeeCents: r.lateFeeCents,
    proration: r.proration,
    earlyRenewalDays: r.earlyRenewalDays,
  };
}

export async function loadSettings(em: EntityManager, guild: Guild): Promise<DuesSettings> {
  return settingsFromRecord(guild, await em.findOne(DuesSettingsRecord, { guild: guild.id }));
}

/** The plan as the pure rules take it. */
export function rulePlan(p: DuesPlan): Plan {
  return {
    id: p.id,
    name: p.name,
    kind: p.kind,
    yearlyCents: p.yearlyCents,
    minAge: p.minAge ?? undefined,
    maxAge: p.maxAge ?? undefined,
  };
}

/** Stands in for "no plan chosen yet" when working out a standing: an ordinary paying member. */
export const NO_PLAN: Plan = { id: 0, name: 'No plan', kind: 'standard', yearlyCents: 0 };

/**
 * A member pays as a joiner (proration, never a late fee) when she has never paid, or paid for
 * neither last year nor this one; otherwise she renews (late fee after the grace period).
 */
export function isJoining(paidThrough: IsoDate | null, today: IsoDate, settings: DuesSettings): boolean {
  if (paidThrough === null) return true;
  const current = membershipYearOf(today, settings);
  return paidThrough < membershipYearStarting(current.startYear - 1, settings).startsOn;
}

export function planView(p: DuesPlan) {
  return { id: p.id, name: p.name, kind: p.kind, yearlyCents: p.yearlyCents, minAge: p.minAge ?? null, maxAge: p.maxAge ?? null, active: p.active };
}

export const money = (cents: number, currency: string) => formatMoney(cents, currency);

export function periodText(from: IsoDate | null | undefined, through: IsoDate | null | undefined, purpose: 'dues' | 'show_entry' = 'dues', label = ''): string {
  if (purpose === 'show_entry') return `quilt entry fees for ${label}`;
  if (from && through) return `${formatDate(from)} to ${formatDate(through)}`;
  if (through) return `through ${formatDate(through)}`;
  return 'membership dues';
}

/**
 * Locks the member's standing row (creating it first if she has none) for the rest of the
 * transaction. INSERT … ON DUPLICATE KEY UPDATE takes an exclusive lock even when the row exists,
 * so two transactions never both hold a shared lock and then deadlock upgrading it.
 */
export async function lockStanding(tx: EntityManager, membershipId: number): Promise<DuesStanding> {
  const now = new Date();
  await tx.execute(
    'INSERT INTO dues_standings (created_at, updated_at, membership_id) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE membership_id = membership_id',
    [now, now, membershipId],
    'run',
  );
  const rows: { id: number }[] = await tx.execute('SELECT id FROM dues_standings WHERE membership_id = ? FOR UPDATE', [membershipId]);
  return tx.findOneOrFail(DuesStanding, { id: rows[0].id }, { refresh: true, populate: ['plan', 'household'] });
}

