import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DuesStatus } from './get-my-dues';
import { duesHref, duesPath, duesQueryKey, toQueryString } from './dues-path';

export type RosterRow = {
  membershipId: number;
  name: string;
  /** Null for a member kept on paper. */
  email: string | null;
  planName?: string | null;
  /** Her plan, where the api gives it as an object. */
  plan?: { id: number; name: string; kind: string } | null;
  status: DuesStatus;
  paidThrough: string | null;
  statusEndsOn: string | null;
};

/** Statuses to show, e.g. ['grace', 'lapsed']; empty for everyone. */
export type RosterFilter = readonly DuesStatus[];

export const rosterPlanName = (row: RosterRow) => row.planName ?? row.plan?.name ?? null;

export const BEHIND_STATUSES: RosterFilter = ['grace', 'lapsed'];

export const rosterQueryString = (statuses: RosterFilter) => toQueryString({ status: statuses.join(',') });

export const getRoster = (guildId: string, statuses: RosterFilter, signal?: AbortSignal) =>
  api.get<RosterRow[]>(`${duesPath(guildId)}/roster${rosterQueryString(statuses)}`, signal);

export const rosterQueryOptions = (guildId: string, statuses: RosterFilter) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'roster', statuses.join(',')] as const,
    queryFn: ({ signal }) => getRoster(guildId, statuses, signal),
  });

export function useRoster(guildId: string, statuses: RosterFilter = []) {
  return useQuery({ ...rosterQueryOptions(guildId, statuses), placeholderData: keepPreviousData });
}

export const rosterCsvHref = (guildId: string, statuses: RosterFilter) => duesHref(guildId, `/roster.csv${rosterQueryString(statuses)}`);
