import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SizeCheck } from '@/features/size-check/api/get-size-checks';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions, type RoundStatus } from './get-bee';
import type { PersonRef } from './get-bees';

export type Size = { widthMm: number; heightMm: number; widthText: string; heightText: string };
export type Swatch = { name: string; hex: string };
export type TrimMode = 'trim' | 'untrimmed';
export type FabricSource = 'stash' | 'queen_sends';
export type DeliveryMethod = 'mail' | 'meeting';
export type BlockStatus = 'not_started' | 'made' | 'mailed' | 'handed_over' | 'received';

export type RoundFile = { id: number; filename: string; contentType: string; size: number };

export type Round = {
  id: number;
  status: RoundStatus;
  publishedAt: string | null;
  sentAt: string | null;
  sendAt: string | null;
  title: string;
  instructions: string;
  instructionsHtml: string;
  patternLink: string | null;
  finishedWidth: string;
  finishedHeight: string;
  seamAllowance?: string | null;
  tolerance?: string | null;
  finished: Size;
  unfinished: Size;
  seamAllowanceText: string;
  toleranceText: string;
  trimMode: TrimMode;
  swatches: Swatch[];
  background: Swatch | null;
  fabricSource: FabricSource;
  dueDate: string;
  sendDate: string | null;
  sendTime: string | null;
  deliveryMethod: DeliveryMethod;
  /** Omitted for people outside the bee. */
  deliveryAddress?: string | null;
  meetingDetails?: string | null;
  files: RoundFile[];
};

export type Block = {
  membershipId: number;
  name: string;
  status: BlockStatus;
  trackingNumber: string | null;
  late: boolean;
  updatedAt: string | null;
  updatedOnBehalf: boolean;
  /** Who set it for her, when someone else did. */
  updatedByName?: string | null;
  /** She does not sign in: the queen or the organiser marks her block for her. */
  onPaper?: boolean;
  /** The latest size check of the block, or null; absent from older api builds. */
  sizeCheck?: SizeCheck | null;
};

export type RoundPage = {
  month: string;
  queen: PersonRef | null;
  canEdit: boolean;
  isMaker: boolean;
  skipped?: boolean;
  isQueen?: boolean;
  isOrganiser?: boolean;
  /** Whether the viewer is in the bee (only members see where blocks go). */
  isBeeMember?: boolean;
  /** When the e-mail goes out if the queen keeps the default send date and time. */
  defaultSendAt?: string | null;
  sendAt?: string | null;
  round: Round | null;
  /** Empty until the round has gone out to the makers. */
  blocks: Block[];
  /** If the api sends it: the viewer's own membership in this guild. */
  myMembershipId?: number;
};

/** Saving and publishing answer with the whole page or with the round alone; fold either into the cache. */
export function mergeRoundResponse(page: RoundPage | undefined, response: unknown): RoundPage | undefined {
  if (!page || !response || typeof response !== 'object') return page;
  if ('blocks' in response && 'canEdit' in response) return response as RoundPage;
  if ('status' in response && 'title' in response) return { ...page, round: response as Round };
  return page;
}

export const roundPath = (guildId: string, beeId: string, month: string) =>
  `${beePath(guildId, beeId)}/rounds/${encodeURIComponent(month)}`;

export const getRound = (guildId: string, beeId: string, month: string, signal?: AbortSignal) =>
  api.get<RoundPage>(roundPath(guildId, beeId, month), signal);

export const roundQueryOptions = (guildId: string, beeId: string, month: string) =>
  queryOptions({
    queryKey: [...beeQueryOptions(guildId, beeId).queryKey, 'rounds', month] as const,
    queryFn: ({ signal }) => getRound(guildId, beeId, month, signal),
  });

export function useRound(guildId: string, beeId: string, month: string) {
  return useQuery(roundQueryOptions(guildId, beeId, month));
}

export const BLOCK_STATUS_LABELS: Record<BlockStatus, string> = {
  not_started: 'Not started',
  made: 'Made',
  mailed: 'Mailed',
  handed_over: 'Handed over',
  received: 'Received by the queen',
};

export function blockStatusLabel(status: string): string {
  return BLOCK_STATUS_LABELS[status as BlockStatus] ?? status.replace(/_/g, ' ');
}
