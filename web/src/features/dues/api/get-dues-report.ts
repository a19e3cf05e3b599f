import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MoneyTotals } from './get-ledger';
import type { DuesStatus } from './get-my-dues';
import { duesHref, duesPath, duesQueryKey, toQueryString } from './dues-path';

export type MonthIncome = MoneyTotals & { month: string };

export type DuesReport = {
  year: string;
  incomeByPlan: { planName: string; count: number; grossCents: number }[];
  incomeByMonth: MonthIncome[];
  totals: MoneyTotals;
  membersByStatus: Record<DuesStatus, number>;
  /** Membership years there is something to report on, newest first. */
  years?: string[];
};

const yearQuery = (year: string) => toQueryString({ year });

export const getDuesReport = (guildId: string, year: string, signal?: AbortSignal) =>
  api.get<DuesReport>(`${duesPath(guildId)}/report${yearQuery(year)}`, signal);

export const duesReportQueryOptions = (guildId: string, year: string) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'report', year] as const,
    queryFn: ({ signal }) => getDuesReport(guildId, year, signal),
  });

export function useDuesReport(guildId: string, year: string) {
  return useQuery({ ...duesReportQueryOptions(guildId, year), placeholderData: keepPreviousData });
}

export const reportCsvHref = (guildId: string, year: string) => duesHref(guildId, `/report.csv${yearQuery(year)}`);
export const reportPdfHref = (guildId: string, year: string) => duesHref(guildId, `/report.pdf${yearQuery(year)}`);
