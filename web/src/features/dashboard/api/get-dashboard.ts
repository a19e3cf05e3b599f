import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { User } from '@/lib/auth';

export type DashboardGuild = {
  id: number | string;
  name: string;
  town: string;
  roles: string[];
  status: string;
  memberCount: number;
  bees?: { id: number; name: string; description: string | null }[];
};

export type OwedBlock = {
  guildId: number | string;
  beeId: number | string;
  beeName: string;
  month: string;
  title: string | null;
  queenName: string | null;
  dueDate: string | null;
  status: string;
  late: boolean;
};

export type Dashboard = { user: User; guilds: DashboardGuild[]; owed?: OwedBlock[] };

export const getDashboard = (signal?: AbortSignal) => api.get<Dashboard>('/dashboard', signal);

export const dashboardQueryOptions = () =>
  queryOptions({
    queryKey: ['dashboard'] as const,
    queryFn: ({ signal }) => getDashboard(signal),
  });

export function useDashboard(options: { enabled?: boolean } = {}) {
  return useQuery({ ...dashboardQueryOptions(), ...options });
}
