import type { EntityManager } from '@mikro-orm/core';
import { DateTime } from 'luxon';
import { DuesInvoice, type InvoiceLine, type PaymentMethod } from '../../dues/dues-invoice.entity';
import { DuesPayment } from '../../dues/dues-payment.entity';
import { DuesPlan } from '../../dues/dues-plan.entity';
import { DuesRefund } from '../../dues/dues-refund.entity';
import { membershipYearOf, quoteDues, todayIn, type DuesSettings, type PlanKind } from '../../dues/dues-rules';
import { DuesSettingsRecord } from '../../dues/dues-settings.entity';
import { DuesStanding } from '../../dues/dues-standing.entity';
import { isJoining, money, rulePlan } from '../../dues/dues-support';
import { Household } from '../../dues/household.entity';
import { MoneyAuditEntry } from '../../dues/money-audit.entity';
import { PAYMENT_SERVICE } from '../../dues/money-audit';
import { percentOfCents } from '../../dues/money';
import { ReceiptCounter } from '../../dues/receipt-counter.entity';
import type { Guild } from '../../guilds/guild.entity';
import type { Membership } from '../../guilds/membership.entity';

/**
 * Wrenfield's dues rules. A calendar year due on 1 January with a grace period and a $5 late fee, and
 * half dues for members who join from July to December, are all rules guilds publish (TRADE.md §4.3,
 * S65: calendar year due 1 January, delinquent after January; §4.4, S57: half dues for Jul–Dec joiners
 * and a late fee; grace periods are common, S66). The 31 days' grace runs to 1 February.
 */
export const WRENFIELD_DUES: Omit<DuesSettings, 'currency'> = {
  yearStartMonth: 1,
  dueMonth: 1,
  dueDay: 1,
  graceDays: 31,
  lateFeeCents: 500,
  earlyRenewalDays: 60,
  proration: [
    { fromMonth: 1, charge: 'full', coversNextYear: false },
    { fromMonth: 7, charge: 'half', coversNextYear: false },
  ],
};

/** $30 regular and $15 junior dues are amounts guilds charge (TRADE.md §4.1, S55–S60); §4.2 for the rest. */
const PLANS: { key: string; name: string; kind: PlanKind; yearlyCents: number; maxAge?: number }[] = [
  { key: 'regular', name: 'Regular', kind: 'standard', yearlyCents: 3000 },
  { key: 'junior', name: 'Junior', kind: 'standard', yearlyCents: 1500, maxAge: 17 },
  { key: 'household', name: 'Household', kind: 'household', yearlyCents: 4500 },
  { key: 'lifetime', name: 'Lifetime', kind: 'lifetime', yearlyCents: 0 },
  { key: 'honorary', name: 'Honorary', kind: 'honorary', yearlyCents: 0 },
];

interface DemoPayment {
  who: string;
  /** Guild-local date, or a function of the current year Y. */
  on: string;
  method: PaymentMethod;
  /** Paid by someone else in her household: the invoice is the payer's, the standing is shared. */
  refund?: { cents: number; on: string; reason: string };
}

const d = (year: number, monthDay: string) => `${year}-${monthDay}`;

/**
 * A dues history for the invented Wrenfield guild, relative to today: two years of renewals by card,
 * cash and cheque, one late payment with its late fee partly refunded, a half-year joiner, a
 * household, a junior, a lifetime and an honorary member, one member who has not renewed this year
 * (in grace during January, lapsed after) and one who stopped paying a while ago. Only payments on
 * or before today are written, so the demo reads right on any date.
 */
