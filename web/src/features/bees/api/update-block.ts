import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { roundPath, roundQueryOptions, type Block, type BlockStatus, type RoundPage } from './get-round';

export const MAKER_STATUSES: readonly BlockStatus[] = ['not_started', 'made', 'mailed', 'handed_over'];

export const blockStatusSchema = yup.object({
  status: yup.string().oneOf(['not_started', 'made', 'mailed', 'handed_over', 'received'], 'Choose a status.').required('Choose a status.'),
  trackingNumber: yup.string().trim().max(80, 'Keep the tracking number under 80 characters.'),
});
export type BlockStatusValues = { status: BlockStatus; trackingNumber: string };
export type UpdateBlockInput = { status: BlockStatus; trackingNumber?: string };

export const toUpdateBlockInput = (values: BlockStatusValues): UpdateBlockInput => ({
  status: values.status,
  ...(values.status === 'mailed' && values.trackingNumber.trim() ? { trackingNumber: values.trackingNumber.trim() } : {}),
});

export const updateBlock = (guildId: string, beeId: string, month: string, membershipId: number, input: UpdateBlockInput) =>
  api.patch<Block>(`${roundPath(guildId, beeId, month)}/blocks/${encodeURIComponent(String(membershipId))}`, input);

/** `alsoInvalidate`: other features' queries that show block status (the dashboard's "Blocks I owe"). */
export function useUpdateBlock(guildId: string, beeId: string, month: string, alsoInvalidate: readonly QueryKey[] = []) {
  const queryClient = useQueryClient();
  const key = roundQueryOptions(guildId, beeId, month).queryKey;
  return useMutation({
    mutationFn: ({ membershipId, input }: { membershipId: number; input: UpdateBlockInput }) =>
      updateBlock(guildId, beeId, month, membershipId, input),
    onSuccess: async (block, { membershipId }) => {
      if (block && typeof block === 'object' && 'status' in block) {
        queryClient.setQueryData<RoundPage>(key, (page) =>
          page ? { ...page, blocks: page.blocks.map((b) => (b.membershipId === membershipId ? { ...b, ...block } : b)) } : page,
        );
      }
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: key }),
        ...alsoInvalidate.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
      ]);
    },
  });
}
