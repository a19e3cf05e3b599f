import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PlanInput } from './create-dues-plan';
import { duesPath, duesQueryKey } from './dues-path';
import type { DuesPlan } from './get-dues-plans';

export const updateDuesPlan = (guildId: string, planId: number, input: PlanInput) =>
  api.patch<DuesPlan>(`${duesPath(guildId)}/plans/${encodeURIComponent(String(planId))}`, input);

export function useUpdateDuesPlan(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ planId, input }: { planId: number; input: PlanInput }) => updateDuesPlan(guildId, planId, input),
    // Quotes and the roster name the plan too.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: duesQueryKey(guildId) }),
  });
}
