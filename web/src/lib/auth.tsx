import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { paths } from '@/config/paths';
import { api } from './api-client';
import { PageSpinner } from '@/components/ui/page-spinner';

export type User = {
  id: number | string;
  email: string;
  name: string;
};

type MeResponse = { user: User | null };

export const getMe = (signal?: AbortSignal) => api.get<MeResponse>('/auth/me', signal);

export const userQueryOptions = () =>
  queryOptions({
    queryKey: ['auth', 'me'] as const,
    queryFn: ({ signal }) => getMe(signal).then((r) => r.user ?? null),
    staleTime: 5 * 60_000,
  });

export function useUser() {
  return useQuery(userQueryOptions());
}

export type SignInInput = { email: string; password: string; remember?: boolean };

export const signIn = (input: SignInInput) => api.post<{ user: User }>('/auth/sign-in', input);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => {
      // Anything cached belonged to whoever was here before.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'auth' });
      queryClient.setQueryData(userQueryOptions().queryKey, user);
    },
  });
}

export const signOut = () => api.post<void>('/auth/sign-out');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'auth' });
      queryClient.setQueryData(userQueryOptions().queryKey, null);
    },
  });
}

/** Call after anything that signs someone in without the sign-in form (e.g. accepting an invitation). */
export function useSetSignedInUser() {
  const queryClient = useQueryClient();
  return (user: User | null | undefined) => {
    queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'auth' });
    if (user) queryClient.setQueryData(userQueryOptions().queryKey, user);
    else void queryClient.invalidateQueries({ queryKey: userQueryOptions().queryKey });
  };
}

export function RequireAuth({ children }: { children: ReactNode }) {
  const { data: user, isPending, isError, error } = useUser();
  const location = useLocation();

  if (isPending) return <PageSpinner label="Checking who is signed in" />;
  if (isError) throw error;
  if (!user) {
    const here = `${location.pathname}${location.search}${location.hash}`;
    return <Navigate to={paths.signIn.getHref(here === '/' ? null : here)} replace />;
  }
  return <>{children}</>;
}
