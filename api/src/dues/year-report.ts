/**
 * The treasurer's year-end figures, as pure functions: money received in the membership year by month
 * and by plan, processing fees, refunds paid out, and what is left. Cash basis — what reached or left
 * the guild's account between the year's first and last day — because that is what she reconciles
 * against the bank statements (TRADE.md §4.7). All sums are integer cents.
 */
import type { IsoDate, MembershipYear } from './dues-rules';

export interface ReportPayment {
  planName: string;
  paidOn: IsoDate;
  amountCents: number;
  feeCents: number;
}

export interface ReportRefund {
  planName: string;
  refundedOn: IsoDate;
  amountCents: number;
}

export interface Figures {
  count: number;
  grossCents: number;
  feeCents: number;
  refundedCents: number;
  netCents: number;
}

export interface YearReport {
  year: MembershipYear;
  incomeByMonth: ({ month: string } & Figures)[];
  incomeByPlan: ({ planName: string } & Figures)[];
  totals: Figures;
}

const empty = (): Figures => ({ count: 0, grossCents: 0, feeCents: 0, refundedCents: 0, netCents: 0 });

/** "YYYY-MM" for every month of the year, in order. */
export function monthsOf(year: MembershipYear): string[] {
  const months: string[] = [];
  let [y, m] = year.startsOn.split('-').map(Number);
  const last = year.endsOn.slice(0, 7);
  for (;;) {
    const key = `${y}-${String(m).padStart(2, '0')}`;
    months.push(key);
    if (key === last || months.length > 24) break;
    m += 1;
    if (m === 13) {
      m = 1;
      y += 1;
    }
  }
  return months;
}

/**
 * Sums payments and refunds dated inside the year; anything dated outside it is left out (an early
 * renewal paid in the last weeks of the previous year counts there, as the bank saw it).
 */
export function yearReport(year: MembershipYear, payments: readonly ReportPayment[], refunds: readonly ReportRefund[]): YearReport {
  const inYear = (d: IsoDate) => d >= year.startsOn && d <= year.endsOn;
  const byMonth = new Map(monthsOf(year).map((m) => [m, empty()]));
  const byPlan = new Map<string, Figures>();
  const plan = (name: string) => {
    let f = byPlan.get(name);
    if (!f) byPlan.set(name, (f = empty()));
    return f;
  };
  const totals = empty();
  for (const p of payments) {
    if (!inYear(p.paidOn)) continue;
    for (const f of [byMonth.get(p.paidOn.slice(0, 7))!, plan(p.planName), totals]) {
      f.count += 1;
      f.grossCents += p.amountCents;
      f.feeCents += p.feeCents;
    }
  }
  for (const r of refunds) {
    if (!inYear(r.refundedOn)) continue;
    for (const f of [byMonth.get(r.refundedOn.slice(0, 7))!, plan(r.planName), totals]) f.refundedCents += r.amountCents;
  }
  for (const f of [...byMonth.values(), ...byPlan.values(), totals]) f.netCents = f.grossCents - f.feeCents - f.refundedCents;
  return {
    year,
    incomeByMonth: [...byMonth].map(([month, f]) => ({ month, ...f })),
    incomeByPlan: [...byPlan]
      .map(([planName, f]) => ({ planName, ...f }))
      .sort((a, b) => b.grossCents - a.grossCents || a.planName.localeCompare(b.planName)),
    totals,
  };
}

/** The first calendar year in a label such as "2026" or "2025–26"; null when it is not one. */
export function startYearOfLabel(label: string): number | null {
  const m = /^(\d{4})(?:\s*[–-]\s*(\d{2}|\d{4}))?$/.exec(label.trim());
  return m ? Number(m[1]) : null;
}
