import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { CrashPage } from './error-boundary';

/** Shown when a route module fails to load or a page throws while rendering. */
export function RouteErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error))
    return <CrashPage message={`${error.status} ${error.statusText}`} />;
  // A stale tab after a deploy cannot fetch the old chunk: a reload fixes it.
  const message = error instanceof Error ? error.message : undefined;
  return <CrashPage message={message} />;
}
