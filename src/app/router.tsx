import { createBrowserRouter } from 'react-router-dom';
import { paths } from '@/paths';
import { Loading } from '@/components/spinner';
import { RouteErrorPage } from './route-error';

/**
 * Every page is its own lazily loaded module, so the first page ships only
 * the router, the query client and the page itself.
 */
export function createAppRouter() {
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
