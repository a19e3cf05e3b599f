import { Suspense } from 'react';
import { Outlet, useNavigate } from 'react-router-dom';
import { AppShell } from '@/components/layouts/app-shell';
import { PageSpinner } from '@/components/ui/page-spinner';
import { paths } from '@/config/paths';
import { isDuesOfficer } from '@/config/roles';
import { useDashboard } from '@/features/dashboard/api/get-dashboard';
import { useMeta } from '@/features/meta/api/get-meta';
import { showPaths } from '@/features/shows/lib/paths';
import { useSignOut, useUser } from '@/lib/auth';

export function AppLayout() {
  const navigate = useNavigate();
  const { data: user } = useUser();
  const signedIn = Boolean(user);
  const meta = useMeta();
  const dashboard = useDashboard({ enabled: signedIn });
  const signOut = useSignOut();

  const guilds = dashboard.data?.guilds ?? [];
  const guildLinks = [
    ...guilds.flatMap((g) => [
      { to: paths.members.getHref(g.id), label: guilds.length === 1 ? 'Members' : `${g.name} members` },
      { to: paths.bees.getHref(g.id), label: guilds.length === 1 ? 'Bees' : `${g.name} bees` },
      { to: paths.dues.getHref(g.id), label: guilds.length === 1 ? 'Dues' : `${g.name} dues` },
      // One link per guild; the show chair's pages are reached from the show itself.
      { to: showPaths.list.getHref(g.id), label: guilds.length === 1 ? 'Shows' : `${g.name} shows` },
      ...(isDuesOfficer(g.roles)
        ? [{ to: paths.treasurer.getHref(g.id), label: guilds.length === 1 ? 'Treasurer' : `${g.name} treasurer` }]
        : []),
    ]),
    { to: paths.layoutPlanner.getHref(), label: 'Layout planner' },
  ];

  return (
    <AppShell
      signedIn={signedIn}
      guildLinks={guildLinks}
      showInbox={meta.data?.devInbox === true}
      signingOut={signOut.isPending}
      onSignOut={() => signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn.getHref()) })}
    >
      <Suspense fallback={<PageSpinner />}>
        <Outlet />
      </Suspense>
    </AppShell>
  );
}
