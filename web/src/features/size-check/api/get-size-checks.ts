import { queryOptions, useQuery, type QueryClient, type QueryKey } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type SizeCheckStatus = 'measured' | 'failed' | 'manual';
export type SizeVerdict = 'in_size' | 'too_big' | 'too_small' | 'big_enough';

/** Sizes from a photo or a ruler, as millimetres and as inches to the nearest 1/16 ("12 9/16"). */
export type CheckedSize = { widthMm: number; heightMm: number | null; widthText: string | null; heightText: string | null };

/** api paths of the pictures Selvage keeps for a check; null when there is none of that kind. */
export type SizeCheckImages = { display: string | null; thumb: string | null; overlay: string | null; original: string | null };

/** One photo (or ruler reading) of a maker's block and what Selvage made of it. */
export type SizeCheck = {
  id: number;
  status: SizeCheckStatus;
  failureReason: string | null;
  /** Why a photo could not be measured, in plain words. */
  message: string | null;
  verdict: SizeVerdict | null;
  outOfSquare: boolean | null;
  /** One sentence for the maker; its sizes say finished or unfinished. */
  summary: string | null;
  measured: CheckedSize | null;
  manual: CheckedSize | null;
  diagonalsMm: [number, number] | null;
  cornerAnglesDeg: number[] | null;
  printScale: number | null;
  /** Her ruler reading of the card's long bar, in inches to 1/16. */
  rulerReadingText: string | null;
  onBehalf: boolean;
  createdAt: string;
  processingMs: number | null;
  images: SizeCheckImages;
};

export const blockPath = (guildId: string, beeId: string, month: string, membershipId: number) =>
  `/guilds/${encodeURIComponent(guildId)}/bees/${encodeURIComponent(beeId)}/rounds/${encodeURIComponent(month)}/blocks/${encodeURIComponent(String(membershipId))}`;

export const getSizeChecks = (guildId: string, beeId: string, month: string, membershipId: number, signal?: AbortSignal) =>
  api.get<SizeCheck[]>(`${blockPath(guildId, beeId, month, membershipId)}/size-checks`, signal);

export const sizeChecksQueryOptions = (guildId: string, beeId: string, month: string, membershipId: number) =>
  queryOptions({
    queryKey: ['guilds', guildId, 'bees', beeId, 'rounds', month, 'blocks', membershipId, 'size-checks'] as const,
    queryFn: ({ signal }) => getSizeChecks(guildId, beeId, month, membershipId, signal),
  });

/** A block's checks, newest first. */
export function useSizeChecks(guildId: string, beeId: string, month: string, membershipId: number, enabled = true) {
  return useQuery({ ...sizeChecksQueryOptions(guildId, beeId, month, membershipId), enabled });
}

/** After a new check: its history, plus other queries that show the latest one (the round page). */
export function invalidateSizeChecks(
  queryClient: QueryClient,
  key: { guildId: string; beeId: string; month: string; membershipId: number },
  alsoInvalidate: readonly QueryKey[] = [],
) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: sizeChecksQueryOptions(key.guildId, key.beeId, key.month, key.membershipId).queryKey }),
    ...alsoInvalidate.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
  ]);
}
