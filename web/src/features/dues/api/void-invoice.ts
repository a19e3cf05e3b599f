import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { duesPath, duesQueryKey } from './dues-path';

export const voidInvoice = (guildId: string, invoiceId: number) =>
  api.post<unknown>(`${duesPath(guildId)}/invoices/${encodeURIComponent(String(invoiceId))}/void`, {});

export function useVoidInvoice(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invoiceId: number) => voidInvoice(guildId, invoiceId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: duesQueryKey(guildId) }),
  });
}
