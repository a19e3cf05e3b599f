import { EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { withNamedLock } from '../database/named-lock';
import { withTransaction } from '../database/transaction';
import { formatDate, todayIn } from '../dues/dues-rules';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { ROLE_LABELS, ROLES, type Role } from '../guilds/roles';
import type { CreateTermDto } from './dto/create-term.dto';
import type { HandoverDto } from './dto/handover.dto';
import type { UpdateTermDto } from './dto/update-term.dto';
import { guildOutOfSync, syncGuildTerms } from './office-sync';
import { OfficeTerm } from './office-term.entity';
import { changeLeavesNoAdmin, termCovers, termsOverlap, type TermSpan } from './terms';

export const OFFICES_SYNC_LOCK = 'selvage.offices-sync';

/** The hourly sweep is on unless OFFICES_SYNC_ENABLED=false; off by default under NODE_ENV=test, where tests call sweep(now). */
export function officesSweepEnabled(env: NodeJS.ProcessEnv = process.env): boolean {
  const flag = env.OFFICES_SYNC_ENABLED;
  if (flag === 'true' || flag === 'false') return flag === 'true';
  return env.NODE_ENV !== 'test';
}

export interface TermView {
  id: number;
  role: Role;
  roleLabel: string;
  membershipId: number;
  name: string;
  startsOn: string;
  endsOn: string | null;
  note: string;
  recordedBy: { membershipId: number; name: string } | null;
  createdAt: Date;
}

type Loaded = { memberships: Membership[]; terms: OfficeTerm[] };

const bad = (field: string, message: string) => new BadRequestException({ message, errors: { [field]: [message] } });
const span = (t: TermSpan): string => (t.endsOn ? `from ${formatDate(t.startsOn)} until ${formatDate(t.endsOn)}` : `from ${formatDate(t.startsOn)} with no end date`);

/**
 * Offices and their terms: who holds which office and for how long, handovers, and the history.
 * Every change runs in one transaction with the guild's memberships locked, then brings
 * `memberships.roles` (the roles in force today) in line.
 */
@Injectable()
export class OfficesService {
  private readonly logger = new Logger(OfficesService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly orm: MikroORM,
  ) {}

  /** Every office with who holds it today and who is due to take it on. */
  async offices(viewer: Membership) {
    const today = todayIn(viewer.guild.timeZone);
    const em = this.em.fork();
    let memberships = await em.find(Membership, { guild: viewer.guild.id }, { populate: ['user'] });
    let terms = await em.find(OfficeTerm, { guild: viewer.guild.id }, { orderBy: { id: 'asc' } });
    if (guildOutOfSync(memberships, terms, today))
      ({ memberships, terms } = await withTransaction(this.em, (tx) => syncGuildTerms(tx, viewer.guild.id, today)));
    const names = nameMap(memberships);
    const active = new Set(memberships.filter((m) => m.status === 'active').map((m) => m.id));
    const view = (t: OfficeTerm) => termView(t, names);
    return {
      today,
      offices: ROLES.map((role) => {
        const mine = terms.filter((t) => t.role === role && active.has(t.membership.id));
        return {
          role,
          label: ROLE_LABELS[role],
          holders: mine.filter((t) => termCovers(t, today)).sort(byStart).map(view),
          upcoming: mine.filter((t) => t.startsOn > today).sort(byStart).map(view),
        };
      }),
    };
  }

  /** Every term the guild has recorded, newest first, with who recorded it. */
  async history(viewer: Membership) {
    const em = this.em.fork();
    const memberships = await em.find(Membership, { guild: viewer.guild.id }, { populate: ['user'] });
    const terms = await em.find(OfficeTerm, { guild: viewer.guild.id }, { orderBy: { startsOn: 'desc', id: 'desc' } });
    const names = nameMap(memberships);
    return { today: todayIn(viewer.guild.timeZone), terms: terms.map((t) => termView(t, names)) };
  }

  async createTerm(viewer: Membership, dto: CreateTermDto): Promise<TermView> {
    const endsOn = dto.endsOn ?? null;
    if (endsOn !== null && endsOn <= dto.startsOn) throw bad('endsOn', 'Access must end after the first day in office.');
    const today = todayIn(viewer.guild.timeZone);
    return withTransaction(this.em, async (tx) => {
      const loaded = await syncGuildTerms(tx, viewer.guild.id, today);
      const target = this.activeMember(loaded, dto.membershipId);
      const candidate = { startsOn: dto.startsOn, endsOn };
      this.refuseOverlap(loaded, target, dto.role, candidate);
      const term = tx.create(OfficeTerm, {
        guild: viewer.guild.id,
        membership: target,
        role: dto.role,
        startsOn: dto.startsOn,
        endsOn,
        note: dto.note?.trim() ?? '',
        recordedBy: viewer.id,
      });
      await tx.flush();
      const after = await syncGuildTerms(tx, viewer.guild.id, today);
      return termView(term, nameMap(after.memberships));
    });
  }

  async updateTerm(viewer: Membership, termId: number, dto: UpdateTermDto): Promise<TermView> {
    const today = todayIn(viewer.guild.timeZone);
    return withTransaction(this.em, async (tx) => {
      const loaded = await syncGuildTerms(tx, viewer.guild.id, today);
      const term = loaded.terms.find((t) => t.id === termId);
      if (!term) throw new NotFoundException('No such term in this guild.');
      const next = {
        startsOn: dto.startsOn ?? term.startsOn,
        endsOn: dto.endsOn === undefined ? term.endsOn : dto.endsOn,
      };
      if (next.endsOn !== null && next.endsOn <= next.startsOn)
        throw bad(dto.endsOn !== undefined ? 'endsOn' : 'startsOn', 'Access must end after the first day in office.');
      const holder = loaded.memberships.find((m) => m.id === term.membership.id)!;
      this.refuseOverlap(loaded, holder, term.role, next, term.id);
      if (term.role === 'admin') this.refuseAdminGap(loaded, today, (t) => (t.id === term.id ? next : t));
      term.startsOn = next.startsOn;
      term.endsOn = next.endsOn;
      if (dto.note !== undefined) term.note = dto.note?.trim() ?? '';
      await tx.flush();
      const after = await syncGuildTerms(tx, viewer.guild.id, today);
      return termView(term, nameMap(after.memberships));
    });
  }

  /** Ends the outgoing term on `on` and opens the incoming one that day, in one transaction. */
  async handover(viewer: Membership, dto: HandoverDto) {
    const today = todayIn(viewer.guild.timeZone);
    if (dto.on < today) throw bad('on', `Choose today (${formatDate(today)}) or a later date.`);
    if (dto.fromMembershipId === dto.toMembershipId) throw bad('toMembershipId', 'Choose someone other than the outgoing officer.');
    const label = ROLE_LABELS[dto.role];
    return withTransaction(this.em, async (tx) => {
      const loaded = await syncGuildTerms(tx, viewer.guild.id, today);
      const from = loaded.memberships.find((m) => m.id === dto.fromMembershipId);
      if (!from) throw new NotFoundException('The outgoing officer is not in this guild.');
      const to = this.activeMember(loaded, dto.toMembershipId);
      const outgoing = loaded.terms.find(
        (t) => t.membership.id === from.id && t.role === dto.role && t.startsOn <= dto.on && (t.endsOn === null || t.endsOn > dto.on),
      );
      if (!outgoing)
        throw new ConflictException(`${from.user.name} holds no ${label} term that runs past ${formatDate(dto.on)}, so there is nothing to hand over.`);
      const incoming = { startsOn: dto.on, endsOn: null };
      this.refuseOverlap(loaded, to, dto.role, incoming);
      if (dto.role === 'admin')
        this.refuseAdminGap(loaded, today, (t) => (t.id === outgoing.id ? { startsOn: t.startsOn, endsOn: dto.on } : t), [incoming]);
      outgoing.endsOn = dto.on;
      const note = dto.note?.trim() || `Handed over by ${from.user.name}`;
      const started = tx.create(OfficeTerm, { guild: viewer.guild.id, membership: to, role: dto.role, startsOn: dto.on, note, recordedBy: viewer.id });
      await tx.flush();
      const after = await syncGuildTerms(tx, viewer.guild.id, today);
      const names = nameMap(after.memberships);
      return { ended: termView(outgoing, names), started: termView(started, names) };
    });
  }

  /**
   * Brings the roles in line with the terms on `today` for one guild. The guard and the sweep use
   * the real date; tests pass another day to see a handover take effect.
   */
  async syncGuild(guildId: number, today: string): Promise<void> {
    await withTransaction(this.em, (tx) => syncGuildTerms(tx, guildId, today));
  }

  @Cron(CronExpression.EVERY_HOUR, { name: 'offices-sync', waitForCompletion: true })
  async scheduled(): Promise<void> {
    if (!officesSweepEnabled()) return;
    try {
      await this.sweep(new Date());
    } catch (e) {
      this.logger.error(`offices sync failed: ${e instanceof Error ? e.stack : e}`);
    }
  }

  /** Every guild's roles brought in line with its own date at `now`; false when another instance holds the lock. */
  async sweep(now: Date = new Date()): Promise<boolean> {
    return withNamedLock(this.orm, OFFICES_SYNC_LOCK, async () => {
      const guilds = await this.orm.em.fork().find(Guild, {}, { fields: ['id', 'timeZone'] });
      for (const g of guilds) await withTransaction(this.orm.em.fork() as EntityManager, (tx) => syncGuildTerms(tx, g.id, todayIn(g.timeZone, now)));
    });
  }

  private activeMember(loaded: Loaded, membershipId: number): Membership {
    const m = loaded.memberships.find((x) => x.id === membershipId);
    if (!m) throw new NotFoundException('That member is not in this guild.');
    if (m.status !== 'active') throw new ConflictException(`${m.user.name} is no longer an active member of this guild.`);
    return m;
  }

  private refuseOverlap(loaded: Loaded, holder: Membership, role: Role, candidate: TermSpan, ignoreId?: number): void {
    const clash = loaded.terms.find((t) => t.id !== ignoreId && t.membership.id === holder.id && t.role === role && termsOverlap(t, candidate));
    if (clash)
      throw new ConflictException(
        `${holder.user.name} already holds ${ROLE_LABELS[role]} ${span(clash)}, which overlaps. Change that term's dates first.`,
      );
  }

  /** 409 when the change leaves a day from today on with no admin in office. */
  private refuseAdminGap(loaded: Loaded, today: string, change: (t: OfficeTerm) => TermSpan, extra: TermSpan[] = []): void {
    const active = new Set(loaded.memberships.filter((m) => m.status === 'active').map((m) => m.id));
    const admin = loaded.terms.filter((t) => t.role === 'admin' && active.has(t.membership.id));
    const gap = changeLeavesNoAdmin(admin, [...admin.map(change), ...extra], today);
    if (gap)
      throw new ConflictException(
        `The guild would have no admin from ${formatDate(gap)}. A guild must keep at least one admin: give someone else the admin office first.`,
      );
  }
}

function nameMap(memberships: readonly Membership[]): Map<number, string> {
  return new Map(memberships.map((m) => [m.id, m.user.name]));
}

const byStart = (a: TermSpan, b: TermSpan) => (a.startsOn < b.startsOn ? -1 : a.startsOn > b.startsOn ? 1 : 0);

export function termView(t: OfficeTerm, names: Map<number, string>): TermView {
  const recorder = t.recordedBy?.id ?? null;
  return {
    id: t.id,
    role: t.role,
    roleLabel: ROLE_LABELS[t.role],
    membershipId: t.membership.id,
    name: names.get(t.membership.id) ?? '',
    startsOn: t.startsOn,
    endsOn: t.endsOn,
    note: t.note,
    recordedBy: recorder === null ? null : { membershipId: recorder, name: names.get(recorder) ?? '' },
    createdAt: t.createdAt,
  };
}
