import { useState, type ComponentType } from 'react';
import { createBrowserRouter, Outlet, RouterProvider, type RouteObject } from 'react-router-dom';
import { RouteError } from '@/components/errors/route-error';
import { PageSpinner } from '@/components/ui/page-spinner';
import { paths } from '@/config/paths';
import { showPaths } from '@/features/shows/lib/paths';
import { officePaths } from '@/features/offices/lib/paths';
import { RequireAuth } from '@/lib/auth';
import { AppLayout } from './app-layout';

type RouteModule = { default: ComponentType };

const lazyRoute = (load: () => Promise<RouteModule>) => async () => ({ Component: (await load()).default });

function Protected() {
  return (
    <RequireAuth>
      <Outlet />
    </RequireAuth>
  );
}

// Paths in config/paths.ts are absolute; nested routes here use the same strings.
export const routes: RouteObject[] = [
  {
    errorElement: <RouteError />,
    hydrateFallbackElement: <PageSpinner />,
    children: [
      { path: paths.signIn.path, lazy: lazyRoute(() => import('./routes/sign-in')) },
      { path: paths.forgotPassword.path, lazy: lazyRoute(() => import('./routes/forgot-password')) },
      { path: paths.resetPassword.path, lazy: lazyRoute(() => import('./routes/reset-password')) },
      { path: paths.invitation.path, lazy: lazyRoute(() => import('./routes/invitation')) },
      { path: paths.unsubscribe.path, lazy: lazyRoute(() => import('./routes/unsubscribe')) },
      // Visitors at a show vote with the code on a ballot card, without an account.
      { path: showPaths.visitorVote.path, lazy: lazyRoute(() => import('./routes/vote')) },
      { path: showPaths.visitorBallot.path, lazy: lazyRoute(() => import('./routes/vote-ballot')) },
      {
        element: <AppLayout />,
        children: [
          {
            element: <Protected />,
            children: [
              { path: paths.home.path, lazy: lazyRoute(() => import('./routes/dashboard')) },
              { path: paths.newGuild.path, lazy: lazyRoute(() => import('./routes/guild-new')) },
              { path: paths.members.path, lazy: lazyRoute(() => import('./routes/members')) },
              { path: paths.rosterImport.path, lazy: lazyRoute(() => import('./routes/roster-import')) },
              { path: officePaths.officers.path, lazy: lazyRoute(() => import('./routes/officers')) },
              { path: paths.bees.path, lazy: lazyRoute(() => import('./routes/bees')) },
              { path: paths.bee.path, lazy: lazyRoute(() => import('./routes/bee')) },
              { path: paths.round.path, lazy: lazyRoute(() => import('./routes/round')) },
              { path: paths.dues.path, lazy: lazyRoute(() => import('./routes/dues')) },
              { path: paths.duesReturn.path, lazy: lazyRoute(() => import('./routes/dues-return')) },
              {
                path: paths.treasurer.path,
                lazy: lazyRoute(() => import('./routes/treasurer')),
                children: [
                  { index: true, lazy: lazyRoute(() => import('./routes/treasurer-ledger')) },
                  { path: `${paths.treasurer.path}/ledger`, lazy: lazyRoute(() => import('./routes/treasurer-ledger')) },
                  { path: `${paths.treasurer.path}/roster`, lazy: lazyRoute(() => import('./routes/treasurer-roster')) },
                  { path: `${paths.treasurer.path}/record`, lazy: lazyRoute(() => import('./routes/treasurer-record')) },
                  { path: `${paths.treasurer.path}/report`, lazy: lazyRoute(() => import('./routes/treasurer-report')) },
                  { path: `${paths.treasurer.path}/settings`, lazy: lazyRoute(() => import('./routes/treasurer-settings')) },
                  { path: `${paths.treasurer.path}/audit`, lazy: lazyRoute(() => import('./routes/treasurer-audit')) },
                ],
              },
              { path: showPaths.list.path, lazy: lazyRoute(() => import('./routes/show-list')) },
              { path: showPaths.create.path, lazy: lazyRoute(() => import('./routes/show-new')) },
              { path: showPaths.show.path, lazy: lazyRoute(() => import('./routes/show-home')) },
              { path: showPaths.settings.path, lazy: lazyRoute(() => import('./routes/show-settings')) },
              { path: showPaths.enter.path, lazy: lazyRoute(() => import('./routes/show-entry')) },
              { path: showPaths.editEntry.path, lazy: lazyRoute(() => import('./routes/show-entry')) },
              { path: showPaths.vote.path, lazy: lazyRoute(() => import('./routes/show-vote')) },
              { path: showPaths.results.path, lazy: lazyRoute(() => import('./routes/show-results')) },
              { path: showPaths.entriesReview.path, lazy: lazyRoute(() => import('./routes/show-entries-review')) },
              { path: showPaths.votingDesk.path, lazy: lazyRoute(() => import('./routes/show-voting')) },
              { path: paths.layoutPlanner.path, lazy: lazyRoute(() => import('./routes/layout-planner')) },
              { path: paths.profile.path, lazy: lazyRoute(() => import('./routes/profile')) },
            ],
          },
          { path: paths.devInbox.path, lazy: lazyRoute(() => import('./routes/dev-inbox')) },
          { path: '*', lazy: lazyRoute(() => import('./routes/not-found')) },
        ],
      },
    ],
  },
];

export function AppRouter() {
  const [router] = useState(() => createBrowserRouter(routes));
  return <RouterProvider router={router} />;
}
