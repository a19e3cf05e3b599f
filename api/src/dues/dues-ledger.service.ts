import { wrap } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import {
  BadRequestException,
  ConflictException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  ServiceUnavailableException,
} from '@nestjs/common';
import { DateTime } from 'luxon';
import Stripe from 'stripe';
import { appConfig, type AppConfig } from '../config/app.config';
import { Membership } from '../guilds/membership.entity';
import { hasAnyRole } from '../guilds/roles';
import { OutboxService } from '../outbox/outbox.service';
import { DuesInvoice, type InvoiceLine, type InvoiceStatus, type PaymentMethod } from './dues-invoice.entity';
import { DuesPayment } from './dues-payment.entity';
import { DuesPlan } from './dues-plan.entity';
import { DuesRefund } from './dues-refund.entity';
import { ageOn, formatDate, membershipYearOf, planFitsAge, todayIn, type DuesQuote, type DuesSettings } from './dues-rules';
import { DuesStanding } from './dues-standing.entity';
import { DuesService } from './dues.service';
import { loadSettings, lockStanding, money, periodText, rulePlan, withTransaction } from './dues-support';
import type { LedgerQueryDto, ManualPaymentDto, RefundDto } from './dto/dues.dto';
import { centsColumn, toCsv } from './csv';
import { minorUnitDigits } from './money';
import { PAYMENT_SERVICE, writeAudit } from './money-audit';
import { PaymentWebhookEvent } from './payment-webhook-event.entity';
import { PaymentsGateway } from './payments-gateway';
import { renderReceiptPdf } from './receipt-pdf';

const isTreasurer = (m: Membership) => hasAnyRole(m.roles, ['treasurer']);
const PAID_STATUSES: InvoiceStatus[] = ['paid', 'partially_refunded', 'refunded'];
const STATUS_WORDS: Record<InvoiceStatus, string> = {
  open: 'still open',
  paid: 'paid',
  void: 'void',
  refunded: 'refunded in full',
  partially_refunded: 'partly refunded',
};

/** How a payment was settled: what the receipt, the payment row and the audit line need. */
interface Settlement {
  method: PaymentMethod;
  amountCents: number;
  feeCents: number;
  netCents: number;
  paidAt: Date;
  paidOn: string;
  paymentIntentId?: string | null;
  chargeId?: string | null;
  cardBrand?: string | null;
  cardLast4?: string | null;
  chequeNumber?: string | null;
  actor: Membership | null;
  actorName: string;
}

type SettleOutcome = 'paid' | 'already' | 'duplicate' | 'ignored';

function later(a: string | null | undefined, b: string | null | undefined): string | null {
  if (!a) return b ?? null;
  if (!b) return a;
  return a > b ? a : b;
}

function sameLines(a: InvoiceLine[], b: { label: string; amountCents: number }[]): boolean {
  return a.length === b.length && a.every((l, i) => l.label === b[i].label && l.amountCents === b[i].amountCents);
}

function methodText(p: Pick<DuesPayment, 'method' | 'cardBrand' | 'cardLast4' | 'chequeNumber'>): string {
  if (p.method === 'cash') return 'Cash';
  if (p.method === 'cheque') return p.chequeNumber ? `Cheque no. ${p.chequeNumber}` : 'Cheque';
  const brand = p.cardBrand ? p.cardBrand[0].toUpperCase() + p.cardBrand.slice(1) : '';
  return p.cardLast4 ? `${brand ? `${brand} card` : 'Card'} ending ${p.cardLast4}` : 'Card';
}

/** "2027", or "2026 and 2027" when a joiner's payment also covers the next year. */
function yearLabelOf(quote: DuesQuote, settings: DuesSettings): string {
  const last = membershipYearOf(quote.coversThrough!, settings);
  const first = membershipYearOf(quote.coversFrom ?? quote.coversThrough!, settings);
  return first.label === last.label ? last.label : `${first.label} and ${last.label}`;
}

function ageRange(plan: DuesPlan): string {
  if (plan.minAge != null && plan.maxAge != null) return `aged ${plan.minAge} to ${plan.maxAge}`;
  if (plan.maxAge != null) return `aged ${plan.maxAge} and under`;
  return `aged ${plan.minAge} and over`;
}

/**
 * The money side of dues: invoices, card checkout through the payment service, its signed events,
 * cash and cheque entries, refunds and voids. Whatever path a payment takes (event, the member's
 * return page, the treasurer) it is settled by markPaid in one transaction, with the member's
 * standing row and the invoice row locked in that order.
 */
interface LedgerRow {
  id: number;
  membership_id: number;
  member_name: string;
  plan_name: string;
  year_label: string;
  created_at: Date | string;
  status: InvoiceStatus;
  method: PaymentMethod | null;
  total_cents: number;
  currency: string;
  paid_on: string | null;
  receipt_number: string | null;
  payment_id: number | null;
  amount_cents: number | null;
  fee_cents: number | null;
  refunded_cents: number | null;
  payment_intent_id: string | null;
  cheque_number: string | null;
}

