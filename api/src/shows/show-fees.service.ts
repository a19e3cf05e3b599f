import { EntityManager } from '@mikro-orm/mariadb';
import { ConflictException, Injectable } from '@nestjs/common';
import { DuesInvoice } from '../dues/dues-invoice.entity';
import { DuesLedgerService } from '../dues/dues-ledger.service';
import { formatMoney } from '../dues/money';
import { PaymentsGateway } from '../dues/payments-gateway';
import { Membership } from '../guilds/membership.entity';
import { ShowEntry } from './show-entry.entity';
import { entryFeeCents, feeText } from './show-presenter';
import type { Show } from './show.entity';
import { ShowsService } from './shows.service';

const PAID = ['paid', 'partially_refunded', 'refunded'] as const;

/**
 * A member's entry fees for a show, paid by card through the same checkout, webhook, receipts and
 * ledger as dues. What she owes follows her entries still in the show (submitted or accepted), at
 * the show's fee per quilt up to its cap per member (TRADE.md §6.4: e.g. $5 each, capped at $25).
 */
@Injectable()
export class ShowFeesService {
  constructor(
    private readonly em: EntityManager,
    private readonly shows: ShowsService,
    private readonly ledger: DuesLedgerService,
    private readonly gateway: PaymentsGateway,
  ) {}

  private async account(em: EntityManager, show: Show, membershipId: number) {
    const quilts = await em.count(ShowEntry, { show: show.id, membership: membershipId, status: { $in: ['submitted', 'accepted'] } });
    const invoices = await em.find(DuesInvoice, { membership: membershipId, purpose: 'show_entry', showId: show.id, status: { $ne: 'void' } }, { orderBy: { id: 'asc' } });
    const paid = invoices.filter((i) => (PAID as readonly string[]).includes(i.status));
    const paidCents = paid.reduce((n, i) => n + i.totalCents - i.refundedCents, 0);
    const owedCents = entryFeeCents(show, quilts);
    return { quilts, owedCents, paidCents, dueCents: Math.max(0, owedCents - paidCents), invoices, paid };
  }

  async mine(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    const a = await this.account(this.em, show, me.id);
    const open = a.invoices.find((i) => i.status === 'open');
    return {
      feeText: feeText(show),
      currency: show.guild.currency,
      quilts: a.quilts,
      owedCents: a.owedCents,
      paidCents: a.paidCents,
      dueCents: a.dueCents,
      canPayOnline: this.gateway.enabled,
      openInvoiceId: open?.id ?? null,
      payments: a.paid.map((i) => ({ invoiceId: i.id, receiptNumber: i.receiptNumber ?? null, amountCents: i.totalCents, refundedCents: i.refundedCents, paidOn: i.paidOn ?? null })),
    };
  }

  async checkout(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    if (!show.entryFeeCents) throw new ConflictException(`${show.name} has no entry fee.`);
    const money = (c: number) => formatMoney(c, show.guild.currency);
    return this.ledger.checkoutCharge(me, {
      purpose: 'show_entry',
      showId: show.id,
      label: show.name,
      planName: 'Show entry fees',
      openKey: `entry:${show.id}:${me.id}`,
      returnPath: `/guilds/${show.guild.id}/shows/${show.id}`,
      linesFor: async (tx) => {
        const a = await this.account(tx, show, me.id);
        if (a.dueCents === 0) {
          if (a.quilts === 0) throw new ConflictException(`You have no quilts entered in ${show.name}, so there is nothing to pay.`);
          return [];
        }
        const each = `${a.quilts} ${a.quilts === 1 ? 'quilt' : 'quilts'} at ${money(show.entryFeeCents)}`;
        const capped = a.owedCents < show.entryFeeCents * a.quilts ? `, capped at ${money(a.owedCents)}` : '';
        const less = a.paidCents > 0 ? `, less ${money(a.paidCents)} already paid` : '';
        return [{ kind: 'entry-fee', label: `Entry fees, ${show.name}: ${each}${capped}${less}`.slice(0, 200), amountCents: a.dueCents }];
      },
    });
  }
}
