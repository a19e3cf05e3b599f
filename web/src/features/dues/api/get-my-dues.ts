import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DuesPlan } from './get-dues-plans';
import { duesPath, duesQueryKey } from './dues-path';

export type DuesStatus = 'current' | 'grace' | 'lapsed' | 'lifetime' | 'honorary';
export type PaymentMethod = 'card' | 'cash' | 'cheque';
export type InvoiceStatus = 'open' | 'paid' | 'void' | 'refunded' | 'partially_refunded';

export type QuoteLine = { kind: 'dues' | 'proration' | 'late-fee'; label: string; amountCents: number };

export type DuesQuote = {
  lines: QuoteLine[];
  totalCents: number;
  currency: string;
  coversFrom: string | null;
  coversThrough: string | null;
  /** Why nothing is owed (no-dues plan, renewal not open yet); null when the quote is a charge. */
  note: string | null;
};

export type PaymentRecord = {
  invoiceId: number;
  label: string;
  issuedOn: string;
  totalCents: number;
  currency: string;
  status: InvoiceStatus;
  method: PaymentMethod | null;
  paidOn: string | null;
  receiptNumber: string | null;
  refundedCents: number;
  /** Cash and cheques: the officer who recorded the payment for her. */
  recordedBy?: string | null;
};

export type MyDues = {
  status: DuesStatus;
  statusEndsOn: string | null;
  paidThrough: string | null;
  plan: DuesPlan | null;
  household: { id: number; name: string; members: string[] } | null;
  quote: DuesQuote | null;
  /** What each plan she may choose would cost her today. */
  quotes?: { planId: number; quote: DuesQuote | null }[];
  openInvoice: { id: number } | null;
  history: PaymentRecord[];
};

/** Her status, what she owes on her plan today, and her payments. */
export const getMyDues = (guildId: string, signal?: AbortSignal) => api.get<MyDues>(`${duesPath(guildId)}/me`, signal);

export const myDuesQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'me'] as const,
    queryFn: ({ signal }) => getMyDues(guildId, signal),
  });

export function useMyDues(guildId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...myDuesQueryOptions(guildId), ...options });
}

/** A quote that asks for money (not a "nothing to pay" note). */
export const hasCharge = (quote: DuesQuote | null | undefined): boolean => Boolean(quote && quote.totalCents > 0 && quote.lines.length > 0);
