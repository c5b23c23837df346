import { lazy, Suspense } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { useWorkspace } from '@/features/auth/use-workspace';
import { Loading } from '@/components/spinner';
import { ErrorState } from '@/components/error-state';
import { useRoute } from '@/features/routes/api/get-route';
import { RevisionActions } from '@/features/review';
import { Button } from '@/components/button';
import { paths } from '@/paths';

// The canvas, React Flow and the engine worker load only when a route is opened.
const RouteEditor = lazy(() => import('@/features/editor/components/route-editor'));

/** One route's draft, open in the editor (full width beside the navigation rail, which keeps only its marks here). */
export function Component() {
  const workspace = useWorkspace();
  const { routeId = '' } = useParams();
  const route = useRoute(workspace.id, routeId);
  return (
    <div className="fixed inset-y-0 right-0 left-14 z-10 flex flex-col bg-paper">
      {route.isPending ? (
        <Loading label="Opening the route…" className="justify-center" />
      ) : route.isError ? (
        <div className="p-6">
          <ErrorState
            title="The route could not be opened"
            error={route.error}
            onRetry={() => route.refetch()}
          />
        </div>
      ) : (
        <Suspense fallback={<Loading label="Loading the editor…" className="justify-center" />}>
          <RouteEditor
            key={route.data.id}
            workspaceId={workspace.id}
            route={route.data}
            actions={({ canEdit, saveNow }) => (
              <>
                <OptimiseButton workspaceId={workspace.id} routeId={route.data.id} save={saveNow} />
                <RevisionActions
                  workspaceId={workspace.id}
                  routeId={route.data.id}
                  canSave={canEdit}
                  saveDraft={saveNow}
                />
              </>
            )}
          />
        </Suspense>
      )}
    </div>
  );
}

/** Opens the optimiser on the draft as saved: pending edits are saved first. */
function OptimiseButton({
  workspaceId,
  routeId,
  save,
}: {
  workspaceId: string;
  routeId: string;
  save: () => Promise<number | null>;
}) {
  const navigate = useNavigate();
  return (
    <Button
      size="sm"
      variant="secondary"
      onClick={async () => {
        await save().catch(() => null);
        navigate(paths.workspace.optimise.to(workspaceId, routeId));
      }}
    >
      Optimise
    </Button>
  );
}
