import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, Injectable } from '@nestjs/common';
import { DateTime } from 'luxon';
import PDFDocument from 'pdfkit';
import { Membership } from '../guilds/membership.entity';
import { centsColumn, toCsv } from './csv';
import { formatDate, membershipYearOf, membershipYearStarting, todayIn, type MembershipYear } from './dues-rules';
import { loadSettings } from './dues-support';
import { DuesService } from './dues.service';
import { formatMoney, minorUnitDigits } from './money';
import { registerFonts } from './receipt-pdf';
import { startYearOfLabel, yearReport, type Figures } from './year-report';

const STATUSES = ['current', 'grace', 'lapsed', 'lifetime', 'honorary'] as const;

/** The treasurer's year-end report: a page, a CSV and a PDF from the same figures. */
@Injectable()
export class DuesReportService {
  constructor(
    private readonly em: EntityManager,
    private readonly dues: DuesService,
  ) {}

  async report(me: Membership, label?: string) {
    const guild = me.guild;
    const settings = await loadSettings(this.em, guild);
    const year = this.yearFor(label, settings, todayIn(guild.timeZone));
    const conn = this.em.getConnection();
    const payments = await conn.execute<{ plan_name: string; paid_on: string; amount_cents: number; fee_cents: number }[]>(
      `SELECT i.plan_name, DATE_FORMAT(i.paid_on, '%Y-%m-%d') AS paid_on, p.amount_cents, p.fee_cents
         FROM dues_payments p JOIN dues_invoices i ON i.id = p.invoice_id
        WHERE i.guild_id = ? AND i.paid_on BETWEEN ? AND ?`,
      [guild.id, year.startsOn, year.endsOn],
    );
    // Refunds are kept with their moment in UTC; the year's bounds are midnights in the guild's zone.
    const from = DateTime.fromISO(year.startsOn, { zone: guild.timeZone }).toUTC().toJSDate();
    const to = DateTime.fromISO(year.endsOn, { zone: guild.timeZone }).plus({ days: 1 }).toUTC().toJSDate();
    const refunds = await conn.execute<{ plan_name: string; created_at: Date | string; amount_cents: number }[]>(
      `SELECT i.plan_name, r.created_at, r.amount_cents
         FROM dues_refunds r JOIN dues_payments p ON p.id = r.payment_id JOIN dues_invoices i ON i.id = p.invoice_id
        WHERE r.guild_id = ? AND r.created_at >= ? AND r.created_at < ?`,
      [guild.id, from, to],
    );
    const figures = yearReport(
      year,
      payments.map((p) => ({ planName: p.plan_name, paidOn: p.paid_on, amountCents: Number(p.amount_cents), feeCents: Number(p.fee_cents) })),
      refunds.map((r) => ({
        planName: r.plan_name,
        refundedOn: todayIn(guild.timeZone, r.created_at instanceof Date ? r.created_at : new Date(`${r.created_at.replace(' ', 'T')}Z`)),
        amountCents: Number(r.amount_cents),
      })),
    );
    const roster = await this.dues.roster(me);
    const membersByStatus = Object.fromEntries(STATUSES.map((s) => [s, roster.filter((r) => r.status === s).length])) as Record<
      (typeof STATUSES)[number],
      number
    >;
    const labels = (
      await conn.execute<{ year_label: string }[]>('SELECT DISTINCT year_label FROM dues_invoices WHERE guild_id = ?', [guild.id])
    ).map((r) => r.year_label);
    const years = [...new Set([membershipYearOf(todayIn(guild.timeZone), settings).label, ...labels])].sort().reverse();
    return {
      year: year.label,
      startsOn: year.startsOn,
      endsOn: year.endsOn,
      currency: guild.currency,
      incomeByMonth: figures.incomeByMonth,
      incomeByPlan: figures.incomeByPlan,
      totals: figures.totals,
      membersByStatus,
      years,
    };
  }

  async reportCsv(me: Membership, label?: string): Promise<{ filename: string; csv: string }> {
    const r = await this.report(me, label);
    const amount = (c: number) => centsColumn(c, minorUnitDigits(r.currency));
    const row = (section: string, name: string, f: Figures) => [
      section,
      name,
      f.count,
      amount(f.grossCents),
      amount(f.feeCents),
      amount(f.refundedCents),
      amount(f.netCents),
      r.currency,
    ];
    const csv = toCsv(
      ['Section', 'Month or plan', 'Payments', 'Received', 'Fees', 'Refunded', 'Net', 'Currency'],
      [
        ...r.incomeByMonth.map((m) => row('Month', m.month, m)),
        ...r.incomeByPlan.map((p) => row('Plan', p.planName, p)),
        row('Total', `${r.startsOn} to ${r.endsOn}`, r.totals),
        ...STATUSES.map((s) => ['Members', s, r.membersByStatus[s], null, null, null, null, null]),
      ],
    );
    return { filename: `dues-report-${fileLabel(r.year)}.csv`, csv };
  }

