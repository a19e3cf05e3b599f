import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { duesPath, duesQueryKey } from './dues-path';

export type PlanKind = 'standard' | 'household' | 'lifetime' | 'honorary';

export type DuesPlan = {
  id: number;
  name: string;
  kind: PlanKind;
  yearlyCents: number;
  minAge: number | null;
  maxAge: number | null;
  active: boolean;
};

export const getDuesPlans = (guildId: string, signal?: AbortSignal) => api.get<DuesPlan[]>(`${duesPath(guildId)}/plans`, signal);

export const duesPlansQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'plans'] as const,
    queryFn: ({ signal }) => getDuesPlans(guildId, signal),
  });

export function useDuesPlans(guildId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...duesPlansQueryOptions(guildId), ...options });
}

/** Plans a member can choose and pay for herself: active ones that charge dues. */
export function payablePlans(plans: readonly DuesPlan[]): DuesPlan[] {
  return plans.filter((p) => p.active && (p.kind === 'standard' || p.kind === 'household'));
}
