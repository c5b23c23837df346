import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useSession } from '@/features/auth/api/get-session';
import { canInWorkspace } from '@/features/auth/abilities';
import { PageHeader } from '@/components/page-header';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { Button } from '@/components/button';
import { Loading } from '@/components/spinner';
import { RoleBadges } from '@/components/role-picker';
import { paths } from '@/paths';
import { useRoutes } from '@/features/routes/api/get-routes';
import { CreateRouteForm } from '@/features/routes/components/create-route-form';
import { RoutesTable } from '@/features/routes/components/routes-table';
import { AttentionList } from '@/features/review';

/** The workspace home: its routes, grouped by project, and a way to start a new one. */
export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  const canInvite = session ? canInWorkspace(session, workspace.id, 'member.invite') : false;
  // Who may create routes is the server's rule (chemists and admins today); it decides again.
  const canWrite = session ? canInWorkspace(session, workspace.id, 'route.create') : false;
  const [archived, setArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const routes = useRoutes(workspace.id, archived);

  return (
    <>
      <PageHeader
        eyebrow={workspace.name}
        title="Routes"
        description={
          <span className="inline-flex items-center gap-2">
            <span>Your roles here:</span> <RoleBadges roles={workspace.roles} />
          </span>
        }
        actions={
          <>
            <Button
              variant="secondary"
              aria-pressed={archived}
              onClick={() => setArchived((a) => !a)}
            >
              {archived ? 'Show current routes' : 'Archived'}
            </Button>
            {canWrite && !creating ? (
              <Button onClick={() => setCreating(true)}>New route</Button>
            ) : null}
          </>
        }
      />
      <AttentionList workspaceId={workspace.id} />
      {canWrite && creating ? (
        <div className="mb-4">
          <CreateRouteForm workspaceId={workspace.id} onCancel={() => setCreating(false)} />
        </div>
      ) : null}
      {routes.isPending ? (
        <Loading label="Loading routes…" />
      ) : routes.isError ? (
        <ErrorState
          title="The routes could not be loaded"
          error={routes.error}
          onRetry={() => routes.refetch()}
        />
      ) : routes.data.length === 0 ? (
        archived ? (
          <EmptyState title="No archived routes">
            Routes you archive are kept here and can be restored at any time.
          </EmptyState>
        ) : creating ? null : (
          <EmptyState
            title="No routes yet — create your first isolation route"
            glyph={<RouteSketch />}
            action={
              canWrite ? (
                <Button onClick={() => setCreating(true)}>Create a route</Button>
              ) : undefined
            }
          >
            <p>
              A route is the work-up and isolation drawn as steps: quench, washes and extractions,
              distillation, crystallisation, filtration and drying. Phasewright follows the product
              and every impurity through each step.
            </p>
            <p className="mt-2 text-small">
              It helps to{' '}
              <Link
                to={paths.workspace.compounds.to(workspace.id)}
                className="font-medium text-accent hover:underline"
              >
                enter your compounds
              </Link>{' '}
              first and check the{' '}
              <Link
                to={paths.workspace.solvents.to(workspace.id)}
                className="font-medium text-accent hover:underline"
              >
                solvent library
              </Link>
              {canInvite ? (
                <>
                  , or{' '}
                  <Link
                    to={paths.workspace.members.to(workspace.id)}
                    className="font-medium text-accent hover:underline"
                  >
                    invite your colleagues
                  </Link>
                </>
              ) : null}
              .
            </p>
          </EmptyState>
        )
      ) : (
        <RoutesTable workspaceId={workspace.id} routes={routes.data} canWrite={canWrite} />
      )}
    </>
  );
}

/** Three steps joined by streams, drawn in the phase colours. */
function RouteSketch() {
  return (
    <svg width="120" height="40" viewBox="0 0 120 40" fill="none" strokeWidth="1.5">
      <rect
        x="2"
        y="10"
        width="26"
        height="20"
        rx="4"
        className="stroke-ink-faint"
        strokeDasharray="3 2.5"
      />
      <rect
        x="47"
        y="10"
        width="26"
        height="20"
        rx="4"
        className="stroke-ink-faint"
        strokeDasharray="3 2.5"
      />
      <rect
        x="92"
        y="10"
        width="26"
        height="20"
        rx="4"
        className="stroke-ink-faint"
        strokeDasharray="3 2.5"
      />
      <path d="M28 16h19" className="stroke-phase-organic" />
      <path d="M28 24h19" className="stroke-phase-aqueous" />
      <path d="M73 20h19" className="stroke-phase-solid" />
    </svg>
  );
}
