/**
 * Every TanStack Query key of the client, one factory per resource. Each
 * `queryOptions` factory takes its key from here and every invalidation names
 * the same factory, so a list and the mutation that changes it cannot drift
 * apart. Keys nest: a resource's `all(...)` is a prefix of its list and detail
 * keys, so invalidating `all` reaches both. Lint refuses an array literal as a
 * query key anywhere else (eslint.config.js, "query keys").
 */
import { partialMatchKey, type Query, type QueryKey } from '@tanstack/react-query';
import type { AuditFilter } from '@shared/schemas/audit';
import type { StructurePreviewRequest } from '@shared/schemas/compounds';

const workspace = (workspaceId: string) => ['workspaces', workspaceId] as const;

export const queryKeys = {
  session: () => ['session'] as const,
  tokens: () => ['tokens'] as const,
  outbox: () => ['outbox'] as const,
  invitations: {
    all: () => ['invitations'] as const,
    one: (token: string) => [...queryKeys.invitations.all(), token] as const,
  },
  solvents: {
    all: () => ['solvents'] as const,
    list: () => [...queryKeys.solvents.all(), 'list'] as const,
    detail: (id: string) => [...queryKeys.solvents.all(), 'detail', id] as const,
  },
  structurePreview: (input: StructurePreviewRequest | null) =>
    ['structure-preview', input] as const,
  jobs: {
    one: (jobId: string | null) => ['jobs', jobId] as const,
  },
  members: {
    /** Prefix of every members list key of the workspace (invalidated by writes). */
    list: (workspaceId: string) => [...workspace(workspaceId), 'members'] as const,
    /** The page list as searched, page after page. */
    pages: (workspaceId: string, q: string) =>
      [...queryKeys.members.list(workspaceId), 'pages', q] as const,
    /** Holders of one role, every page. */
    withRole: (workspaceId: string, role: string) =>
      [...queryKeys.members.list(workspaceId), 'role', role] as const,
    /** The workspace's invitations not yet accepted (admins). */
    pendingInvitations: (workspaceId: string) =>
      [...queryKeys.members.list(workspaceId), 'pending-invitations'] as const,
  },
  compounds: {
    /** Prefix of every compounds list key of the workspace (invalidated by writes). */
    list: (workspaceId: string) => [...workspace(workspaceId), 'compounds'] as const,
    /** The page list as searched, page after page. */
    pages: (workspaceId: string, q: string) =>
      [...queryKeys.compounds.list(workspaceId), 'pages', q] as const,
    /** Every item, every page (for a choice among all of them). */
    all: (workspaceId: string) => [...queryKeys.compounds.list(workspaceId), 'all'] as const,
  },
  chromatograms: {
    all: (workspaceId: string, routeId: string) =>
      [...workspace(workspaceId), 'routes', routeId, 'chromatograms'] as const,
    list: (workspaceId: string, routeId: string, stepId: string) =>
      [...queryKeys.chromatograms.all(workspaceId, routeId), 'list', stepId] as const,
    /** Every sample of the route (all steps), for the calibration's choice. */
    route: (workspaceId: string, routeId: string) =>
      [...queryKeys.chromatograms.all(workspaceId, routeId), 'route'] as const,
    /** Prefix of every single-sample key of the route. */
    ones: (workspaceId: string, routeId: string) =>
      [...queryKeys.chromatograms.all(workspaceId, routeId), 'one'] as const,
    one: (workspaceId: string, routeId: string, id: string, full: boolean) =>
      [...queryKeys.chromatograms.ones(workspaceId, routeId), id, full] as const,
  },
  equipment: {
    /** Prefix of every equipment list key of the workspace (invalidated by writes). */
    list: (workspaceId: string) => [...workspace(workspaceId), 'equipment'] as const,
    /** The page list as searched, page after page. */
    pages: (workspaceId: string, q: string) =>
      [...queryKeys.equipment.list(workspaceId), 'pages', q] as const,
    /** Every item, every page (for a choice among all of them). */
    all: (workspaceId: string) => [...queryKeys.equipment.list(workspaceId), 'all'] as const,
  },
  projects: {
    list: (workspaceId: string) => [...workspace(workspaceId), 'projects'] as const,
  },
  routes: {
    all: (workspaceId: string) => [...workspace(workspaceId), 'routes'] as const,
    list: (workspaceId: string, filter: { archived: boolean; q?: string; sort?: string }) =>
      [...queryKeys.routes.all(workspaceId), 'list', filter] as const,
    detail: (workspaceId: string, routeId: string) =>
      [...queryKeys.routes.all(workspaceId), 'detail', routeId] as const,
  },
  revisions: {
    all: (workspaceId: string) => [...workspace(workspaceId), 'revisions'] as const,
    list: (workspaceId: string, routeId: string) =>
      [...queryKeys.revisions.all(workspaceId), routeId, 'list'] as const,
    detail: (workspaceId: string, routeId: string, number: number) =>
      [...queryKeys.revisions.all(workspaceId), routeId, 'detail', number] as const,
    compare: (workspaceId: string, routeId: string, a: number, b: number) =>
      [...queryKeys.revisions.all(workspaceId), routeId, 'compare', a, b] as const,
    comments: (workspaceId: string, routeId: string, number: number) =>
      [...queryKeys.revisions.all(workspaceId), routeId, 'comments', number] as const,
  },
  attention: (workspaceId: string) => [...workspace(workspaceId), 'attention'] as const,
  audit: {
    list: (workspaceId: string, filter: AuditFilter) =>
      [...workspace(workspaceId), 'audit', filter] as const,
  },
};

/**
 * A `removeQueries` predicate that keeps the queries under the given keys and
 * matches every other one (used when the person signed in changes).
 */
export const allQueriesExcept =
  (...kept: QueryKey[]) =>
  (query: Query) =>
    !kept.some((key) => partialMatchKey(query.queryKey, key));
