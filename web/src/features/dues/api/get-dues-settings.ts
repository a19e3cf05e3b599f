import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { duesPath, duesQueryKey } from './dues-path';

export type ProrationBand = {
  /** First month (1–12) of the band; it runs until the next band's month. */
  fromMonth: number;
  charge: 'full' | 'half';
  /** A joiner in these months is also paid up for the whole of the next year. */
  coversNextYear: boolean;
};

export type MembershipYear = { label: string; startsOn: string; endsOn: string };

export type DuesSettings = {
  currency: string;
  yearStartMonth: number;
  dueMonth: number;
  dueDay: number;
  graceDays: number;
  lateFeeCents: number;
  earlyRenewalDays: number;
  proration: ProrationBand[];
  currentYear: MembershipYear;
  dueOn: string;
  graceEndsOn: string;
  /** False while the guild has never set up dues (it then does not take dues through Selvage). */
  configured?: boolean;
};

export const getDuesSettings = (guildId: string, signal?: AbortSignal) =>
  api.get<DuesSettings>(`${duesPath(guildId)}/settings`, signal);

export const duesSettingsQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'settings'] as const,
    queryFn: ({ signal }) => getDuesSettings(guildId, signal),
  });

export function useDuesSettings(guildId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...duesSettingsQueryOptions(guildId), ...options });
}