export async function seedDemoDues(em: EntityManager, guild: Guild, members: Map<string, Membership>, now = new Date()): Promise<void> {
  const zone = guild.timeZone;
  const today = todayIn(zone, now);
  const Y = Number(today.slice(0, 4));
  const settings: DuesSettings = { ...WRENFIELD_DUES, currency: guild.currency };
  const start = DateTime.fromISO(d(Y - 2, '11-01T09:00'), { zone }).toJSDate();
  const doreen = members.get('doreen@wrenfield.example')!;
  const doreenName = 'Doreen Achterberg';

  guild.yearStartMonth = WRENFIELD_DUES.yearStartMonth;
  em.create(DuesSettingsRecord, { guild, ...WRENFIELD_DUES, earlyRenewalDays: WRENFIELD_DUES.earlyRenewalDays! });
  const audit = (at: Date, data: Partial<MoneyAuditEntry> & Pick<MoneyAuditEntry, 'action' | 'subjectType' | 'summary'>) =>
    em.create(MoneyAuditEntry, { guild, actor: doreen, actorName: doreenName, detail: {}, at, ...data });
  audit(start, {
    action: 'settings_changed',
    subjectType: 'settings',
    subjectId: guild.id,
    summary: `Dues settings saved: calendar year, due 1 January, 31 days' grace, late fee ${money(500, guild.currency)}, half dues for July–December joiners.`,
    detail: { after: settings },
  });
  const plans = new Map<string, DuesPlan>();
  for (const p of PLANS) {
    const plan = em.create(DuesPlan, { guild, name: p.name, kind: p.kind, yearlyCents: p.yearlyCents, maxAge: p.maxAge ?? null });
    plans.set(p.key, plan);
  }
  await em.flush();
  for (const plan of plans.values())
    audit(start, {
      action: 'plan_created',
      subjectType: 'plan',
      subjectId: plan.id,
      summary: `Plan "${plan.name}" (${plan.kind}) created at ${money(plan.yearlyCents, guild.currency)} a year.`,
    });

  const household = em.create(Household, { guild, name: 'Mill Row household' });
  const standings = new Map<string, DuesStanding>();
  const special: Record<string, { plan: string; paidThrough: string | null; birthDate?: string; household?: boolean }> = {
    'lottie@wrenfield.example': { plan: 'lifetime', paidThrough: null },
    'zelda@wrenfield.example': { plan: 'honorary', paidThrough: null },
    'clementine@wrenfield.example': { plan: 'junior', paidThrough: d(Y - 2, '12-31'), birthDate: d(Y - 14, '04-12') },
    'winifred@wrenfield.example': { plan: 'household', paidThrough: d(Y - 2, '12-31'), household: true },
    'yvonne@wrenfield.example': { plan: 'household', paidThrough: d(Y - 2, '12-31'), household: true },
    'opal@wrenfield.example': { plan: 'regular', paidThrough: null },
    'maureen@wrenfield.example': { plan: 'regular', paidThrough: null },
  };
  for (const [email, membership] of members) {
    const s = special[email] ?? { plan: 'regular', paidThrough: d(Y - 2, '12-31') };
    standings.set(
      email,
      em.create(DuesStanding, {
        membership,
        plan: plans.get(s.plan)!,
        household: s.household ? household : null,
        paidThrough: s.paidThrough,
        birthDate: s.birthDate ?? null,
      }),
    );
  }

  // Who paid when. Renewals mostly come in December; a few in early January.
  const schedule: DemoPayment[] = [
    { who: 'hazel', on: d(Y - 2, '12-04'), method: 'card' },
    { who: 'hazel', on: d(Y - 1, '11-20'), method: 'card' },
    { who: 'hazel', on: d(Y, '11-12'), method: 'card' },
    { who: 'doreen', on: d(Y - 2, '12-10'), method: 'cash' },
    { who: 'doreen', on: d(Y - 1, '12-09'), method: 'cheque' },
    { who: 'doreen', on: d(Y, '11-18'), method: 'cash' },
    { who: 'priya', on: d(Y - 2, '12-15'), method: 'card' },
    { who: 'priya', on: d(Y, '02-20'), method: 'card', refund: { cents: 500, on: d(Y, '02-24'), reason: 'Late fee waived: she was in hospital over New Year.' } },
    { who: 'june', on: d(Y - 2, '12-12'), method: 'cheque' },
    // June has not renewed this year (in grace during January, lapsed after), so on any date the demo
    // has a member who owes and can pay online.
    { who: 'agnes', on: d(Y - 2, '12-20'), method: 'cash' },
    { who: 'agnes', on: d(Y - 1, '12-03'), method: 'card' },
    { who: 'clementine', on: d(Y - 2, '12-18'), method: 'cash' },
    { who: 'clementine', on: d(Y - 1, '12-14'), method: 'cash' },
    { who: 'winifred', on: d(Y - 2, '12-08'), method: 'cheque' },
    { who: 'yvonne', on: d(Y - 1, '12-06'), method: 'card' },
    { who: 'maureen', on: d(Y - 1, '03-09'), method: 'cash' },
    { who: 'maureen', on: d(Y - 1, '12-20'), method: 'cheque' },
    { who: 'opal', on: d(Y, '07-14'), method: 'card' },
  ];
  const named = new Set([...schedule.map((p) => p.who), 'lottie', 'zelda', 'bernadette']);
  const methods: PaymentMethod[] = ['card', 'card', 'cash', 'cheque'];
  [...members.keys()]
    .map((email) => email.split('@')[0])
    .filter((who) => !named.has(who))
    .forEach((who, i) => {
      const day = String(1 + ((i * 7) % 28)).padStart(2, '0');
      schedule.push({ who, on: d(Y - 2, `12-${day}`), method: methods[i % 4] });
      // Most renew in December; every fifth in the first days of January.
      schedule.push({ who, on: i % 5 === 4 ? d(Y, `01-${String(2 + (i % 20)).padStart(2, '0')}`) : d(Y - 1, `12-${day}`), method: methods[(i + 1) % 4] });
    });

  const due = schedule.filter((p) => p.on <= today).sort((a, b) => (a.on < b.on ? -1 : a.on > b.on ? 1 : a.who.localeCompare(b.who)));
  const counters = new Map<number, number>();
  let cheque = 301;
  let cardRef = 1;
  for (const [i, p] of due.entries()) {
    const email = `${p.who}@wrenfield.example`;
    const membership = members.get(email);
    const standing = standings.get(email);
    if (!membership || !standing?.plan) continue;
    const plan = standing.plan;
    const paidThrough = standing.paidThrough ?? null;
    const quote = quoteDues({ plan: rulePlan(plan), settings, today: p.on, paidThrough, joining: isJoining(paidThrough, p.on, settings) });
    if (quote.totalCents === 0 || !quote.coversThrough) continue;
    const paidAt = DateTime.fromISO(`${p.on}T10:00`, { zone }).plus({ minutes: i }).toJSDate();
    const year = Number(p.on.slice(0, 4));
    const n = (counters.get(year) ?? 0) + 1;
    counters.set(year, n);
    const receiptNumber = `${year}-${String(n).padStart(4, '0')}`;
    const first = membershipYearOf(quote.coversFrom ?? quote.coversThrough, settings).label;
    const last = membershipYearOf(quote.coversThrough, settings).label;
    const lines: InvoiceLine[] = quote.lines.map((l) => ({ kind: l.kind, label: l.label, amountCents: l.amountCents }));
    const chequeNumber = p.method === 'cheque' ? String(cheque++) : null;
    const invoice = em.create(DuesInvoice, {
      guild,
      membership,
      plan,
      planName: plan.name,
      yearLabel: first === last ? last : `${first} and ${last}`,
      coversFrom: quote.coversFrom,
      coversThrough: quote.coversThrough,
      lines,
      totalCents: quote.totalCents,
      currency: guild.currency,
      status: 'paid',
      paidAt,
      paidOn: p.on,
      method: p.method,
      chequeNumber,
      receiptNumber,
      priorPaidThrough: paidThrough,
      createdBy: p.method === 'card' ? null : doreen,
      createdAt: paidAt,
      updatedAt: paidAt,
    });
    const fee = p.method === 'card' ? percentOfCents(quote.totalCents, 290) + 30 : 0;
    const ref = cardRef++;
    const payment = em.create(DuesPayment, {
      invoice,
      guild,
      method: p.method,
      amountCents: quote.totalCents,
      feeCents: fee,
      netCents: quote.totalCents - fee,
      paymentIntentId: p.method === 'card' ? `pi_demo_${guild.id}_${ref}` : null,
      chargeId: p.method === 'card' ? `ch_demo_${guild.id}_${ref}` : null,
      cardBrand: p.method === 'card' ? 'visa' : null,
      cardLast4: p.method === 'card' ? '4242' : null,
      chequeNumber,
      paidAt,
      recordedBy: p.method === 'card' ? null : doreen,
    });
    await em.flush();
    // A household plan covers the whole household.
    const covered = plan.kind === 'household' ? [...standings.values()].filter((s) => s.household === standing.household) : [standing];
    for (const s of covered) s.paidThrough = quote.coversThrough > (s.paidThrough ?? '') ? quote.coversThrough : s.paidThrough;
    const name = membership.user.name;
    const how = p.method === 'card' ? 'Card payment' : p.method === 'cash' ? 'Cash payment' : `Cheque no. ${chequeNumber}`;
    audit(paidAt, {
      actor: p.method === 'card' ? null : doreen,
      actorName: p.method === 'card' ? PAYMENT_SERVICE : doreenName,
      action: p.method === 'card' ? 'payment' : 'manual_payment',
      subjectType: 'invoice',
      subjectId: invoice.id,
      summary:
        `${how} of ${money(quote.totalCents, guild.currency)} from ${name} for ${invoice.yearLabel} (${plan.name}), receipt ${receiptNumber}` +
        (fee ? `; fee ${money(fee, guild.currency)}, net ${money(quote.totalCents - fee, guild.currency)}` : '') +
        '.',
      detail: { method: p.method, amountCents: quote.totalCents, feeCents: fee, receiptNumber },
    });
    if (p.refund && p.refund.on <= today) {
      const at = DateTime.fromISO(`${p.refund.on}T11:00`, { zone }).toJSDate();
      em.create(DuesRefund, {
        payment,
        guild,
        amountCents: p.refund.cents,
        providerRefundId: p.method === 'card' ? `re_demo_${guild.id}_${ref}` : null,
        reason: p.refund.reason,
        by: doreen,
        byName: doreenName,
        createdAt: at,
        updatedAt: at,
      });
      payment.refundedCents = p.refund.cents;
      invoice.refundedCents = p.refund.cents;
      invoice.status = 'partially_refunded';
      audit(at, {
        action: 'refund',
        subjectType: 'invoice',
        subjectId: invoice.id,
        summary: `Refund of ${money(p.refund.cents, guild.currency)} to ${name} on receipt ${receiptNumber} (to her card). Reason: ${p.refund.reason}`,
      });
    }
  }
  for (const [year, last] of counters) em.create(ReceiptCounter, { guild, year, nextNumber: last + 1 });
  await em.flush();
}
