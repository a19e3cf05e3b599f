import { queryOptions, useQuery } from '@tanstack/react-query';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';
import { beesPath, beesQueryOptions, type Handover, type MyBeeStatus, type PersonRef } from './get-bees';

export type BeeMemberStatus = 'active' | 'invited' | 'organiser' | 'left';
export type BeeMember = PersonRef & { status: BeeMemberStatus; /** She does not sign in; the organiser acts for her. */ onPaper?: boolean };
export type RoundStatus = 'draft' | 'published';

export type RotationMonth = {
  month: string;
  skipped: boolean;
  queen: PersonRef | null;
  round: { status: RoundStatus; title: string | null; sent?: boolean } | null;
  /** Before this month (in the guild's time zone). */
  past?: boolean;
  /** Months after this one; only these can be skipped, swapped or re-planned. */
  editable?: boolean;
};

/** Whether the organiser may still change a month: the api's flag, or "after this month". */
export const isEditableMonth = (row: RotationMonth, thisMonth: string) => row.editable ?? row.month > thisMonth;
export const isPastMonth = (row: RotationMonth, thisMonth: string) => row.past ?? row.month < thisMonth;

export type Bee = {
  id: number;
  name: string;
  description: string | null;
  handover: Handover;
  startMonth: string;
  months: number;
  skippedMonths: string[];
  organiser: PersonRef;
  members: BeeMember[];
  isOrganiser: boolean;
  myStatus: MyBeeStatus;
  rotation: RotationMonth[];
  seed: string | number | null;
  /** This month in the guild's time zone, "YYYY-MM". */
  currentMonth?: string;
  /** For the organiser: guild members who do not sign in and are not making yet; she adds them herself. */
  addable?: PersonRef[];
};

/** The printed schedule of the bee's year. */
export const beeSchedulePdfHref = (guildId: string, beeId: string) => `${env.apiBaseUrl}${beePath(guildId, beeId)}/schedule.pdf`;

export const beePath = (guildId: string, beeId: string) => `${beesPath(guildId)}/${encodeURIComponent(beeId)}`;

export const getBee = (guildId: string, beeId: string, signal?: AbortSignal) => api.get<Bee>(beePath(guildId, beeId), signal);

export const beeQueryOptions = (guildId: string, beeId: string) =>
  queryOptions({
    queryKey: [...beesQueryOptions(guildId).queryKey, beeId] as const,
    queryFn: ({ signal }) => getBee(guildId, beeId, signal),
  });

export function useBee(guildId: string, beeId: string) {
  return useQuery(beeQueryOptions(guildId, beeId));
}
