import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { REVISION_STATUS_LABELS } from '@shared/schemas/revisions';
import { Button } from '@/components/button';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { PageHeader } from '@/components/page-header';
import { Loading } from '@/components/spinner';
import { Table, Td, Th } from '@/components/table';
import { canInWorkspace } from '@/features/auth/abilities';
import { useSession } from '@/features/auth/api/get-session';
import { useWorkspace } from '@/features/auth/use-workspace';
import { StatusBadge, useRevisions } from '@/features/review';
import { useRoute } from '@/features/routes/api/get-route';
import { formatDateTime } from '@/lib/format';
import { paths } from '@/paths';

const num = (v: number | null | undefined, digits = 1) =>
  v === null || v === undefined ? '—' : v.toFixed(digits);

/** A route's saved revisions, newest first; pick two to compare. */
export function Component() {
  const workspace = useWorkspace();
  const { routeId = '' } = useParams();
  const route = useRoute(workspace.id, routeId);
  const revisions = useRevisions(workspace.id, routeId);
  const [picked, setPicked] = useState<number[]>([]);
  const { data: session } = useSession();
  const canExport = session ? canInWorkspace(session, workspace.id, 'stepList.export') : false;
  const navigate = useNavigate();
  const toggle = (n: number) =>
    setPicked((p) => (p.includes(n) ? p.filter((x) => x !== n) : [...p, n].slice(-2)));
  const [a, b] = [...picked].sort((x, y) => x - y);
  return (
    <div className="p-6">
      <PageHeader
        title={route.data ? `History of ${route.data.name}` : 'History'}
        description="Every saved revision of the route, with its review status. A revision is a fixed record: open it to read, comment or sign."
        actions={
          <div className="flex gap-2">
            <Link
              className="text-small text-accent hover:underline"
              to={paths.workspace.route.to(workspace.id, routeId)}
            >
              Back to the draft
            </Link>
            <Button
              size="sm"
              disabled={picked.length !== 2}
              onClick={() =>
                navigate(`${paths.workspace.revision.to(workspace.id, routeId, b)}?compare=${a}`)
              }
            >
              Compare the two chosen
            </Button>
          </div>
        }
      />
      {revisions.isPending ? (
        <Loading label="Loading the revisions…" />
      ) : revisions.isError ? (
        <ErrorState
          title="The revisions could not be loaded"
          error={revisions.error}
          onRetry={() => revisions.refetch()}
        />
      ) : revisions.data.items.length === 0 ? (
        <EmptyState title="No revision saved yet">
          Open the draft and choose “Save revision” to keep the route as it is now, with its
          results; then send it for review.
        </EmptyState>
      ) : (
        <Table caption="Revisions">
          <thead>
            <tr>
              <Th className="w-16">Compare</Th>
              <Th>Revision</Th>
              <Th>Status</Th>
              <Th>Message</Th>
              <Th>Author</Th>
              <Th>Saved</Th>
              <Th className="text-right">Yield %</Th>
              <Th className="text-right">Purity wt%</Th>
              <Th className="text-right">PMI</Th>
              {canExport ? (
                <Th>
                  <span className="sr-only">Plant</span>
                </Th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {revisions.data.items.map((r) => (
              <tr key={r.number}>
                <Td>
                  <input
                    type="checkbox"
                    aria-label={`Compare revision ${r.number}`}
                    checked={picked.includes(r.number)}
                    onChange={() => toggle(r.number)}
                  />
                </Td>
                <Td>
                  <Link
                    className="text-accent hover:underline"
                    to={paths.workspace.revision.to(workspace.id, routeId, r.number)}
                  >
                    Revision {r.number}
                  </Link>
                </Td>
                <Td>
                  <StatusBadge status={r.status} />
                  <span className="sr-only">{REVISION_STATUS_LABELS[r.status]}</span>
                </Td>
                <Td className="max-w-80 truncate">{r.message}</Td>
                <Td>{r.author.name}</Td>
                <Td>{formatDateTime(r.createdAt)}</Td>
                <Td className="text-right tabular-nums">{num(r.totals?.yieldPct)}</Td>
                <Td className="text-right tabular-nums">{num(r.totals?.purityWtPct, 2)}</Td>
                <Td className="text-right tabular-nums">{num(r.totals?.pmi)}</Td>
                {canExport ? (
                  <Td>
                    <Link
                      className="text-accent hover:underline"
                      aria-label={`Step list of revision ${r.number}`}
                      to={paths.workspace.stepList.to(workspace.id, routeId, r.number)}
                    >
                      Step list
                    </Link>
                  </Td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}
