import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { parseInches } from '@/lib/inches';
import { blockPath, invalidateSizeChecks, type SizeCheck } from './get-size-checks';

/** Inch strings as she types them: "12 1/2", "12.5", "12½". */
export type ManualSizeInput = { width: string; height: string };

const side = (which: string) =>
  yup
    .string()
    .trim()
    .required(`Type the ${which} your ruler shows.`)
    .test('inches', `Type the ${which} in inches, like 12 1/2 or 12.5.`, (value) => {
      const inches = parseInches(value);
      return inches !== null && inches > 0 && inches <= 120;
    });

export const manualSizeSchema = yup.object({ width: side('width'), height: side('height') });

export const saveManualSize = (guildId: string, beeId: string, month: string, membershipId: number, input: ManualSizeInput) =>
  api.post<SizeCheck>(`${blockPath(guildId, beeId, month, membershipId)}/manual-size`, {
    width: input.width.trim(),
    height: input.height.trim(),
  });

/** `alsoInvalidate`: other queries that show the latest check, such as the round page. */
export function useSaveManualSize(
  guildId: string,
  beeId: string,
  month: string,
  membershipId: number,
  alsoInvalidate: readonly QueryKey[] = [],
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ManualSizeInput) => saveManualSize(guildId, beeId, month, membershipId, input),
    onSuccess: () => invalidateSizeChecks(queryClient, { guildId, beeId, month, membershipId }, alsoInvalidate),
  });
}