  async reportPdf(me: Membership, label?: string): Promise<{ filename: string; pdf: Buffer }> {
    const r = await this.report(me, label);
    const money = (c: number) => formatMoney(c, r.currency).replace(/\s/gu, ' ');
    const doc = new PDFDocument({ size: 'LETTER', margin: 54, displayTitle: true, lang: 'en', info: { Title: `Dues report ${r.year} — ${me.guild.name}` } });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    const done = new Promise<Buffer>((resolve, reject) => {
      doc.on('end', () => resolve(Buffer.concat(chunks)));
      doc.on('error', reject);
    });
    registerFonts(doc);
    const left = 54;
    const width = doc.page.width - 108;
    doc.font('bold').fontSize(22).text(me.guild.name, left, 54, { width });
    doc.font('bold').fontSize(18).text(`Dues report for ${r.year}`, { width });
    doc.font('regular').fontSize(12).fillColor('#333333').text(`Money received and paid back from ${formatDate(r.startsOn)} to ${formatDate(r.endsOn)}.`, { width });
    doc.fillColor('#000000').moveDown(0.8);

    const columns = [
      { title: '', w: 0.28 },
      { title: 'Payments', w: 0.12 },
      { title: 'Received', w: 0.15 },
      { title: 'Fees', w: 0.15 },
      { title: 'Refunded', w: 0.15 },
      { title: 'Net', w: 0.15 },
    ];
    const table = (heading: string, rows: [string, Figures][], total?: Figures) => {
      if (doc.y > doc.page.height - 200) doc.addPage();
      doc.font('bold').fontSize(14).text(heading, left, doc.y, { width });
      doc.moveDown(0.3);
      const line = (cells: string[], bold: boolean) => {
        const y = doc.y;
        let x = left;
        doc.font(bold ? 'bold' : 'regular').fontSize(11);
        cells.forEach((cell, i) => {
          doc.text(cell, x, y, { width: columns[i].w * width - 4, align: i === 0 ? 'left' : 'right', lineBreak: false });
          x += columns[i].w * width;
        });
        doc.y = y + 16;
      };
      line(columns.map((c) => c.title), true);
      for (const [name, f] of rows) line([name, String(f.count), money(f.grossCents), money(f.feeCents), money(f.refundedCents), money(f.netCents)], false);
      if (total) line(['Total', String(total.count), money(total.grossCents), money(total.feeCents), money(total.refundedCents), money(total.netCents)], true);
      doc.moveDown(0.8);
    };
    const monthName = (m: string) => DateTime.fromISO(`${m}-01`).toFormat('MMMM yyyy');
    table('By month', r.incomeByMonth.map((m) => [monthName(m.month), m]), r.totals);
    table('By plan', r.incomeByPlan.map((p) => [p.planName, p]), r.totals);
    doc.font('bold').fontSize(14).text('Members today', left, doc.y, { width });
    doc.font('regular').fontSize(12);
    const words: Record<(typeof STATUSES)[number], string> = {
      current: 'Paid up',
      grace: 'In the grace period',
      lapsed: 'Lapsed',
      lifetime: 'Lifetime members',
      honorary: 'Honorary members',
    };
    for (const s of STATUSES) doc.text(`${words[s]}: ${r.membersByStatus[s]}`, left, doc.y, { width });
    doc.end();
    return { filename: `dues-report-${fileLabel(r.year)}.pdf`, pdf: await done };
  }

  private yearFor(label: string | undefined, settings: Parameters<typeof membershipYearOf>[1], today: string): MembershipYear {
    if (label === undefined || label.trim() === '') return membershipYearOf(today, settings);
    const start = startYearOfLabel(label);
    if (start === null || start < 1900 || start > 2999)
      throw new BadRequestException({
        message: 'Choose a membership year from the list.',
        errors: { year: ['Choose a membership year from the list, like 2026 or 2025–26.'] },
      });
    return membershipYearStarting(start, settings);
  }
}

const fileLabel = (label: string) => label.replace(/[^0-9]+/g, '-');
