import { useEffect, useState } from 'react';
import type { RouteSort } from '@shared/schemas/routes';
import { Link } from 'react-router-dom';
import { useWorkspace } from '@/features/auth/use-workspace';
import { useSession } from '@/features/auth/api/get-session';
import { canInWorkspace } from '@/features/auth/abilities';
import { PageHeader } from '@/components/page-header';
import { EmptyState } from '@/components/empty-state';
import { ErrorState } from '@/components/error-state';
import { Button } from '@/components/button';
import { Loading } from '@/components/spinner';
import { inputClass } from '@/components/text-field';
import { RoleBadges } from '@/components/role-picker';
import { paths } from '@/paths';
import { useRoutes } from '@/features/routes/api/get-routes';
import { CreateRouteForm } from '@/features/routes/components/create-route-form';
import { RoutesTable } from '@/features/routes/components/routes-table';
import { AttentionList } from '@/features/review';

/** How long typing rests before the search goes to the server. */
const SEARCH_PAUSE_MS = 250;

/**
 * The workspace home: its routes, a page at a time from the server (sorted by
 * last change or name, searched by route and project name), and a way to
 * start a new one.
 */
export function Component() {
  const workspace = useWorkspace();
  const { data: session } = useSession();
  const canInvite = session ? canInWorkspace(session, workspace.id, 'member.invite') : false;
  // Who may create routes is the server's rule (chemists and admins today); it decides again.
  const canWrite = session ? canInWorkspace(session, workspace.id, 'route.create') : false;
  const [archived, setArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const [search, setSearch] = useState('');
  const [q, setQ] = useState('');
  const [sort, setSort] = useState<RouteSort>('changed');
  useEffect(() => {
    const timer = setTimeout(() => setQ(search.trim()), SEARCH_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [search]);
  const routes = useRoutes(workspace.id, { archived, q, sort });
  const items = routes.data?.pages.flatMap((page) => page.items) ?? [];

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
      ) : items.length === 0 && !q && !search ? (
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
        <div className="space-y-3">
          <div className="flex items-end gap-3">
            <div className="w-72 space-y-1">
              <label htmlFor="route-search" className="block text-small font-medium text-ink">
                Search routes
              </label>
              <input
                id="route-search"
                type="search"
                value={search}
                onChange={(e) => setSearch(e.target.value)}
                placeholder="Route or project name"
                className={`${inputClass} border-rule-strong`}
              />
            </div>
            <p className="pb-2 text-small text-ink-muted" aria-live="polite">
              {routes.isFetching && !routes.isFetchingNextPage
                ? 'Searching…'
                : `${items.length} ${items.length === 1 ? 'route' : 'routes'} shown${routes.hasNextPage ? ', more below' : ''}`}
            </p>
          </div>
          <RoutesTable
            workspaceId={workspace.id}
            routes={items}
            canWrite={canWrite}
            sort={sort}
            onSortChange={setSort}
          />
          {items.length === 0 && !routes.isFetching ? (
            <p className="px-3 py-2 text-body text-ink-muted">
              No route matches “{q || search}”. Clear the search to see them all.
            </p>
          ) : null}
          {routes.hasNextPage ? (
            <Button
              variant="secondary"
              busy={routes.isFetchingNextPage}
              onClick={() => routes.fetchNextPage()}
            >
              Show more routes
            </Button>
          ) : null}
        </div>
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