@Injectable()
export class DuesLedgerService {
  private readonly logger = new Logger(DuesLedgerService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly gateway: PaymentsGateway,
    private readonly outbox: OutboxService,
    private readonly dues: DuesService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  private duesUrl(guildId: number): string {
    return `${this.app.origin}/guilds/${guildId}/dues`;
  }

  // ---- reading ----------------------------------------------------------------------------------

  /** The invoice if the caller may see it: her own, or any in the guild for the treasurer; else 404. */
  private async visibleInvoice(me: Membership, invoiceId: number, em: EntityManager = this.em): Promise<DuesInvoice> {
    const invoice = await em.findOne(
      DuesInvoice,
      { id: invoiceId, guild: me.guild.id },
      { populate: ['guild', 'membership.user', 'plan', 'createdBy.user'], refresh: true },
    );
    if (!invoice || (invoice.membership.id !== me.id && !isTreasurer(me))) throw new NotFoundException('No such invoice.');
    return invoice;
  }

  invoiceView(i: DuesInvoice) {
    return {
      id: i.id,
      invoiceId: i.id,
      status: i.status,
      purpose: i.purpose,
      showId: i.showId ?? null,
      label: i.yearLabel,
      planName: i.planName,
      lines: i.lines,
      totalCents: i.totalCents,
      currency: i.currency,
      coversFrom: i.coversFrom ?? null,
      coversThrough: i.coversThrough ?? null,
      receiptNumber: i.receiptNumber ?? null,
      paidOn: i.paidOn ?? null,
      method: i.method ?? null,
      chequeNumber: i.chequeNumber ?? null,
      refundedCents: i.refundedCents,
      paymentNote: i.paymentNote ?? null,
      membershipId: i.membership.id,
      memberName: i.membership.user.name,
      /** Cash and cheques: the officer who recorded the payment on her behalf. */
      recordedBy: i.method && i.method !== 'card' && i.createdBy && i.createdBy.id !== i.membership.id && wrap(i.createdBy).isInitialized() ? (i.createdBy.user?.name ?? null) : null,
      issuedOn: todayIn(i.guild.timeZone, i.createdAt),
    };
  }

  /** An invoice; an open one with a Checkout Session is first checked with the payment service. */
  async invoice(me: Membership, invoiceId: number) {
    let invoice = await this.visibleInvoice(me, invoiceId);
    if (invoice.status === 'open' && invoice.checkoutSessionId && this.gateway.enabled) {
      try {
        await this.reconcile(invoice.id, invoice.checkoutSessionId);
        invoice = await this.visibleInvoice(me, invoiceId, this.em.fork());
      } catch (e) {
        // The stored state is still right as far as we know; the next look or event will catch up.
        this.logger.warn(`could not check invoice ${invoice.id} with the payment service: ${(e as Error).message}`);
      }
    }
    return this.invoiceView(invoice);
  }

  /**
   * The treasurer's books: every invoice (filtered), what came in, the fees, refunds and net. One plain
   * join rather than entities: two years of a guild's payments is a thousand rows, and building entity
   * objects for them took most of the request's time.
   */
  async ledger(me: Membership, query: LedgerQueryDto) {
    const filters: string[] = [];
    const params: unknown[] = [];
    const where = (sql: string, value: unknown) => {
      filters.push(sql);
      params.push(value);
    };
    where('i.guild_id = ?', me.guild.id);
    if (query.year) where('i.year_label = ?', query.year);
    if (query.planId) where('i.plan_id = ?', query.planId);
    if (query.status) where('i.status = ?', query.status);
    if (query.method) where('i.method = ?', query.method);
    const found = await this.em.getConnection().execute<LedgerRow[]>(
      `SELECT i.id, i.membership_id, u.name AS member_name, i.plan_name, i.year_label, i.created_at, i.status, i.method,
              i.total_cents, i.currency, DATE_FORMAT(i.paid_on, '%Y-%m-%d') AS paid_on, i.receipt_number,
              p.id AS payment_id, p.amount_cents, p.fee_cents, p.refunded_cents, p.payment_intent_id, p.cheque_number
         FROM dues_invoices i
         JOIN memberships m ON m.id = i.membership_id
         JOIN users u ON u.id = m.user_id
         LEFT JOIN dues_payments p ON p.invoice_id = i.id
        WHERE ${filters.join(' AND ')}
        ORDER BY i.created_at DESC, i.id DESC
        LIMIT 5000`,
      params,
    );
    const zone = me.guild.timeZone;
    const rows = found.map((r) => {
      const gross = Number(r.amount_cents ?? 0);
      const fee = Number(r.fee_cents ?? 0);
      const refunded = Number(r.refunded_cents ?? 0);
      const createdAt = r.created_at instanceof Date ? r.created_at : new Date(`${String(r.created_at).replace(' ', 'T')}Z`);
      return {
        invoiceId: r.id,
        membershipId: r.membership_id,
        memberName: r.member_name,
        planName: r.plan_name,
        label: r.year_label,
        issuedOn: todayIn(zone, createdAt),
        status: r.status,
        method: r.method ?? null,
        totalCents: Number(r.total_cents),
        grossCents: gross,
        feeCents: fee,
        refundedCents: refunded,
        netCents: gross - fee - refunded,
        currency: r.currency,
        paidOn: r.paid_on ?? null,
        receiptNumber: r.receipt_number ?? null,
        reference: r.payment_id ? (r.payment_intent_id ?? (r.cheque_number ? `Cheque no. ${r.cheque_number}` : null)) : null,
      };
    });
    const sum = (k: 'grossCents' | 'feeCents' | 'refundedCents' | 'netCents') => rows.reduce((t, r) => t + r[k], 0);
    const years = (await this.em.getConnection().execute<{ year_label: string }[]>(
      'SELECT DISTINCT year_label FROM dues_invoices WHERE guild_id = ? ORDER BY year_label DESC',
      [me.guild.id],
    )).map((r) => r.year_label);
    return {
      rows,
      totals: { count: rows.length, grossCents: sum('grossCents'), feeCents: sum('feeCents'), refundedCents: sum('refundedCents'), netCents: sum('netCents') },
      years,
      currency: me.guild.currency,
    };
  }

  async ledgerCsv(me: Membership, query: LedgerQueryDto): Promise<string> {
    const { rows } = await this.ledger(me, query);
    const digits = minorUnitDigits(me.guild.currency);
    const amount = (c: number) => centsColumn(c, digits);
    return toCsv(
      ['Receipt', 'Paid on', 'Member', 'Plan', 'Year', 'Status', 'Method', 'Reference', 'Invoiced', 'Received', 'Fee', 'Refunded', 'Net', 'Currency', 'Invoice', 'Issued on'],
      rows.map((r) => [
        r.receiptNumber,
        r.paidOn,
        r.memberName,
        r.planName,
        r.label,
        r.status,
        r.method,
        r.reference,
        amount(r.totalCents),
        amount(r.grossCents),
        amount(r.feeCents),
        amount(r.refundedCents),
        amount(r.netCents),
        r.currency,
        r.invoiceId,
        r.issuedOn,
      ]),
    );
  }

  async receiptPdf(me: Membership, invoiceId: number): Promise<{ filename: string; pdf: Buffer }> {
    const invoice = await this.visibleInvoice(me, invoiceId);
    if (!PAID_STATUSES.includes(invoice.status) || !invoice.receiptNumber)
      throw new NotFoundException('There is no receipt for this invoice until it is paid.');
    const payment = await this.em.findOneOrFail(DuesPayment, { invoice: invoice.id });
    return { filename: `receipt-${invoice.receiptNumber}.pdf`, pdf: await this.renderReceipt(invoice, payment) };
  }

  private renderReceipt(invoice: DuesInvoice, payment: DuesPayment): Promise<Buffer> {
    const lines = invoice.lines.map((l) => ({ label: l.label, amountCents: l.amountCents }));
    if (payment.amountCents !== invoice.totalCents)
      lines.push({ label: 'Difference in the amount received', amountCents: payment.amountCents - invoice.totalCents });
    const user = invoice.membership.user;
    return renderReceiptPdf({
      guildName: invoice.guild.name,
      guildTown: invoice.guild.town,
      receiptNumber: invoice.receiptNumber!,
      issuedOn: invoice.paidOn!,
      memberName: user.name,
      memberEmail: user.email ?? undefined,
      lines,
      totalCents: payment.amountCents,
      currency: invoice.currency,
      paymentMethod: methodText(payment),
      paymentReference: payment.paymentIntentId ? `Online payment ${payment.paymentIntentId}` : `Invoice ${invoice.id}, recorded by the treasurer`,
      coversFrom: invoice.coversFrom ?? undefined,
      coversThrough: invoice.coversThrough ?? undefined,
    });
  }

  // ---- locks and the one way an invoice becomes paid ---------------------------------------------

  private async lockInvoice(tx: EntityManager, invoiceId: number): Promise<DuesInvoice> {
    await tx.execute('SELECT id FROM dues_invoices WHERE id = ? FOR UPDATE', [invoiceId]);
    return tx.findOneOrFail(DuesInvoice, { id: invoiceId }, { refresh: true, populate: ['guild', 'membership.user', 'plan'] });
  }

  /** The next receipt number of the guild's calendar year, under the counter row's lock: no gaps, no repeats. */
  private async takeReceiptNumber(tx: EntityManager, guildId: number, year: number): Promise<string> {
    const now = new Date();
    await tx.execute(
      'INSERT INTO dues_receipt_counters (created_at, updated_at, guild_id, year, next_number) VALUES (?, ?, ?, ?, 1) ON DUPLICATE KEY UPDATE id = id',
      [now, now, guildId, year],
      'run',
    );
    const rows: { id: number; next_number: number }[] = await tx.execute(
      'SELECT id, next_number FROM dues_receipt_counters WHERE guild_id = ? AND year = ? FOR UPDATE',
      [guildId, year],
    );
    const n = Number(rows[0].next_number);
    await tx.execute('UPDATE dues_receipt_counters SET next_number = ?, updated_at = ? WHERE id = ?', [n + 1, now, rows[0].id], 'run');
    return `${year}-${String(n).padStart(4, '0')}`;
  }

  /**
   * Marks the invoice paid: payment row, receipt number, paidThrough (the whole household's for a
   * household plan), the audit line and the receipt e-mail with its PDF, all in the caller's
   * transaction. `standing` is the invoice member's, already locked.
   */
  private async markPaid(tx: EntityManager, invoice: DuesInvoice, standing: DuesStanding, d: Settlement): Promise<void> {
    const guild = invoice.guild;
    const wasVoid = invoice.status === 'void';
    const payment = tx.create(DuesPayment, {
      invoice,
      guild,
      method: d.method,
      amountCents: d.amountCents,
      feeCents: d.feeCents,
      netCents: d.netCents,
      paymentIntentId: d.paymentIntentId ?? null,
      chargeId: d.chargeId ?? null,
      cardBrand: d.cardBrand ?? null,
      cardLast4: d.cardLast4 ?? null,
      chequeNumber: d.chequeNumber ?? null,
      paidAt: d.paidAt,
      recordedBy: d.method === 'card' || !d.actor ? null : d.actor.id,
    });
    // Lock the rest of the household (if this pays for one) before the counter, so every payment
    // takes its locks in the same order: standings, invoice, counter.
    const household =
      invoice.plan?.kind === 'household' && standing.household
        ? await tx.find(
            DuesStanding,
            { household: standing.household.id, id: { $ne: standing.id }, membership: { status: 'active' } },
            { orderBy: { id: 'asc' }, populate: ['membership.user'] },
          )
        : [];
    const others: DuesStanding[] = [];
    for (const other of household) others.push(await lockStanding(tx, other.membership.id));
    invoice.receiptNumber = await this.takeReceiptNumber(tx, guild.id, Number(d.paidOn.slice(0, 4)));
    invoice.status = 'paid';
    invoice.paidAt = d.paidAt;
    invoice.paidOn = d.paidOn;
    invoice.method = d.method;
    invoice.chequeNumber = d.chequeNumber ?? null;
    invoice.openKey = null;
    invoice.checkoutUrl = null;
    invoice.paymentNote = null;
    invoice.priorPaidThrough = standing.paidThrough ?? null;

    const advance = (s: DuesStanding) => {
      s.paidThrough = later(s.paidThrough, invoice.coversThrough);
      if (invoice.plan) s.plan = invoice.plan;
    };
    advance(standing);
    const covered = [invoice.membership.user.name];
    for (const [i, other] of others.entries()) {
      advance(other);
      covered.push(household[i].membership.user.name);
    }

    const how = d.method === 'card' ? 'Card payment' : d.method === 'cash' ? 'Cash payment' : `Cheque${d.chequeNumber ? ` no. ${d.chequeNumber}` : ''}`;
    writeAudit(tx, {
      guild,
      actor: d.actor?.id ?? null,
      actorName: d.actorName,
      action: d.method === 'card' ? 'payment' : 'manual_payment',
      subjectType: 'invoice',
      subjectId: invoice.id,
      summary:
        `${how} of ${money(d.amountCents, invoice.currency)} from ${invoice.membership.user.name} for ${invoice.yearLabel} (${invoice.planName}), ` +
        `receipt ${invoice.receiptNumber}` +
        (d.feeCents ? `; fee ${money(d.feeCents, invoice.currency)}, net ${money(d.netCents, invoice.currency)}` : '') +
        (covered.length > 1 ? `; covers ${covered.join(', ')}` : '') +
        (wasVoid ? '; the invoice had been voided, but the money came in' : '') +
        '.',
      detail: {
        invoiceId: invoice.id,
        method: d.method,
        amountCents: d.amountCents,
        feeCents: d.feeCents,
        netCents: d.netCents,
        receiptNumber: invoice.receiptNumber,
        paymentIntentId: d.paymentIntentId ?? null,
        paidThrough: standing.paidThrough,
        paidOn: d.paidOn,
      },
    });
    await tx.flush();

    const pdf = await this.renderReceipt(invoice, payment);
    await this.outbox.enqueue(tx, {
      idempotencyKey: `receipt:${invoice.id}`,
      template: 'dues-receipt',
      to: invoice.membership.user.email,
      context: {
        name: invoice.membership.user.name,
        guildName: guild.name,
        receiptNumber: invoice.receiptNumber,
        totalText: money(d.amountCents, invoice.currency),
        periodText: periodText(invoice.coversFrom, invoice.coversThrough, invoice.purpose, invoice.yearLabel),
        paidOnText: formatDate(d.paidOn),
        methodText: methodText(payment),
        duesUrl: this.duesUrl(guild.id),
      },
      attachments: [{ filename: `receipt-${invoice.receiptNumber}.pdf`, contentType: 'application/pdf', content: pdf }],
    });
  }

  /** What a completed Checkout Session says was paid, with the fee and net from its balance transaction. */
  private cardSettlement(invoice: DuesInvoice, session: Stripe.Checkout.Session): Settlement {
    const pi = typeof session.payment_intent === 'object' ? session.payment_intent : null;
    const charge = pi && typeof pi.latest_charge === 'object' ? pi.latest_charge : null;
    const txn = charge && typeof charge.balance_transaction === 'object' ? charge.balance_transaction : null;
    const amount = session.amount_total ?? pi?.amount_received ?? invoice.totalCents;
    const fee = txn?.fee ?? 0;
    const paidAt = new Date((charge?.created ?? session.created) * 1000);
    return {
      method: 'card',
      amountCents: amount,
      feeCents: fee,
      netCents: txn?.net ?? amount - fee,
      paidAt,
      paidOn: todayIn(invoice.guild.timeZone, paidAt),
      paymentIntentId: pi?.id ?? (typeof session.payment_intent === 'string' ? session.payment_intent : null),
      chargeId: charge?.id ?? null,
      cardBrand: charge?.payment_method_details?.card?.brand ?? null,
      cardLast4: charge?.payment_method_details?.card?.last4 ?? null,
      actor: null,
      actorName: PAYMENT_SERVICE,
    };
  }

  /**
   * Settles an invoice from a paid Checkout Session (an event, the return page, a stale session found
   * at checkout). Idempotent: an invoice already paid is left alone.
   */
  private async settleCard(invoiceId: number, session: Stripe.Checkout.Session, event: Stripe.Event | null): Promise<SettleOutcome> {
    return withTransaction(this.em, async (tx) => {
      if (event && !(await this.recordEvent(tx, event, invoiceId))) return 'duplicate';
      const peek = await tx.findOneOrFail(DuesInvoice, { id: invoiceId });
      const standing = await lockStanding(tx, peek.membership.id);
      const invoice = await this.lockInvoice(tx, invoiceId);
      if (invoice.status !== 'open' && invoice.status !== 'void') return 'already';
      await this.markPaid(tx, invoice, standing, this.cardSettlement(invoice, session));
      return 'paid';
    });
  }

  /** Asks the payment service about an open invoice's session and catches up with what happened. */
  private async reconcile(invoiceId: number, sessionId: string): Promise<void> {
    const session = await this.gateway.retrieveSession(sessionId);
    if (session.payment_status === 'paid') await this.settleCard(invoiceId, session, null);
    else if (session.status === 'expired') await this.forgetSession(invoiceId, sessionId, null);
  }

  /** An expired session: the invoice stays open, and the next checkout makes a new session. */
  private forgetSession(invoiceId: number, sessionId: string, event: Stripe.Event | null): Promise<SettleOutcome> {
    return withTransaction(this.em, async (tx) => {
      if (event && !(await this.recordEvent(tx, event, invoiceId))) return 'duplicate';
      const invoice = await this.lockInvoice(tx, invoiceId);
      if (invoice.status !== 'open' || invoice.checkoutSessionId !== sessionId) return 'ignored';
      invoice.checkoutSessionId = null;
      invoice.checkoutUrl = null;
      await tx.flush();
      return 'paid';
    });
  }

  /**
   * Closes an open invoice (a void by the treasurer, or one replaced by a newer quote): its session
   * is expired first. Returns true when the session turned out to be paid, in which case the invoice
   * is settled instead of voided.
   */
  private async closeOpenInvoice(tx: EntityManager, invoice: DuesInvoice, standing: DuesStanding, actor: Membership, actorName: string, why: string): Promise<boolean> {
    if (invoice.checkoutSessionId) {
      const expired = await this.gateway.expireSession(invoice.checkoutSessionId, `selvage-expire-${invoice.id}-${invoice.checkoutAttempts}`);
      if (!expired) {
        const session = await this.gateway.retrieveSession(invoice.checkoutSessionId);
        if (session.payment_status === 'paid') {
          await this.markPaid(tx, invoice, standing, this.cardSettlement(invoice, session));
          return true;
        }
      }
    }
    invoice.status = 'void';
    invoice.openKey = null;
    invoice.checkoutUrl = null;
    invoice.voidedAt = new Date();
    writeAudit(tx, {
      guild: invoice.guild,
      actor: actor.id,
      actorName,
      action: 'void',
      subjectType: 'invoice',
      subjectId: invoice.id,
      summary: `Invoice ${invoice.id} (${invoice.membership.user.name}, ${invoice.yearLabel}, ${money(invoice.totalCents, invoice.currency)}) voided: ${why}.`,
      detail: { invoiceId: invoice.id, totalCents: invoice.totalCents, checkoutSessionId: invoice.checkoutSessionId ?? null },
    });
    await tx.flush();
    return false;
  }

  // ---- checkout ---------------------------------------------------------------------------------

  private assertPlanOnOffer(plan: DuesPlan): void {
    if (plan.kind === 'lifetime' || plan.kind === 'honorary')
      throw new ConflictException(`${plan.name} membership is given by the guild, not paid for. Choose another plan.`);
    if (!plan.active) throw new ConflictException(`The ${plan.name} plan is no longer offered. Choose another plan.`);
  }

  private nothingToPay(who: 'you' | string, paidThrough: string | null, quote: DuesQuote | null): ConflictException {
    const note = quote?.note?.replace(/^Paid through [^.]+\.\s*/, '') ?? '';
    if (paidThrough) {
      const head = who === 'you' ? `Your dues are paid through ${formatDate(paidThrough)}.` : `${who}'s dues are paid through ${formatDate(paidThrough)}.`;
      return new ConflictException(`${head}${note ? ` ${note}` : ''}`);
    }
    return new ConflictException(quote?.note ?? 'There is nothing to pay on this plan.');
  }

  /** Starts (or resumes) paying dues online: one open invoice per year and plan, one live session. */
  async checkout(me: Membership, planId: number): Promise<{ invoiceId: number; url: string }> {
    if (!this.gateway.enabled)
      throw new ServiceUnavailableException('Online card payment is not set up for this guild. Please pay the treasurer by cash or cheque.');
    const guild = me.guild;
    const plan = await this.em.findOne(DuesPlan, { id: planId, guild: guild.id });
    if (!plan) throw new NotFoundException('No such plan in this guild.');
    this.assertPlanOnOffer(plan);
    const actorName = await this.dues.actorName(me);

    const result = await withTransaction(this.em, async (tx) => {
      const standing = await lockStanding(tx, me.id);
      const own = standing.plan;
      if (own && (own.kind === 'lifetime' || own.kind === 'honorary'))
        throw new ConflictException(`You are ${own.kind === 'lifetime' ? 'a lifetime' : 'an honorary'} member of ${guild.name}: you pay no dues.`);
      if (plan.kind === 'household' && !standing.household)
        throw new ConflictException('Household dues cover everyone in a household. Ask the treasurer to add you to your household, then try again.');
      const settings = await loadSettings(tx, guild);
      const today = todayIn(guild.timeZone);
      if (plan.minAge != null || plan.maxAge != null) {
        if (!standing.birthDate)
          throw new ConflictException(`The ${plan.name} plan is for members ${ageRange(plan)}. Ask the treasurer to record your date of birth, then try again.`);
        if (!planFitsAge(rulePlan(plan), ageOn(standing.birthDate, today)))
          throw new ConflictException(`The ${plan.name} plan is for members ${ageRange(plan)}. Choose another plan.`);
      }
      const quote = this.dues.quoteFor(plan, settings, today, standing.paidThrough ?? null);
      if (!quote || quote.totalCents === 0 || !quote.coversThrough) throw this.nothingToPay('you', standing.paidThrough ?? null, quote);

      const label = yearLabelOf(quote, settings);
      const openKey = `${me.id}:${label}:${plan.id}`;
      const open = await tx.find(DuesInvoice, { membership: me.id, status: 'open', purpose: 'dues' }, { populate: ['guild', 'membership.user', 'plan'], orderBy: { id: 'asc' } });
      const kept = open.find((i) => i.openKey === openKey && i.totalCents === quote.totalCents && sameLines(i.lines, quote.lines)) ?? null;
      const reuse = await this.reuseOpenInvoice(tx, open, kept, standing, me, actorName);
      if (reuse.done) return reuse.done;
      let invoice = reuse.invoice;
      if (!invoice) {
        invoice = tx.create(DuesInvoice, {
          guild: guild.id,
          membership: me.id,
          plan: plan.id,
          planName: plan.name,
          yearLabel: label,
          coversFrom: quote.coversFrom,
          coversThrough: quote.coversThrough,
          lines: quote.lines.map((l) => ({ kind: l.kind, label: l.label, amountCents: l.amountCents })),
          totalCents: quote.totalCents,
          currency: quote.currency,
          openKey,
        });
        await tx.flush();
        await tx.populate(invoice, ['guild', 'membership.user', 'plan']);
      }
      const url = await this.openSession(
        tx,
        invoice,
        me,
        `${this.app.origin}/guilds/${guild.id}/dues/return?invoice=${invoice.id}&session={CHECKOUT_SESSION_ID}`,
        `${this.app.origin}/guilds/${guild.id}/dues?cancelled=1`,
        `${guild.name}: ${invoice.yearLabel} dues (${invoice.planName})`,
      );
      return { invoiceId: invoice.id, url };
    });
    if ('justPaid' in result)
      throw new ConflictException(`Your payment has just gone through (receipt ${result.justPaid}). There is nothing more to pay.`);
    return result;
  }

  /**
   * Checkout's first step: every open invoice but `kept` is closed (its session expired, or settled if
   * it turns out paid); `kept` answers with its session while that is still open, is settled if its
   * session was paid, and otherwise loses the dead session so a new one is made.
   */
  private async reuseOpenInvoice(
    tx: EntityManager,
    open: DuesInvoice[],
    kept: DuesInvoice | null,
    standing: DuesStanding,
    me: Membership,
    actorName: string,
  ): Promise<{ done: { justPaid: string } | { invoiceId: number; url: string } | null; invoice: DuesInvoice | null }> {
    for (const other of open.filter((i) => i !== kept)) {
      if (await this.closeOpenInvoice(tx, other, standing, me, actorName, 'replaced by a new invoice at checkout'))
        return { done: { justPaid: other.receiptNumber! }, invoice: null };
    }
    if (kept?.checkoutSessionId) {
      const session = await this.gateway.retrieveSession(kept.checkoutSessionId);
      if (session.status === 'open' && session.url) return { done: { invoiceId: kept.id, url: session.url }, invoice: kept };
      if (session.payment_status === 'paid') {
        await this.markPaid(tx, kept, standing, this.cardSettlement(kept, session));
        return { done: { justPaid: kept.receiptNumber! }, invoice: kept };
      }
      kept.checkoutSessionId = null;
      kept.checkoutUrl = null;
    }
    return { done: null, invoice: kept };
  }

  /** A new Checkout Session for an open invoice (its lines as the items), in the caller's transaction. */
  private async openSession(tx: EntityManager, invoice: DuesInvoice, me: Membership, successUrl: string, cancelUrl: string, description: string): Promise<string> {
    invoice.checkoutAttempts += 1;
    const metadata = { invoiceId: String(invoice.id), guildId: String(invoice.guild.id) };
    const currency = invoice.currency.toLowerCase();
    const session = await this.gateway.createSession(
      {
        mode: 'payment',
        line_items: invoice.lines
          .filter((l) => l.amountCents > 0)
          .map((l) => ({ price_data: { currency, unit_amount: l.amountCents, product_data: { name: l.label } }, quantity: 1 })),
        success_url: successUrl,
        cancel_url: cancelUrl,
        customer_email: invoice.membership.user.email ?? undefined,
        client_reference_id: String(invoice.id),
        metadata,
        payment_intent_data: { metadata, description: description.slice(0, 1000) },
      },
      `selvage-checkout-${invoice.id}-${me.id}-${invoice.totalCents}-${invoice.checkoutAttempts}`,
    );
    invoice.checkoutSessionId = session.id;
    invoice.checkoutUrl = session.url;
    await tx.flush();
    return session.url!;
  }

  /**
   * Card checkout for a charge that is not dues (a show's entry fees): one open invoice per
   * `openKey`, replaced when the amount changed, paid and receipted the same way as dues (same
   * webhook, same receipt numbers, same ledger). `linesFor` runs under the member's standing lock,
   * so two checkouts at once agree on what is owed.
   */
  async checkoutCharge(
    me: Membership,
    charge: {
      purpose: 'show_entry';
      showId: number;
      label: string;
      planName: string;
      openKey: string;
      linesFor: (tx: EntityManager) => Promise<InvoiceLine[]>;
      returnPath: string;
    },
  ): Promise<{ invoiceId: number; url: string }> {
    if (!this.gateway.enabled)
      throw new ServiceUnavailableException('Online card payment is not set up for this guild. Please pay the treasurer by cash or cheque.');
    const guild = me.guild;
    const actorName = await this.dues.actorName(me);
    const result = await withTransaction(this.em, async (tx) => {
      const standing = await lockStanding(tx, me.id);
      const lines = await charge.linesFor(tx);
      const totalCents = lines.reduce((n, l) => n + l.amountCents, 0);
      const open = await tx.find(DuesInvoice, { membership: me.id, status: 'open', openKey: charge.openKey }, { populate: ['guild', 'membership.user', 'plan'] });
      const kept = totalCents > 0 ? (open.find((i) => i.totalCents === totalCents && sameLines(i.lines, lines)) ?? null) : null;
      const reuse = await this.reuseOpenInvoice(tx, open, kept, standing, me, actorName);
      if (reuse.done) return reuse.done;
      if (totalCents <= 0) return { nothing: true as const };
      let invoice = reuse.invoice;
      if (!invoice) {
        invoice = tx.create(DuesInvoice, {
          guild: guild.id,
          membership: me.id,
          purpose: charge.purpose,
          showId: charge.showId,
          planName: charge.planName,
          yearLabel: charge.label.slice(0, 40),
          lines,
          totalCents,
          currency: guild.currency,
          openKey: charge.openKey,
        });
        await tx.flush();
        await tx.populate(invoice, ['guild', 'membership.user', 'plan']);
      }
      const url = await this.openSession(
        tx,
        invoice,
        me,
        `${this.app.origin}/guilds/${guild.id}/dues/return?invoice=${invoice.id}&session={CHECKOUT_SESSION_ID}`,
        `${this.app.origin}${charge.returnPath}`,
        `${guild.name}: ${charge.planName}, ${charge.label}`,
      );
      return { invoiceId: invoice.id, url };
    });
    if ('justPaid' in result) throw new ConflictException(`Your payment has just gone through (receipt ${result.justPaid}). There is nothing more to pay.`);
    if ('nothing' in result) throw new ConflictException('There is nothing to pay.');
    return result;
  }

  // ---- the treasurer's entries ------------------------------------------------------------------

  async recordManual(me: Membership, dto: ManualPaymentDto) {
    const guild = me.guild;
    const today = todayIn(guild.timeZone);
    const received = DateTime.fromISO(dto.receivedOn, { zone: 'utc' });
    if (!received.isValid) throw new BadRequestException({ message: 'Please check the highlighted fields.', errors: { receivedOn: ['That date does not exist.'] } });
    if (dto.receivedOn > today)
      throw new BadRequestException({ message: 'Please check the highlighted fields.', errors: { receivedOn: ['The money cannot have come in after today.'] } });
    if (received < DateTime.fromISO(today, { zone: 'utc' }).minus({ days: 366 }))
      throw new BadRequestException({
        message: 'Please check the highlighted fields.',
        errors: { receivedOn: ['Enter payments within a year of receiving them.'] },
      });
    const actorName = await this.dues.actorName(me);

    const result = await withTransaction(this.em, async (tx) => {
      const member = await tx.findOne(Membership, { id: dto.membershipId, guild: guild.id }, { populate: ['user'] });
      if (!member) throw new NotFoundException('That member is not in this guild.');
      const plan = await tx.findOne(DuesPlan, { id: dto.planId, guild: guild.id });
      if (!plan) throw new NotFoundException('No such plan in this guild.');
      if (plan.kind === 'lifetime' || plan.kind === 'honorary')
        throw new ConflictException(`${plan.name} members pay no dues. Set her plan on the members list instead of recording a payment.`);
      const standing = await lockStanding(tx, member.id);
      if (plan.kind === 'household' && !standing.household)
        throw new ConflictException(`${member.user.name} is not in a household yet. Add her to one first, so the payment covers everyone in it.`);
      const settings = await loadSettings(tx, guild);
      const quote = this.dues.quoteFor(plan, settings, dto.receivedOn, standing.paidThrough ?? null);
      if (!quote || quote.totalCents === 0 || !quote.coversThrough) throw this.nothingToPay(member.user.name, standing.paidThrough ?? null, quote);

      const open = await tx.find(DuesInvoice, { membership: member.id, status: 'open', purpose: 'dues' }, { populate: ['guild', 'membership.user', 'plan'], orderBy: { id: 'asc' } });
      for (const other of open) {
        if (await this.closeOpenInvoice(tx, other, standing, me, actorName, `${dto.method} payment recorded by the treasurer`))
          return { justPaid: other.receiptNumber! };
      }
      const lines: InvoiceLine[] = quote.lines.map((l) => ({ kind: l.kind, label: l.label, amountCents: l.amountCents }));
      const difference = dto.amountCents - quote.totalCents;
      if (difference !== 0)
        lines.push({ kind: 'adjustment', label: difference > 0 ? 'Paid over the amount due' : 'Paid under the amount due', amountCents: difference });
      const invoice = tx.create(DuesInvoice, {
        guild: guild.id,
        membership: member.id,
        plan: plan.id,
        planName: plan.name,
        yearLabel: yearLabelOf(quote, settings),
        coversFrom: quote.coversFrom,
        coversThrough: quote.coversThrough,
        lines,
        totalCents: dto.amountCents,
        currency: quote.currency,
        createdBy: me.id,
      });
      await tx.flush();
      await tx.populate(invoice, ['guild', 'membership.user', 'plan']);
      await this.markPaid(tx, invoice, standing, {
        method: dto.method,
        amountCents: dto.amountCents,
        feeCents: 0,
        netCents: dto.amountCents,
        paidAt: new Date(),
        paidOn: dto.receivedOn,
        chequeNumber: dto.method === 'cheque' ? dto.chequeNumber!.trim() : null,
        actor: me,
        actorName,
      });
      return { invoiceId: invoice.id };
    });
    if ('justPaid' in result)
      throw new ConflictException(`She has just paid online (receipt ${result.justPaid}), so this payment was not recorded.`);
    return this.invoiceView(await this.visibleInvoice(me, result.invoiceId, this.em.fork()));
  }

  async voidInvoice(me: Membership, invoiceId: number) {
    const found = await this.visibleInvoice(me, invoiceId);
    const actorName = await this.dues.actorName(me);
    const outcome = await withTransaction(this.em, async (tx) => {
      const standing = await lockStanding(tx, found.membership.id);
      const invoice = await this.lockInvoice(tx, invoiceId);
      if (invoice.status !== 'open')
        throw new ConflictException(
          `Only open invoices can be voided; this one is ${STATUS_WORDS[invoice.status]}.${PAID_STATUSES.includes(invoice.status) ? ' Refund it instead.' : ''}`,
        );
      return (await this.closeOpenInvoice(tx, invoice, standing, me, actorName, 'voided by the treasurer')) ? 'paid' : 'void';
    });
    if (outcome === 'paid') throw new ConflictException('The member paid this invoice just now, so it was not voided. Refund it instead if needed.');
    return this.invoiceView(await this.visibleInvoice(me, invoiceId, this.em.fork()));
  }

  // ---- refunds ----------------------------------------------------------------------------------

  /**
   * Brings the payment's refunded total and the invoice's status in line with its refund rows (and
   * what the payment service says was refunded); a full refund puts paidThrough back.
   */
  private applyRefundTotals(tx: EntityManager, invoice: DuesInvoice, payment: DuesPayment, standing: DuesStanding, rows: DuesRefund[], serviceTotal = 0) {
    const total = Math.min(payment.amountCents, Math.max(serviceTotal, rows.reduce((sum, r) => sum + r.amountCents, 0)));
    const wasFull = invoice.status === 'refunded';
    payment.refundedCents = total;
    invoice.refundedCents = total;
    invoice.status = total === 0 ? 'paid' : total >= payment.amountCents ? 'refunded' : 'partially_refunded';
    if (invoice.status === 'refunded' && !wasFull && standing.paidThrough && standing.paidThrough === invoice.coversThrough)
      standing.paidThrough = invoice.priorPaidThrough ?? null;
  }

  async refund(me: Membership, invoiceId: number, dto: RefundDto) {
    const found = await this.visibleInvoice(me, invoiceId);
    const actorName = await this.dues.actorName(me);
    await withTransaction(this.em, async (tx) => {
      const standing = await lockStanding(tx, found.membership.id);
      const invoice = await this.lockInvoice(tx, invoiceId);
      if (invoice.status !== 'paid' && invoice.status !== 'partially_refunded')
        throw new ConflictException(`Only paid invoices can be refunded; this one is ${STATUS_WORDS[invoice.status]}.`);
      const payment = await tx.findOneOrFail(DuesPayment, { invoice: invoice.id }, { refresh: true });
      const left = payment.amountCents - payment.refundedCents;
      if (dto.amountCents > left)
        throw new BadRequestException({
          message: 'Please check the highlighted fields.',
          errors: { amountCents: [`You can refund at most ${money(left, invoice.currency)} on this payment.`] },
        });
      const reason = dto.reason?.trim() || null;
      const rows = await tx.find(DuesRefund, { payment: payment.id });
      let providerRefundId: string | null = null;
      if (payment.method === 'card') {
        if (!payment.paymentIntentId)
          throw new ConflictException('This card payment has no payment-service reference, so it cannot be refunded online. Refund it by cash or cheque.');
        const refund = await this.gateway.createRefund(
          {
            payment_intent: payment.paymentIntentId,
            amount: dto.amountCents,
            reason: 'requested_by_customer',
            metadata: { invoiceId: String(invoice.id), guildId: String(invoice.guild.id) },
          },
          `selvage-refund-${invoice.id}-${payment.refundedCents}-${dto.amountCents}`,
        );
        providerRefundId = refund.id;
      }
      if (!providerRefundId || !rows.some((r) => r.providerRefundId === providerRefundId)) {
        rows.push(
          tx.create(DuesRefund, {
            payment,
            guild: invoice.guild,
            amountCents: dto.amountCents,
            providerRefundId,
            reason,
            by: me.id,
            byName: actorName,
          }),
        );
      }
      this.applyRefundTotals(tx, invoice, payment, standing, rows);
      writeAudit(tx, {
        guild: invoice.guild,
        actor: me.id,
        actorName,
        action: 'refund',
        subjectType: 'invoice',
        subjectId: invoice.id,
        summary:
          `Refund of ${money(dto.amountCents, invoice.currency)} to ${invoice.membership.user.name} on receipt ${invoice.receiptNumber} ` +
          `(${payment.method === 'card' ? 'to her card' : `by ${payment.method}`}); ${money(payment.refundedCents, invoice.currency)} of ${money(payment.amountCents, invoice.currency)} refunded` +
          (reason ? `. Reason: ${reason}` : '') +
          '.',
        detail: { invoiceId: invoice.id, amountCents: dto.amountCents, refundedCents: payment.refundedCents, providerRefundId, reason },
      });
      await tx.flush();
    });
    return this.invoiceView(await this.visibleInvoice(me, invoiceId, this.em.fork()));
  }

  // ---- the payment service's events -------------------------------------------------------------

  /** Records the event id in the caller's transaction; false when it was already processed. */
  private async recordEvent(tx: EntityManager, event: Stripe.Event, invoiceId: number | null): Promise<boolean> {
    const res = await tx.execute(
      'INSERT IGNORE INTO payment_webhook_events (event_id, type, invoice_id, received_at) VALUES (?, ?, ?, ?)',
      [event.id, event.type, invoiceId, new Date()],
      'run',
    );
    return (res as { affectedRows?: number }).affectedRows === 1;
  }

  private recordOnly(event: Stripe.Event, invoiceId: number | null): Promise<SettleOutcome> {
    return withTransaction(this.em, async (tx) => ((await this.recordEvent(tx, event, invoiceId)) ? 'ignored' : 'duplicate'));
  }

  /** Our invoice named in the metadata, if it is ours: the id and the guild both have to match. */
  private async invoiceFrom(metadata: Stripe.Metadata | null | undefined): Promise<DuesInvoice | null> {
    const id = Number(metadata?.invoiceId);
    const guildId = Number(metadata?.guildId);
    if (!Number.isSafeInteger(id) || id <= 0 || !Number.isSafeInteger(guildId)) return null;
    const invoice = await this.em.fork().findOne(DuesInvoice, { id, guild: guildId });
    return invoice ?? null;
  }

  /**
   * A verified event from the payment service. Every branch converges on what the service says now
   * (it looks the session or refunds up), so repeats and events out of order end in the same state.
   */
  async receiveEvent(rawBody: Buffer | undefined, signature: string | undefined): Promise<{ received: true; outcome: SettleOutcome }> {
    if (!signature) throw new BadRequestException('The Stripe-Signature header is missing.');
    if (!rawBody || rawBody.length === 0) throw new BadRequestException('The event body is missing; send it as JSON.');
    let event: Stripe.Event;
    try {
      event = this.gateway.verifyEvent(rawBody, signature);
    } catch (e) {
      if (e instanceof Stripe.errors.StripeSignatureVerificationError)
        throw new BadRequestException('The event signature could not be verified (wrong secret, changed body or a stale timestamp).');
      throw e;
    }
    if (await this.em.fork().count(PaymentWebhookEvent, { eventId: event.id })) return { received: true, outcome: 'duplicate' };
    return { received: true, outcome: await this.handleEvent(event) };
  }

  private async handleEvent(event: Stripe.Event): Promise<SettleOutcome> {
    switch (event.type) {
      case 'checkout.session.completed':
      case 'checkout.session.async_payment_succeeded': {
        const s = event.data.object;
        const invoice = await this.invoiceFrom(s.metadata);
        if (!invoice) return this.recordOnly(event, null);
        if (s.payment_status !== 'paid') return this.recordOnly(event, invoice.id);
        return this.settleCard(invoice.id, await this.gateway.retrieveSession(s.id), event);
      }
      case 'checkout.session.expired': {
        const s = event.data.object;
        const invoice = await this.invoiceFrom(s.metadata);
        if (!invoice) return this.recordOnly(event, null);
        return this.forgetSession(invoice.id, s.id, event);
      }
      case 'payment_intent.payment_failed': {
        const pi = event.data.object;
        const invoice = await this.invoiceFrom(pi.metadata);
        if (!invoice) return this.recordOnly(event, null);
        return withTransaction(this.em, async (tx) => {
          if (!(await this.recordEvent(tx, event, invoice.id))) return 'duplicate';
          const locked = await this.lockInvoice(tx, invoice.id);
          if (locked.status !== 'open') return 'ignored';
          locked.paymentNote = (pi.last_payment_error?.message ?? 'The card payment did not go through.').slice(0, 500);
          await tx.flush();
          return 'ignored';
        });
      }
      case 'charge.refunded': {
        const charge = event.data.object;
        const invoice = await this.invoiceFrom(charge.metadata);
        const piId = typeof charge.payment_intent === 'string' ? charge.payment_intent : (charge.payment_intent?.id ?? null);
        if (!invoice || !piId) return this.recordOnly(event, invoice?.id ?? null);
        // Out of order: a refund can arrive before the payment's own event. Settle from the session first.
        let session: Stripe.Checkout.Session | null = null;
        if ((invoice.status === 'open' || invoice.status === 'void') && invoice.checkoutSessionId) {
          session = await this.gateway.retrieveSession(invoice.checkoutSessionId);
          if (session.payment_status !== 'paid') session = null;
        }
        const refunds = (await this.gateway.listRefunds(piId)).filter((r) => r.status !== 'failed' && r.status !== 'canceled');
        return withTransaction(this.em, async (tx) => {
          if (!(await this.recordEvent(tx, event, invoice.id))) return 'duplicate';
          const standing = await lockStanding(tx, invoice.membership.id);
          let locked = await this.lockInvoice(tx, invoice.id);
          if ((locked.status === 'open' || locked.status === 'void') && session) {
            await this.markPaid(tx, locked, standing, this.cardSettlement(locked, session));
            locked = await this.lockInvoice(tx, invoice.id);
          }
          const payment = await tx.findOne(DuesPayment, { invoice: locked.id }, { refresh: true });
          if (!payment || payment.paymentIntentId !== piId) return 'ignored';
          const rows = await tx.find(DuesRefund, { payment: payment.id });
          for (const r of refunds) {
            if (rows.some((row) => row.providerRefundId === r.id)) continue;
            rows.push(
              tx.create(DuesRefund, {
                payment,
                guild: locked.guild,
                amountCents: r.amount,
                providerRefundId: r.id,
                reason: r.reason ?? null,
                by: null,
                byName: PAYMENT_SERVICE,
              }),
            );
            writeAudit(tx, {
              guild: locked.guild,
              actor: null,
              action: 'refund',
              subjectType: 'invoice',
              subjectId: locked.id,
              summary: `Refund of ${money(r.amount, locked.currency)} to ${locked.membership.user.name} on receipt ${locked.receiptNumber}, made at the payment service.`,
              detail: { invoiceId: locked.id, amountCents: r.amount, providerRefundId: r.id },
            });
          }
          this.applyRefundTotals(tx, locked, payment, standing, rows, charge.amount_refunded);
          await tx.flush();
          return 'paid';
        });
      }
      default:
        return this.recordOnly(event, null);
    }
  }

  /** For the access table and tests: whether card payment is configured. */
  get cardPaymentsEnabled(): boolean {
    return this.gateway.enabled;
  }
}

