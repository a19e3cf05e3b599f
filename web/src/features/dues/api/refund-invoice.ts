import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { formatMoney, parseMoney } from '../lib/money';
import { duesPath, duesQueryKey } from './dues-path';

export type RefundValues = { amount: string; reason: string };
export type RefundInput = { amountCents: number; reason?: string };

/** Up to what is left to give back on the invoice. */
export const refundSchema = (currency: string, refundableCents: number) =>
  yup.object({
    amount: yup
      .string()
      .trim()
      .required('Enter the amount to refund.')
      .test('money', (value, context) => {
        if (!value) return true;
        const parsed = parseMoney(value, currency);
        if (!parsed.ok) return context.createError({ message: parsed.message });
        if (parsed.cents <= 0) return context.createError({ message: 'The refund must be more than nothing.' });
        if (parsed.cents > refundableCents)
          return context.createError({ message: `You can refund at most ${formatMoney(refundableCents, currency)}.` });
        return true;
      }),
    reason: yup.string().trim().max(500, 'Keep the reason under 500 characters.'),
  });

export const refundInvoice = (guildId: string, invoiceId: number, input: RefundInput) =>
  api.post<unknown>(`${duesPath(guildId)}/invoices/${encodeURIComponent(String(invoiceId))}/refunds`, input);

export function useRefundInvoice(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ invoiceId, input }: { invoiceId: number; input: RefundInput }) => refundInvoice(guildId, invoiceId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: duesQueryKey(guildId) }),
  });
}
