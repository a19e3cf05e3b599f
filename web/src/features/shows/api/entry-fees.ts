import { useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';

export type EntryFees = {
  feeText: string | null;
  currency: string;
  quilts: number;
  owedCents: number;
  paidCents: number;
  dueCents: number;
  canPayOnline: boolean;
  openInvoiceId: number | null;
  payments: { invoiceId: number; receiptNumber: string | null; amountCents: number; refundedCents: number; paidOn: string | null }[];
};

export const getEntryFees = (guildId: string, showId: string, signal?: AbortSignal) => api.get<EntryFees>(`${showPath(guildId, showId)}/fees/mine`, signal);

export function useEntryFees(guildId: string, showId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ queryKey: [...showQueryKey(guildId, showId), 'fees', 'mine'] as const, queryFn: ({ signal }) => getEntryFees(guildId, showId, signal), ...options });
}

/** Starts a card payment for what she owes; the answer's url is the payment service's page. */
export function usePayEntryFees(guildId: string, showId: string) {
  return useMutation({ mutationFn: () => api.post<{ invoiceId: number; url: string }>(`${showPath(guildId, showId)}/fees/checkout`, {}) });
}
