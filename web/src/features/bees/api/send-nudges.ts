import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { roundPath } from './get-round';

export const sendNudges = (guildId: string, beeId: string, month: string) =>
  api.post<{ nudged: number }>(`${roundPath(guildId, beeId, month)}/nudges`, {});

export function useSendNudges(guildId: string, beeId: string, month: string) {
  return useMutation({ mutationFn: () => sendNudges(guildId, beeId, month) });
}
