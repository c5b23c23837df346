import { useNavigate, useParams } from 'react-router-dom';
import { useWorkspace } from '@/features/auth/use-workspace';
import { Loading } from '@/components/spinner';
import { ErrorState } from '@/components/error-state';
import { useRoute } from '@/features/routes/api/get-route';
import { RevisionActions } from '@/features/review';
import { Button } from '@/components/button';
import { paths } from '@/paths';

// The canvas, React Flow and the engine worker load only when a route is opened: this page is
// loaded lazily by the router, whose loader starts the editor's code beside the session and the
// route. Imported here directly, not through lazy() and a Suspense boundary: a boundary that
// shows its fallback holds the editor back for at least 300 ms after it (React's throttle on
// revealing suspended content), even when the code has long arrived.
import RouteEditor from '@/features/editor/components/route-editor';

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
