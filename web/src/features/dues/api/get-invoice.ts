import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import type { InvoiceStatus, PaymentMethod, QuoteLine } from './get-my-dues';
import { duesHref, duesPath, duesQueryKey } from './dues-path';

export type Invoice = {
  id: number;
  status: InvoiceStatus;
  /** Dues, or a member's entry fees for one quilt show (`showId`). */
  purpose?: 'dues' | 'show_entry';
  showId?: number | null;
  label: string;
  lines: QuoteLine[];
  totalCents: number;
  currency: string;
  coversFrom: string | null;
  coversThrough: string | null;
  receiptNumber: string | null;
  paidOn: string | null;
  method: PaymentMethod | null;
  memberName: string;
};

export const getInvoice = (guildId: string, invoiceId: string | number, signal?: AbortSignal) =>
  api.get<Invoice>(`${duesPath(guildId)}/invoices/${encodeURIComponent(String(invoiceId))}`, signal);

export const invoiceQueryOptions = (guildId: string, invoiceId: string | number) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'invoices', String(invoiceId)] as const,
    queryFn: ({ signal }) => getInvoice(guildId, invoiceId, signal),
  });

export const receiptHref = (guildId: string, invoiceId: string | number) =>
  duesHref(guildId, `/invoices/${encodeURIComponent(String(invoiceId))}/receipt.pdf`);

type PollOptions = {
  /** How often to ask while the payment is still open. */
  intervalMs: number;
  /** Asking stops once this is false (e.g. after a minute). */
  keepPolling: boolean;
};

/**
 * The invoice after she comes back from the payment page. The payment service tells Selvage
 * separately (a webhook), so the invoice can still be open for a few seconds: ask again until it is
 * not, or until the caller gives up.
 */
export function useInvoicePoll(guildId: string, invoiceId: string, { intervalMs, keepPolling }: PollOptions) {
  return useQuery({
    ...invoiceQueryOptions(guildId, invoiceId),
    enabled: invoiceId !== '',
    staleTime: 0,
    refetchInterval: (query) => {
      const { data, error } = query.state;
      // An unknown invoice or a refusal will not change by asking again.
      if (!keepPolling || (isApiError(error) && error.status >= 400 && error.status < 500)) return false;
      return !data || data.status === 'open' ? intervalMs : false;
    },
    refetchIntervalInBackground: false,
  });
}
