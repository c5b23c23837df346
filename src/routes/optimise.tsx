import { useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { routeDocumentSchema } from '@shared/schemas/route';
import { Optimiser } from '@/features/assistant';
import { useWorkspace } from '@/features/auth/use-workspace';
import { getRouteQueryOptions } from '@/features/routes/api/get-route';
import { ErrorState } from '@/components/error-state';
import { PageHeader } from '@/components/page-header';
import { Loading } from '@/components/spinner';
import { paths } from '@/paths';

/** The optimiser for one route: works on the route's saved draft; the route itself is never changed. */
export function Component() {
  const workspace = useWorkspace();
  const { routeId = '' } = useParams();
  // Read the draft as saved now (the editor may have saved edits since the route was cached).
  const route = useQuery({ ...getRouteQueryOptions(workspace.id, routeId), staleTime: 0 });
  const parsed = useMemo(
    () => (route.data ? routeDocumentSchema.safeParse(route.data.draft.document) : null),
    [route.data],
  );
  const back = paths.workspace.route.to(workspace.id, routeId);
  return (
    <div className="mx-auto max-w-page px-gutter py-6">
      {route.isPending ? (
        <Loading label="Opening the route…" />
      ) : route.isError ? (
        <ErrorState
          title="The route could not be opened"
          error={route.error}
          onRetry={() => route.refetch()}
        />
      ) : (
        <>
          <PageHeader
            eyebrow={
              <Link to={back} className="text-accent hover:underline">
                ← {route.data.name}
              </Link>
            }
            title={`Optimise ${route.data.name}`}
            description="Searches the parameters you free for the route that meets your constraints with the least material, solvent or time, using the same engine as the editor. It works on the saved draft and never changes this route: the answer opens as a new route."
          />
          {parsed && parsed.success ? (
            <Optimiser
              key={route.data.draft.version}
              workspaceId={workspace.id}
              routeName={route.data.name}
              projectName={route.data.project?.name}
              document={parsed.data}
            />
          ) : (
            <ErrorState title="This draft cannot be optimised yet">
              <p className="mt-0.5 text-body">
                The route is not complete: open it in the editor, fix the steps it marks, and come
                back.
              </p>
              <Link to={back} className="mt-2 inline-block text-small text-accent hover:underline">
                Open the editor
              </Link>
            </ErrorState>
          )}
        </>
      )}
    </div>
  );
}
