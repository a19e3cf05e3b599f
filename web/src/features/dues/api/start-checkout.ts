import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { duesPath } from './dues-path';

export type Checkout = { invoiceId: number; url: string };

export const startCheckout = (guildId: string, planId: number) => api.post<Checkout>(`${duesPath(guildId)}/checkout`, { planId });

export function useStartCheckout(guildId: string) {
  return useMutation({ mutationFn: (planId: number) => startCheckout(guildId, planId) });
}
