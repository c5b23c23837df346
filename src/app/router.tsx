import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter } from 'react-router-dom';
import { paths } from '@/paths';
import { Loading } from '@/components/spinner';
import { RouteErrorPage } from './route-error';
import { prefetchRouteEditor, prefetchSession } from './prefetch';

/**
 * Every page is its own lazily loaded module, so the first page ships only
 * the router, the query client and the page itself. Loaders return at once:
 * they only start the session and the page's data, which then load beside
 * the page's code instead of after it.
 */
export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    {
      errorElement: <RouteErrorPage />,
      hydrateFallbackElement: <Loading className="justify-center" />,
      children: [
        {
          lazy: () => import('./layouts/public-layout'),
          children: [
            { path: paths.signIn.pattern, lazy: () => import('@/routes/sign-in') },
            { path: paths.requestReset.pattern, lazy: () => import('@/routes/request-reset') },
            { path: paths.completeReset.pattern, lazy: () => import('@/routes/complete-reset') },
            {
              path: paths.acceptInvitation.pattern,
              lazy: () => import('@/routes/accept-invitation'),
            },
          ],
        },
        {
          lazy: () => import('./layouts/app-shell'),
          loader: () => {
            prefetchSession(queryClient);
            return null;
          },
          children: [
            { index: true, lazy: () => import('@/routes/start') },
            { path: paths.account.pattern, lazy: () => import('@/routes/account') },
            { path: paths.outbox.pattern, lazy: () => import('@/routes/outbox') },
            {
              path: paths.workspace.home.pattern,
              lazy: () => import('./layouts/workspace-layout'),
              children: [
                { index: true, lazy: () => import('@/routes/routes-list') },
                {
                  path: paths.workspace.route.pattern,
                  lazy: () => import('@/routes/route-editor'),
                  loader: ({ params }) => {
                    prefetchRouteEditor(queryClient, params.workspaceId!, params.routeId!);
                    return null;
                  },
                },
                {
                  path: paths.workspace.optimise.pattern,
                  lazy: () => import('@/routes/optimise'),
                },
                {
                  path: paths.workspace.revisions.pattern,
                  lazy: () => import('@/routes/revisions'),
                },
                {
                  path: paths.workspace.revision.pattern,
                  lazy: () => import('@/routes/revision'),
                },
                {
                  path: paths.workspace.stepList.pattern,
                  lazy: () => import('@/routes/step-list'),
                },
                { path: paths.workspace.audit.pattern, lazy: () => import('@/routes/audit') },
                { path: paths.workspace.members.pattern, lazy: () => import('@/routes/members') },
                {
                  path: paths.workspace.compounds.pattern,
                  lazy: () => import('@/routes/compounds'),
                },
                { path: paths.workspace.solvents.pattern, lazy: () => import('@/routes/solvents') },
                {
                  path: paths.workspace.equipment.pattern,
                  lazy: () => import('@/routes/equipment'),
                },
              ],
            },
            { path: '*', lazy: () => import('@/routes/not-found') },
          ],
        },
      ],
    },
  ]);
}
