import { useMemo, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { prefetchRouteEditor } from '@/app/prefetch';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import type { RouteSort } from '@shared/schemas/routes';
import { Button } from '@/components/button';
import { SortHeader } from '@/components/sortable-table';
import { ENGINE_VERSION } from '@shared/engine/version';
import { formatDateTime } from '@/lib/format';
import { paths } from '@/paths';
import type { RouteSummary } from '../api/schemas';
import { useUpdateRoute } from '../api/update-route';
import { useDuplicateRoute } from '../api/duplicate-route';
import { RenameRouteForm } from './rename-route-form';
import { toast } from '@/stores/toasts';

const col = createColumnHelper<RouteSummary>();
const pct = (v: number | null | undefined) =>
  v === null || v === undefined ? '—' : `${v.toFixed(1)} %`;
const num = (v: number | null | undefined) => (v === null || v === undefined ? '—' : v.toFixed(0));

/**
 * Whether a row's figures were computed by an earlier version of the calculations than today's
 * (they are stored when the route is saved, so a route not saved since an upgrade keeps them).
 */
export function figuresFromEarlierEngine(route: RouteSummary): boolean {
  return route.totals !== null && route.totals.engineVersion !== ENGINE_VERSION;
}

/** A figure cell: muted, with the reason as its tooltip, when an earlier engine computed it. */
function Figure({ text, route }: { text: string; route: RouteSummary }) {
  if (!figuresFromEarlierEngine(route)) return <span className="tabular-nums">{text}</span>;
  const version = route.totals?.engineVersion ?? 'unknown';
  return (
    <span
      className="tabular-nums text-ink-muted"
      title={`From an earlier version of the calculations (${version}). Open the route for today's figures; saving it updates this list.`}
    >
      {text}
      <span aria-hidden="true">*</span>
      <span className="sr-only"> (from an earlier version of the calculations)</span>
    </span>
  );
}

// The server sorts the list (by last change or by name) and pages it; the table shows the
// pages loaded so far in that order. Column id ↔ the server's sort.
const SORT_OF_COLUMN: Record<string, RouteSort> = { name: 'name', updatedAt: 'changed' };
const SORTING_OF: Record<RouteSort, SortingState> = {
  name: [{ id: 'name', desc: false }],
  changed: [{ id: 'updatedAt', desc: true }],
};

/**
 * The workspace's routes, as the server pages them: sorted by last change or by
 * name, searched by route and project name, with the next page on request.
 */
export function RoutesTable({
  workspaceId,
  routes,
  canWrite,
  sort,
  onSortChange,
}: {
  workspaceId: string;
  routes: RouteSummary[];
  canWrite: boolean;
  sort: RouteSort;
  onSortChange: (sort: RouteSort) => void;
}) {
  const [renaming, setRenaming] = useState<{ id: string; name: string; version: number } | null>(
    null,
  );
  const queryClient = useQueryClient();
  const update = useUpdateRoute(workspaceId);
  const duplicate = useDuplicateRoute(workspaceId);

  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Route',
        enableSorting: true,
        cell: (c) => (
          <Link
            to={paths.workspace.route.to(workspaceId, c.row.original.id)}
            className="font-medium text-accent hover:underline"
            // Pointing at or tabbing to a route starts its code, the session and the route.
            onMouseEnter={() => prefetchRouteEditor(queryClient, workspaceId, c.row.original.id)}
            onFocus={() => prefetchRouteEditor(queryClient, workspaceId, c.row.original.id)}
          >
            {c.getValue()}
          </Link>
        ),
      }),
      // On one line at 1280 × 800: a long project or owner name ends in an ellipsis, in full as the tooltip.
      col.accessor((r) => r.project?.name ?? '—', {
        id: 'project',
        header: 'Project',
        cell: (c) => <OneLine text={c.getValue()} />,
      }),
      col.accessor((r) => r.owner.name, {
        id: 'owner',
        header: 'Owner',
        cell: (c) => <OneLine text={c.getValue()} />,
      }),
      col.accessor('status', {
        header: 'Status',
        cell: (c) => (c.getValue() === 'archived' ? 'Archived' : 'Draft'),
      }),
      col.accessor('stepCount', {
        header: 'Steps',
        cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
      }),
      col.accessor((r) => r.totals?.yieldPct, {
        id: 'yield',
        header: 'Yield',
        cell: (c) => <Figure text={pct(c.getValue())} route={c.row.original} />,
      }),
      col.accessor((r) => r.totals?.purityPct, {
        id: 'purity',
        header: 'Purity',
        cell: (c) => <Figure text={pct(c.getValue())} route={c.row.original} />,
      }),
      col.accessor((r) => r.totals?.pmi, {
        id: 'pmi',
        header: 'PMI',
        cell: (c) => <Figure text={num(c.getValue())} route={c.row.original} />,
      }),
      col.accessor('updatedAt', {
        header: 'Last change',
        enableSorting: true,
        cell: (c) => <span className="tabular-nums">{formatDateTime(c.getValue())}</span>,
      }),
      ...(!canWrite
        ? []
        : [
            col.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: (c) => {
                const r = c.row.original;
                return (
                  <div className="flex flex-wrap justify-end gap-1">
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Rename ${r.name}`}
                      onClick={() => setRenaming({ id: r.id, name: r.name, version: r.version })}
                    >
                      Rename
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Duplicate ${r.name}`}
                      onClick={() =>
                        duplicate.mutate(
                          { routeId: r.id },
                          {
                            onSuccess: (d) => toast.success(`Duplicated as “${d.name}”.`),
                            onError: (e) => toast.error(e.message),
                          },
                        )
                      }
                    >
                      Duplicate
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`${r.status === 'archived' ? 'Restore' : 'Archive'} ${r.name}`}
                      onClick={() =>
                        update.mutate(
                          {
                            routeId: r.id,
                            input: { archived: r.status !== 'archived', baseVersion: r.version },
                          },
                          {
                            onSuccess: () =>
                              toast.success(
                                r.status === 'archived'
                                  ? `${r.name} restored.`
                                  : `${r.name} archived; find it under “Archived”.`,
                              ),
                            onError: (e) => toast.error(e.message),
                          },
                        )
                      }
                    >
                      {r.status === 'archived' ? 'Restore' : 'Archive'}
                    </Button>
                  </div>
                );
              },
            }),
          ]),
    ],
    [workspaceId, duplicate, update, canWrite, queryClient],
  );

  const sorting = SORTING_OF[sort];
  const table = useReactTable({
    data: routes,
    columns,
    defaultColumn: { enableSorting: false },
    manualSorting: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    state: { sorting },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const chosen = next[0] && SORT_OF_COLUMN[next[0].id];
      if (chosen && chosen !== sort) onSortChange(chosen);
    },
    getCoreRowModel: getCoreRowModel(),
  });
  const rows = table.getRowModel().rows;

  return (
    <div className="space-y-3">
      {renaming ? (
        <RenameRouteForm
          key={renaming.id}
          workspaceId={workspaceId}
          route={renaming}
          onDone={() => setRenaming(null)}
        />
      ) : null}
      <div className="overflow-x-auto rounded-card border border-rule bg-paper-raised">
        <table className="w-full border-collapse text-left text-body">
          <caption className="sr-only">Routes of this workspace</caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) =>
                  h.column.getCanSort() && typeof h.column.columnDef.header === 'string' ? (
                    <SortHeader key={h.id} column={h.column} label={h.column.columnDef.header} />
                  ) : (
                    <th
                      key={h.id}
                      scope="col"
                      className="border-b border-rule bg-paper-sunken px-3 py-2 text-caption font-medium uppercase tracking-wide text-ink-muted"
                    >
                      {flexRender(h.column.columnDef.header, h.getContext())}
                    </th>
                  ),
                )}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="hover:bg-accent-soft/40">
                {row.getVisibleCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={`border-b border-rule px-3 py-2 align-middle ${cellLayout(cell.column.id)}`}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {routes.some(figuresFromEarlierEngine) ? (
        <p className="text-caption text-ink-muted">
          * Figures from an earlier version of the calculations: the route has not been saved since
          they changed. Open it to see today&apos;s figures; saving it updates this list.
        </p>
      ) : null}
    </div>
  );
}

/**
 * How a cell lays out at 1280 × 800: the route's name wraps within a readable width, the row's
 * actions wrap under each other rather than pushing the table past its frame, the rest stays on
 * one line.
 */
function cellLayout(columnId: string): string {
  if (columnId === 'name') return 'min-w-[11rem]';
  if (columnId === 'actions') return '';
  return 'whitespace-nowrap';
}

/** A cell's text on one line, cut with an ellipsis past 8 rem, the full text as its tooltip. */
function OneLine({ text }: { text: string }) {
  return (
    <span className="block max-w-[8rem] truncate" title={text}>
      {text}
    </span>
  );
}
