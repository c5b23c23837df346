import type { QueryClient } from '@tanstack/react-query';

/**
 * Starts what a page needs before its code arrives, so the session, the data
 * and the page's own module load side by side rather than one after another.
 * The query modules are imported on demand (they stay out of the first chunk);
 * nothing here waits, and a failure is left to the page, which asks again.
 */
export function prefetchSession(queryClient: QueryClient): void {
  void import('@/features/auth/api/get-session').then(({ getSessionQueryOptions }) =>
    queryClient.prefetchQuery(getSessionQueryOptions()),
  );
}

/**
 * The route editor: its code (the page and the editor itself, which the page loads lazily
 * only once the route has arrived), the session and the route, all at once.
 */
export function prefetchRouteEditor(
  queryClient: QueryClient,
  workspaceId: string,
  routeId: string,
): void {
  void import('@/routes/route-editor');
  void import('@/features/editor/components/route-editor');
  prefetchSession(queryClient);
  void import('@/features/routes/api/get-route').then(({ getRouteQueryOptions }) =>
    queryClient.prefetchQuery(getRouteQueryOptions(workspaceId, routeId)),
  );
}
