import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InvoiceStatus, PaymentMethod } from './get-my-dues';
import { duesHref, duesPath, duesQueryKey, toQueryString } from './dues-path';

export type LedgerRow = {
  invoiceId: number;
  memberName: string;
  planName: string | null;
  label: string;
  issuedOn: string;
  status: InvoiceStatus;
  method: PaymentMethod | null;
  /** What the invoice asked for; grossCents is what was received (0 until paid). */
  totalCents?: number;
  grossCents: number;
  feeCents: number;
  refundedCents: number;
  netCents: number;
  paidOn: string | null;
  receiptNumber: string | null;
  reference: string | null;
};

export type MoneyTotals = { grossCents: number; feeCents: number; refundedCents: number; netCents: number };

export type Ledger = {
  rows: LedgerRow[];
  totals: MoneyTotals & { count: number };
  /** Membership years with invoices, e.g. ["2026–27", "2025–26"]. */
  years: string[];
};

export type LedgerFilters = { year: string; planId: string; status: string; method: string };

export const EMPTY_LEDGER_FILTERS: LedgerFilters = { year: '', planId: '', status: '', method: '' };

const FILTER_KEYS = ['year', 'planId', 'status', 'method'] as const;

/** The filters from the page's address (?year=…&status=…); anything else is ignored. */
export function ledgerFiltersFromSearch(search: URLSearchParams): LedgerFilters {
  const filters = { ...EMPTY_LEDGER_FILTERS };
  for (const key of FILTER_KEYS) filters[key] = search.get(key)?.trim() ?? '';
  return filters;
}

/** "?year=2026-27&status=paid": only the filters that are set, in a fixed order. */
export const ledgerQueryString = (filters: LedgerFilters) =>
  toQueryString({ year: filters.year, planId: filters.planId, status: filters.status, method: filters.method });

export const getLedger = (guildId: string, filters: LedgerFilters, signal?: AbortSignal) =>
  api.get<Ledger>(`${duesPath(guildId)}/ledger${ledgerQueryString(filters)}`, signal);

export const ledgerQueryOptions = (guildId: string, filters: LedgerFilters) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'ledger', ledgerQueryString(filters)] as const,
    queryFn: ({ signal }) => getLedger(guildId, filters, signal),
  });

export function useLedger(guildId: string, filters: LedgerFilters) {
  return useQuery({ ...ledgerQueryOptions(guildId, filters), placeholderData: keepPreviousData });
}

export const ledgerCsvHref = (guildId: string, filters: LedgerFilters) => duesHref(guildId, `/ledger.csv${ledgerQueryString(filters)}`);
