import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { DateTime } from 'luxon';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { hasAnyRole } from '../guilds/roles';
import { User } from '../users/user.entity';
import { DuesInvoice } from './dues-invoice.entity';
import { DuesPlan } from './dues-plan.entity';
import {
  DuesRuleError,
  duesSettingsProblems,
  graceEndsOn,
  memberStanding,
  membershipYearAfter,
  membershipYearOf,
  quoteDues,
  renewalDueDate,
  renewalOpensOn,
  todayIn,
  validatePlan,
  type DuesQuote,
  type DuesSettings,
} from './dues-rules';
import { DuesSettingsRecord } from './dues-settings.entity';
import { DuesStanding } from './dues-standing.entity';
import { isJoining, loadSettings, lockStanding, money, NO_PLAN, planView, rulePlan, settingsFromRecord, withTransaction } from './dues-support';
import type { CreateHouseholdDto, CreatePlanDto, DuesSettingsDto, UpdateDuesMemberDto, UpdatePlanDto } from './dto/dues.dto';
import { Household } from './household.entity';
import { toCsv } from './csv';
import { MoneyAuditEntry } from './money-audit.entity';
import { writeAudit } from './money-audit';

const isTreasurer = (m: Membership) => hasAnyRole(m.roles, ['treasurer']);
const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** Settings, plans, households and each member's standing: everything about dues except the money. */
@Injectable()
export class DuesService {
  constructor(private readonly em: EntityManager) {}

  async actorName(me: Membership, em: EntityManager = this.em): Promise<string> {
    const user = await em.findOneOrFail(User, { id: me.user.id });
    return user.name;
  }

  // ---- settings ---------------------------------------------------------------------------------

  private settingsView(settings: DuesSettings, guild: Guild, configured: boolean) {
    const today = todayIn(guild.timeZone);
    const current = membershipYearOf(today, settings);
    const next = membershipYearAfter(current, settings);
    return {
      currency: settings.currency,
      yearStartMonth: settings.yearStartMonth,
      dueMonth: settings.dueMonth,
      dueDay: settings.dueDay,
      graceDays: settings.graceDays,
      lateFeeCents: settings.lateFeeCents,
      earlyRenewalDays: settings.earlyRenewalDays,
      proration: settings.proration,
      configured,
      today,
      currentYear: { label: current.label, startsOn: current.startsOn, endsOn: current.endsOn },
      dueOn: renewalDueDate(current, settings),
      graceEndsOn: graceEndsOn(current, settings),
      nextYear: {
        label: next.label,
        startsOn: next.startsOn,
        endsOn: next.endsOn,
        dueOn: renewalDueDate(next, settings),
        renewalOpensOn: renewalOpensOn(next, settings),
      },
    };
  }

  async getSettings(me: Membership) {
    const record = await this.em.findOne(DuesSettingsRecord, { guild: me.guild.id });
    return this.settingsView(settingsFromRecord(me.guild, record), me.guild, record !== null);
  }

