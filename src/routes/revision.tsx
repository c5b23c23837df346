import { useMemo } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { canInWorkspace } from '@/features/auth/abilities';
import { useSession } from '@/features/auth/api/get-session';
import { useWorkspace } from '@/features/auth/use-workspace';
import {
  CompareView,
  ReviewPanel,
  StatusBadge,
  useComments,
  useCompare,
  useRevision,
} from '@/features/review';
import { useRoute } from '@/features/routes/api/get-route';
import { paths } from '@/paths';

// Imported directly (this page is itself loaded lazily): a Suspense boundary would hold the
// editor back for React's 300 ms reveal throttle after showing its fallback.
import RouteEditor from '@/features/editor/components/route-editor';

/** A saved revision, read only in the editor, with its review beside it (and its changes when compared). */
export function Component() {
  const workspace = useWorkspace();
  const { routeId = '', number = '' } = useParams();
  const [search] = useSearchParams();
  const revisionNumber = Number(number);
  const compareWith = search.get('compare') ? Number(search.get('compare')) : null;
  const route = useRoute(workspace.id, routeId);
  const revision = useRevision(workspace.id, routeId, revisionNumber);
  const comments = useComments(workspace.id, routeId, revisionNumber);
  const compare = useCompare(workspace.id, routeId, compareWith, revisionNumber);
  const { data: session } = useSession();
  const canExport = session ? canInWorkspace(session, workspace.id, 'stepList.export') : false;

  const marks = useMemo(() => {
    const out: Record<string, { comments?: number; change?: 'added' | 'changed' }> = {};
    for (const c of comments.data?.items ?? [])
      if (c.stepId && c.parentId === null && !c.resolved)
        out[c.stepId] = { ...out[c.stepId], comments: (out[c.stepId]?.comments ?? 0) + 1 };
    for (const s of compare.data?.stepsAdded ?? []) out[s.id] = { ...out[s.id], change: 'added' };
    for (const s of compare.data?.stepsChanged ?? [])
      out[s.stepId] = { ...out[s.stepId], change: 'changed' };
    return out;
  }, [comments.data, compare.data]);

  const componentNames = useMemo(() => {
    const names: Record<string, string> = {};
    for (const c of (revision.data?.document.components ?? []) as Array<Record<string, unknown>>) {
      const id = (c.id ?? c.solventId ?? c.soluteId) as string | undefined;
      if (id) names[id] = (c.name as string | undefined) ?? id;
    }
    return names;
  }, [revision.data]);

  const failed = route.isError ? route.error : revision.isError ? revision.error : null;
  return (
    <div className="fixed inset-y-0 right-0 left-14 z-10 flex flex-col bg-paper">
      {failed ? (
        <div className="p-6">
          <ErrorState
            title="The revision could not be opened"
            error={failed}
            onRetry={() => revision.refetch()}
          />
          <Link
            className="text-small text-accent hover:underline"
            to={paths.workspace.revisions.to(workspace.id, routeId)}
          >
            Back to the history
          </Link>
        </div>
      ) : !route.data || !revision.data ? (
        <Loading label="Opening the revision…" className="justify-center" />
      ) : (
        <RouteEditor
          key={`${route.data.id}-${revision.data.number}`}
          workspaceId={workspace.id}
          route={route.data}
          view={{
            document: revision.data.document,
            marks,
            heading: (
              <span className="flex items-center gap-2 whitespace-nowrap text-small">
                <span className="font-medium">Revision {revision.data.number}</span>
                <StatusBadge status={revision.data.status} />
                <span className="text-ink-muted">read only</span>
                <Link
                  className="text-accent hover:underline"
                  to={paths.workspace.revisions.to(workspace.id, routeId)}
                >
                  History
                </Link>
                <Link
                  className="text-accent hover:underline"
                  to={paths.workspace.route.to(workspace.id, routeId)}
                >
                  Draft
                </Link>
                {canExport ? (
                  <Link
                    className="text-accent hover:underline"
                    to={paths.workspace.stepList.to(workspace.id, routeId, revision.data.number)}
                  >
                    Step list
                  </Link>
                ) : null}
              </span>
            ),
            tabs: [
              {
                id: 'review',
                label: 'Review',
                content: (
                  <ReviewPanel
                    workspaceId={workspace.id}
                    routeId={routeId}
                    revision={revision.data}
                  />
                ),
              },
              ...(compareWith !== null
                ? [
                    {
                      id: 'changes',
                      label: `Changes from ${compareWith}`,
                      content: compare.data ? (
                        <CompareView compare={compare.data} componentNames={componentNames} />
                      ) : compare.isError ? (
                        <ErrorState
                          title="The comparison could not be made"
                          error={compare.error}
                        />
                      ) : (
                        <Loading label="Comparing…" />
                      ),
                    },
                  ]
                : []),
            ],
            initialTab: compareWith !== null ? 'changes' : 'review',
          }}
        />
      )}
    </div>
  );
}
