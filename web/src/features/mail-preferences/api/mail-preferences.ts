import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type MailPreferences = { reminders: boolean };
const key = ['profile', 'mail-preferences'] as const;

export function useMailPreferences() {
  return useQuery({ queryKey: key, queryFn: ({ signal }) => api.get<MailPreferences>('/profile/mail-preferences', signal) });
}

export function useSaveMailPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (prefs: MailPreferences) => api.put<MailPreferences>('/profile/mail-preferences', prefs),
    onSuccess: (data) => queryClient.setQueryData(key, data),
  });
}

/** The signed link from a reminder e-mail: what it says now, and turning reminders off. */
export function useUnsubscribeLink(query: string) {
  return useQuery({ queryKey: ['unsubscribe', query], queryFn: ({ signal }) => api.get<{ remindersOff: boolean }>(`/unsubscribe${query}`, signal), retry: false });
}

export function useUnsubscribe(query: string) {
  return useMutation({ mutationFn: () => api.post<{ remindersOff: boolean }>(`/unsubscribe${query}`, {}) });
}
