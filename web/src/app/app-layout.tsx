import { Suspense } from 'react';
import { Outlet, useNavigate } from 'react-router-dom';
import { AppShell } from '@/components/layouts/app-shell';
import { PageSpinner } from '@/components/ui/page-spinner';
import { paths } from '@/config/paths';
import { isDuesOfficer } from '@/config/roles';
import { useDashboard } from '@/features/dashboard/api/get-dashboard';
import { useMeta } from '@/features/meta/api/get-meta';
import { showPaths } from '@/features/shows/lib/paths';
import { officePaths } from '@/features/offices/lib/paths';
import { useSignOut, useUser } from '@/lib/auth';

export function AppLayout() {
  const navigate = useNavigate();
  const { data: user } = useUser();
  const signedIn = Boolean(user);
  const meta = useMeta();
  const dashboard = useDashboard({ enabled: signedIn });
  const signOut = useSignOut();

  const guilds = dashboard.data?.guilds ?? [];
  const pagesOf = (g: (typeof guilds)[number]) => [
    { to: paths.members.getHref(g.id), label: 'Members' },
    { to: officePaths.officers.getHref(g.id), label: 'Officers' },
    { to: paths.bees.getHref(g.id), label: 'Bees' },
    { to: paths.dues.getHref(g.id), label: 'Dues' },
    // The show chair's pages are reached from the show itself.
    { to: showPaths.list.getHref(g.id), label: 'Shows' },
    ...(isDuesOfficer(g.roles) ? [{ to: paths.treasurer.getHref(g.id), label: 'Treasurer' }] : []),
  ];
  // One guild: its pages side by side. Several: a menu per guild, so the bar stays on one line.
  const single = guilds.length === 1;
  const guildLinks = [...(single ? pagesOf(guilds[0]) : []), { to: paths.layoutPlanner.getHref(), label: 'Layout planner' }];
  const guildMenus = single ? [] : guilds.map((g) => ({ label: g.name, links: pagesOf(g) }));

  return (
    <AppShell
      signedIn={signedIn}
      guildLinks={guildLinks}
      guildMenus={guildMenus}
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