  async putSettings(me: Membership, dto: DuesSettingsDto) {
    const actorName = await this.actorName(me);
    return withTransaction(this.em, async (tx) => {
      const guild = await tx.findOneOrFail(Guild, { id: me.guild.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      const currency = (dto.currency ?? guild.currency).toUpperCase();
      const next: DuesSettings = {
        currency,
        yearStartMonth: dto.yearStartMonth,
        dueMonth: dto.dueMonth,
        dueDay: dto.dueDay,
        graceDays: dto.graceDays,
        lateFeeCents: dto.lateFeeCents,
        earlyRenewalDays: dto.earlyRenewalDays ?? 60,
        proration: dto.proration.map((b) => ({ fromMonth: b.fromMonth, charge: b.charge, coversNextYear: b.coversNextYear })),
      };
      const problems = duesSettingsProblems(next);
      if (problems.length > 0) {
        const errors: Record<string, string[]> = {};
        for (const p of problems) (errors[p.field] ??= []).push(p.message);
        throw new BadRequestException({ message: 'Please check the highlighted fields.', errors });
      }
      if (currency !== guild.currency && (await tx.count(DuesInvoice, { guild: guild.id })) > 0)
        throw new BadRequestException({
          message: 'Please check the highlighted fields.',
          errors: { currency: [`The guild already has invoices in ${guild.currency}, so its currency cannot change.`] },
        });

      let record = await tx.findOne(DuesSettingsRecord, { guild: guild.id });
      const before = settingsFromRecord(guild, record);
      const columns = {
        yearStartMonth: next.yearStartMonth,
        dueMonth: next.dueMonth,
        dueDay: next.dueDay,
        graceDays: next.graceDays,
        lateFeeCents: next.lateFeeCents,
        earlyRenewalDays: next.earlyRenewalDays!,
        proration: next.proration,
      };
      if (!record) record = tx.create(DuesSettingsRecord, { guild, ...columns });
      else tx.assign(record, columns);
      guild.currency = currency;
      guild.yearStartMonth = next.yearStartMonth;
      const changed = (Object.keys(next) as (keyof DuesSettings)[]).filter((k) => JSON.stringify(before[k]) !== JSON.stringify(next[k]));
      writeAudit(tx, {
        guild,
        actor: me.id,
        actorName,
        action: 'settings_changed',
        subjectType: 'settings',
        subjectId: guild.id,
        summary: changed.length
          ? `Dues settings changed: ${changed.join(', ')}. Year from ${MONTH_NAMES[next.yearStartMonth - 1]}, due ${next.dueDay} ${MONTH_NAMES[next.dueMonth - 1]}, ${next.graceDays} days' grace, late fee ${money(next.lateFeeCents, currency)}.`
          : 'Dues settings saved without changes.',
        detail: { before, after: next },
      });
      await tx.flush();
      return this.settingsView(next, guild, true);
    });
  }

  // ---- plans ------------------------------------------------------------------------------------

  async listPlans(me: Membership) {
    const plans = await this.em.find(
      DuesPlan,
      isTreasurer(me) ? { guild: me.guild.id } : { guild: me.guild.id, active: true },
      { orderBy: { active: 'desc', yearlyCents: 'desc', name: 'asc' } },
    );
    return plans.map(planView);
  }

  private checkPlan(values: { name: string; kind: DuesPlan['kind']; yearlyCents: number; minAge?: number | null; maxAge?: number | null }) {
    const errors: Record<string, string[]> = {};
    const free = values.kind === 'lifetime' || values.kind === 'honorary';
    if (free && values.yearlyCents !== 0) errors.yearlyCents = ['Lifetime and honorary members pay no yearly dues: set 0.'];
    if (!free && values.yearlyCents <= 0) errors.yearlyCents = ['Yearly dues must be more than 0. For members who pay nothing, use an honorary plan.'];
    if (values.minAge != null && values.maxAge != null && values.minAge > values.maxAge)
      errors.maxAge = [`The highest age (${values.maxAge}) is below the lowest age (${values.minAge}).`];
    if (Object.keys(errors).length === 0) {
      const problems = validatePlan({ id: 0, ...values, minAge: values.minAge ?? undefined, maxAge: values.maxAge ?? undefined });
      if (problems.length) errors.name = problems;
    }
    if (Object.keys(errors).length) throw new BadRequestException({ message: 'Please check the highlighted fields.', errors });
  }

  async createPlan(me: Membership, dto: CreatePlanDto) {
    const values = { name: dto.name.trim(), kind: dto.kind, yearlyCents: dto.yearlyCents, minAge: dto.minAge ?? null, maxAge: dto.maxAge ?? null };
    this.checkPlan(values);
    const actorName = await this.actorName(me);
    return withTransaction(this.em, async (tx) => {
      if (await tx.count(DuesPlan, { guild: me.guild.id, name: values.name }))
        throw new ConflictException(`There is already a plan called "${values.name}". Choose another name.`);
      const plan = tx.create(DuesPlan, { guild: me.guild.id, ...values, active: dto.active ?? true });
      await tx.flush();
      writeAudit(tx, {
        guild: me.guild.id,
        actor: me.id,
        actorName,
        action: 'plan_created',
        subjectType: 'plan',
        subjectId: plan.id,
        summary: `Plan "${plan.name}" (${plan.kind}) created at ${money(plan.yearlyCents, me.guild.currency)} a year.`,
        detail: { plan: planView(plan) },
      });
      await tx.flush();
      return planView(plan);
    });
  }

  async updatePlan(me: Membership, planId: number, dto: UpdatePlanDto) {
    const actorName = await this.actorName(me);
    return withTransaction(this.em, async (tx) => {
      const plan = await tx.findOne(DuesPlan, { id: planId, guild: me.guild.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      if (!plan) throw new NotFoundException('No such plan in this guild.');
      const before = planView(plan);
      const values = {
        name: dto.name?.trim() ?? plan.name,
        kind: dto.kind ?? plan.kind,
        yearlyCents: dto.yearlyCents ?? plan.yearlyCents,
        minAge: dto.minAge !== undefined ? dto.minAge : (plan.minAge ?? null),
        maxAge: dto.maxAge !== undefined ? dto.maxAge : (plan.maxAge ?? null),
      };
      this.checkPlan(values);
      if (values.name !== plan.name && (await tx.count(DuesPlan, { guild: me.guild.id, name: values.name })))
        throw new ConflictException(`There is already a plan called "${values.name}". Choose another name.`);
      tx.assign(plan, { ...values, active: dto.active ?? plan.active });
      const after = planView(plan);
      const changed = (Object.keys(after) as (keyof typeof after)[]).filter((k) => before[k] !== after[k]);
      if (changed.length) {
        writeAudit(tx, {
          guild: me.guild.id,
          actor: me.id,
          actorName,
          action: 'plan_changed',
          subjectType: 'plan',
          subjectId: plan.id,
          summary:
            `Plan "${before.name}" changed: ` +
            changed.map((k) => (k === 'yearlyCents' ? `yearly dues ${money(before.yearlyCents, me.guild.currency)} → ${money(after.yearlyCents, me.guild.currency)}` : `${k} ${String(before[k])} → ${String(after[k])}`)).join(', ') +
            '. Existing invoices keep their amounts.',
          detail: { before, after },
        });
      }
      await tx.flush();
      return after;
    });
  }

  // ---- a member's own dues ------------------------------------------------------------------------

  /** The quote for this plan today, or null when the rules cannot make one (with the reason). */
  quoteFor(plan: DuesPlan, settings: DuesSettings, today: string, paidThrough: string | null): DuesQuote | null {
    try {
      return quoteDues({ plan: rulePlan(plan), settings, today, paidThrough, joining: isJoining(paidThrough, today, settings) });
    } catch (e) {
      if (e instanceof DuesRuleError) return null;
      throw e;
    }
  }

  standingOf(settings: DuesSettings, today: string, standing: DuesStanding | null) {
    const plan = standing?.plan ? rulePlan(standing.plan) : NO_PLAN;
    const paidThrough = standing?.paidThrough ?? null;
    const s = memberStanding({ plan, settings, today, paidThrough });
    return { status: s.status, statusEndsOn: s.endsOn, paidThrough };
  }

  async me(me: Membership) {
    const guild = me.guild;
    const settings = await loadSettings(this.em, guild);
    const today = todayIn(guild.timeZone);
    const standing = await this.em.findOne(DuesStanding, { membership: me.id }, { populate: ['plan', 'household'] });
    const { status, statusEndsOn, paidThrough } = this.standingOf(settings, today, standing);
    let household = null;
    if (standing?.household) {
      const members = await this.em.find(
        DuesStanding,
        { household: standing.household.id, membership: { status: 'active' } },
        { populate: ['membership.user'], orderBy: { membership: { user: { name: 'asc' } } } },
      );
      household = { id: standing.household.id, name: standing.household.name, members: members.map((m) => m.membership.user.name) };
    }
    const plan = standing?.plan ?? null;
    const invoices = await this.em.find(
      DuesInvoice,
      { membership: me.id, status: { $ne: 'void' } },
      { orderBy: { createdAt: 'desc', id: 'desc' }, populate: ['createdBy.user'] },
    );
    const open = invoices.find((i) => i.status === 'open' && i.purpose === 'dues');
    // What each plan she could pay for would cost her today, so the page can show the exact lines
    // whichever she picks (the payment makes the same quote again).
    const choices = await this.em.find(
      DuesPlan,
      { guild: guild.id, active: true, kind: { $in: ['standard', 'household'] } },
      { orderBy: { name: 'asc' } },
    );
    return {
      status,
      statusEndsOn,
      paidThrough,
      plan: plan ? planView(plan) : null,
      household,
      quote: plan ? this.quoteFor(plan, settings, today, paidThrough) : null,
      quotes: choices.map((p) => ({ planId: p.id, quote: this.quoteFor(p, settings, today, paidThrough) })),
      openInvoice: open ? { id: open.id } : null,
      history: invoices.map((i) => ({
        invoiceId: i.id,
        purpose: i.purpose,
        label: i.purpose === 'show_entry' ? `Entry fees: ${i.yearLabel}` : i.yearLabel,
        issuedOn: todayIn(guild.timeZone, i.createdAt),
        totalCents: i.totalCents,
        currency: i.currency,
        status: i.status,
        method: i.method ?? null,
        paidOn: i.paidOn ?? null,
        receiptNumber: i.receiptNumber ?? null,
        refundedCents: i.refundedCents,
        /** Cash and cheques: the officer who recorded the payment for her. */
        recordedBy: i.method && i.method !== 'card' && i.createdBy && i.createdBy.id !== me.id ? (i.createdBy.user?.name ?? null) : null,
      })),
    };
  }

  // ---- the treasurer's roster ---------------------------------------------------------------------

  private async rosterRows(em: EntityManager, guild: Guild, membershipIds?: number[]) {
    const settings = await loadSettings(em, guild);
    const today = todayIn(guild.timeZone);
    const memberships = await em.find(
      Membership,
      membershipIds ? { guild: guild.id, id: { $in: membershipIds } } : { guild: guild.id, status: 'active' },
      { populate: ['user'], orderBy: { user: { name: 'asc' } } },
    );
    const ids = memberships.map((m) => m.id);
    const standings = ids.length ? await em.find(DuesStanding, { membership: { $in: ids } }, { populate: ['plan', 'household'] }) : [];
    const open = ids.length ? await em.find(DuesInvoice, { membership: { $in: ids }, status: 'open', purpose: 'dues' }, { orderBy: { id: 'desc' } }) : [];
    return memberships.map((m) => {
      const st = standings.find((s) => s.membership.id === m.id) ?? null;
      const { status, statusEndsOn, paidThrough } = this.standingOf(settings, today, st);
      return {
        membershipId: m.id,
        name: m.user.name,
        email: m.user.email,
        status,
        statusEndsOn,
        paidThrough,
        planName: st?.plan?.name ?? null,
        plan: st?.plan ? { id: st.plan.id, name: st.plan.name, kind: st.plan.kind } : null,
        household: st?.household ? { id: st.household.id, name: st.household.name } : null,
        birthDate: st?.birthDate ?? null,
        openInvoiceId: open.find((i) => i.membership.id === m.id)?.id ?? null,
      };
    });
  }

  /** Everyone's standing for the treasurer; `statuses` keeps only those (e.g. grace and lapsed). */
  async roster(me: Membership, statuses: string[] = []) {
    const rows = await this.rosterRows(this.em, me.guild);
    return statuses.length ? rows.filter((r) => statuses.includes(r.status)) : rows;
  }

  async rosterCsv(me: Membership, statuses: string[] = []): Promise<string> {
    const rows = await this.roster(me, statuses);
    return toCsv(
      ['Name', 'E-mail', 'Plan', 'Household', 'Status', 'Status until', 'Paid through'],
      rows.map((r) => [r.name, r.email, r.planName, r.household?.name ?? null, r.status, r.statusEndsOn, r.paidThrough]),
    );
  }

  async updateMember(me: Membership, membershipId: number, dto: UpdateDuesMemberDto) {
    const actorName = await this.actorName(me);
    return withTransaction(this.em, async (tx) => {
      const target = await tx.findOne(Membership, { id: membershipId, guild: me.guild.id }, { populate: ['user'] });
      if (!target) throw new NotFoundException('That member is not in this guild.');
      const standing = await lockStanding(tx, target.id);
      const errors: Record<string, string[]> = {};
      let plan: DuesPlan | null | undefined;
      if (dto.planId !== undefined) {
        plan = dto.planId === null ? null : await tx.findOne(DuesPlan, { id: dto.planId, guild: me.guild.id });
        if (plan === null && dto.planId !== null) errors.planId = ['Choose a plan of this guild.'];
      }
      let household: Household | null | undefined;
      if (dto.householdId !== undefined) {
        household = dto.householdId === null ? null : await tx.findOne(Household, { id: dto.householdId, guild: me.guild.id });
        if (household === null && dto.householdId !== null) errors.householdId = ['Choose a household of this guild.'];
      }
      if (dto.birthDate && !DateTime.fromISO(dto.birthDate, { zone: 'utc' }).isValid) errors.birthDate = ['That date does not exist.'];
      else if (dto.birthDate && dto.birthDate > todayIn(me.guild.timeZone)) errors.birthDate = ['A date of birth cannot be in the future.'];
      if (Object.keys(errors).length) throw new BadRequestException({ message: 'Please check the highlighted fields.', errors });

      const beforePlan = standing.plan ? standing.plan.name : null;
      if (plan !== undefined) standing.plan = plan;
      if (household !== undefined) standing.household = household;
      if (dto.birthDate !== undefined) standing.birthDate = dto.birthDate;
      const afterPlan = standing.plan ? standing.plan.name : null;
      const householdNote = household !== undefined ? ` Household: ${household ? household.name : 'none'}.` : '';
      if (beforePlan !== afterPlan || household !== undefined) {
        writeAudit(tx, {
          guild: me.guild.id,
          actor: me.id,
          actorName,
          action: 'member_plan_changed',
          subjectType: 'membership',
          subjectId: target.id,
          summary: `${target.user.name}: plan ${beforePlan ?? 'none'} → ${afterPlan ?? 'none'}.${householdNote}`,
          detail: { membershipId: target.id, planBefore: beforePlan, planAfter: afterPlan, householdId: standing.household?.id ?? null },
        });
      }
      await tx.flush();
      const [row] = await this.rosterRows(tx, me.guild, [target.id]);
      return row;
    });
  }

  // ---- households -------------------------------------------------------------------------------

  async households(me: Membership) {
    const households = await this.em.find(Household, { guild: me.guild.id }, { orderBy: { name: 'asc' } });
    const members = households.length
      ? await this.em.find(DuesStanding, { household: { $in: households.map((h) => h.id) } }, { populate: ['membership.user'] })
      : [];
    return households.map((h) => ({
      id: h.id,
      name: h.name,
      members: members
        .filter((m) => m.household?.id === h.id)
        .map((m) => ({ membershipId: m.membership.id, name: m.membership.user.name }))
        .sort((a, b) => a.name.localeCompare(b.name)),
    }));
  }

  async createHousehold(me: Membership, dto: CreateHouseholdDto) {
    const name = dto.name.trim();
    const actorName = await this.actorName(me);
    return withTransaction(this.em, async (tx) => {
      if (await tx.count(Household, { guild: me.guild.id, name }))
        throw new ConflictException(`There is already a household called "${name}".`);
      const h = tx.create(Household, { guild: me.guild.id, name });
      await tx.flush();
      writeAudit(tx, {
        guild: me.guild.id,
        actor: me.id,
        actorName,
        action: 'household_created',
        subjectType: 'household',
        subjectId: h.id,
        summary: `Household "${name}" created.`,
      });
      await tx.flush();
      return { id: h.id, name: h.name, members: [] };
    });
  }

  // ---- the audit log ----------------------------------------------------------------------------

  async audit(me: Membership, limit = 100) {
    const rows = await this.em.find(MoneyAuditEntry, { guild: me.guild.id }, { orderBy: { at: 'desc', id: 'desc' }, limit });
    return rows.map((r) => ({
      id: r.id,
      at: r.at.toISOString(),
      actor: r.actorName,
      action: r.action,
      subjectType: r.subjectType,
      subjectId: r.subjectId ?? null,
      summary: r.summary,
    }));
  }
}
