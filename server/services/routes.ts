/**
 * Routes of a workspace: list (a page at a time), create,
 * rename, move between projects, archive, duplicate. Callers load the
 * workspace and authorize first; a route of another workspace is not found.
 */
import {
  Op,
  col,
  fn,
  literal,
  where as sqlWhere,
  type IncludeOptions,
  type Transaction,
  type WhereOptions,
  QueryTypes,
} from 'sequelize';
import { hotRead, nested } from '../db/hot-read';
import { database } from '../db/sequelize';
import type { DraftDocument, KeyTotals, RouteSort } from '@shared/schemas/routes';
import { badRequest, notFound, versionConflict } from '../errors';
import { Project, Route, RouteDraft, User } from '../models';
import { recordAudit } from './audit';
import {
  afterCursor,
  matchingRows,
  trigramSearchable,
  probeMatches,
  idsInSql,
  keyAttributes,
  keyOrder,
  pageOf,
  type KeysetOrder,
} from './keyset';
import { createDraft, type DraftEvaluation } from './drafts';

/** The key totals of a list row (presentKeyTotals() for a loaded draft). */
const KEY_TOTALS = `CASE WHEN "draft"."totals" IS NULL OR jsonb_typeof("draft"."totals") = 'null' THEN NULL
  ELSE jsonb_build_object('yieldPct', "draft"."totals" -> 'yieldPct', 'purityPct', "draft"."totals" -> 'purityWtPct', 'pmi', "draft"."totals" -> 'pmi', 'engineVersion', "draft"."engine_version") END`;

/** What a route read and a list row select (RouteView), named as `nest` builds it. */
const ROUTE_VIEW_COLUMNS = `"Route"."id", "Route"."name", "Route"."archived_at" AS "archivedAt",
  "Route"."version", "Route"."workspace_id" AS "workspaceId", "Route"."updated_at" AS "updatedAt",
  "project"."id" AS "project.id", "project"."name" AS "project.name",
  "owner"."id" AS "owner.id", "owner"."name" AS "owner.name",
  "draft"."version" AS "draft.version", "draft"."updated_at" AS "draft.updatedAt",
  "draft"."step_count" AS "draft.stepCount", "draft"."evaluation_error" AS "draft.evaluationError",
  ${KEY_TOTALS} AS "draft.keyTotals",
  "updatedBy"."id" AS "draft.updatedBy.id", "updatedBy"."name" AS "draft.updatedBy.name"`;
/**
 * A list row as the JSON of its RouteSummary, built by PostgreSQL: the same fields and values
 * presentRouteSummary() gives (the later of the route's and the draft's change, to the
 * millisecond as Date.toISOString() has it), with no row parsed, nested or written again here.
 */
const ROUTE_SUMMARY_JSON = `json_build_object(
  'id', "Route"."id", 'name', "Route"."name",
  'project', CASE WHEN "project"."id" IS NULL THEN NULL
    ELSE json_build_object('id', "project"."id", 'name', "project"."name") END,
  'status', CASE WHEN "Route"."archived_at" IS NULL THEN 'draft' ELSE 'archived' END,
  'owner', json_build_object('id', "owner"."id", 'name', "owner"."name"),
  'updatedAt', to_char(greatest("Route"."updated_at", "draft"."updated_at") AT TIME ZONE 'UTC',
    'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'),
  'draftVersion', "draft"."version", 'version', "Route"."version",
  'totals', ${KEY_TOTALS}, 'stepCount', "draft"."step_count")::text`;
const ROUTE_VIEW_FROM = `routes AS "Route"
  LEFT JOIN projects AS "project" ON "project"."id" = "Route"."project_id"
  LEFT JOIN users AS "owner" ON "owner"."id" = "Route"."owner_id"
  JOIN route_drafts AS "draft" ON "draft"."route_id" = "Route"."id"
  LEFT JOIN users AS "updatedBy" ON "updatedBy"."id" = "draft"."updated_by_id"`;
const ROUTE_READ_COLUMNS = `${ROUTE_VIEW_COLUMNS}, "draft"."document"::text AS "draft.documentJson"`;
/** A route read's fixed statement, prepared once per connection (hotRead()). */
const ROUTE_READ_SQL = `SELECT ${ROUTE_READ_COLUMNS} FROM ${ROUTE_VIEW_FROM}
  WHERE "Route"."id" = $1 AND "Route"."workspace_id" = $2`;

const routeIncludes: IncludeOptions[] = [
  { model: Project, as: 'project', attributes: ['id', 'name'] },
  { model: User, as: 'owner', attributes: ['id', 'name'] },
  {
    model: RouteDraft,
    as: 'draft',
    required: true,
    include: [{ model: User, as: 'updatedBy', attributes: ['id', 'name'] }],
  },
];

const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

type RouteCursor = { sort: RouteSort; key: string; id: string };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
// The sort key as text, exactly (microseconds kept), for the cursor of the next page.
const CHANGED_KEY = `to_char("Route"."changed_at" AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;
const NAME_KEY = 'lower("Route"."name")';

const encodeRouteCursor = (cursor: RouteCursor) =>
  Buffer.from(JSON.stringify([cursor.sort, cursor.key, cursor.id]), 'utf8').toString('base64url');

function decodeRouteCursor(text: string, sort: RouteSort): RouteCursor {
  let parts: unknown;
  try {
    parts = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    parts = null;
  }
  const [cursorSort, key, id] = Array.isArray(parts) && parts.length === 3 ? parts : [];
  const valid =
    typeof key === 'string' &&
    typeof id === 'string' &&
    UUID.test(id) &&
    (cursorSort === 'name' || (cursorSort === 'changed' && !Number.isNaN(Date.parse(key))));
  if (!valid)
    throw badRequest('The page link is not valid; start from the first page.', [
      { path: 'query.cursor', message: 'Not a cursor from a previous page.' },
    ]);
  if (cursorSort !== sort)
    throw badRequest(
      'The page link belongs to another order of the list; start from the first page.',
      [
        {
          path: 'query.cursor',
          message: `This cursor pages the list sorted by ${cursorSort}, not by ${sort}.`,
        },
      ],
    );
  return { sort, key: key as string, id: id as string };
}

/**
 * One page of the workspace's routes (current or archived), by last change
 * (newest first) or by name, after the cursor of the previous page. Keyset
 * paging: the page starts after the last row's (sort key, id), so rows never
 * repeat or go missing between pages, whatever is added meanwhile. Each sort
 * is served by a partial index (migrations, "list-keysets"); `q` matches part
 * of the route's or its project's name (trigram indexes), wildcards literal.
 */
export async function listRoutes(
  workspaceId: string,
  query: { archived: boolean; q?: string; sort: RouteSort; limit: number; cursor?: string },
  transaction: Transaction | null,
): Promise<{ itemsJson: string[]; nextCursor: string | null }> {
  const escape = (value: string) => Route.sequelize!.escape(value);
  // SQL text throughout: building the query from options was a large part of a page's work.
  const conditions: string[] = [
    `"Route"."workspace_id" = ${escape(workspaceId)}`,
    `"Route"."archived_at" IS ${query.archived ? 'NOT NULL' : 'NULL'}`,
  ];
  if (query.q) {
    const pattern = escape(likePattern(query.q));
    const projects = `SELECT p.id FROM projects p WHERE p.workspace_id = ${escape(workspaceId)} AND p.name ILIKE ${pattern}`;
    const filter = `("Route"."name" ILIKE ${pattern} OR "Route"."project_id" IN (${projects}))`;
    // A selective term starts from its trigram matches (routes_name_trgm_idx,
    // projects_name_trgm_idx); see matchingRows() in keyset.ts for why and when.
    const ids = trigramSearchable(query.q)
      ? await probeMatches(
          `SELECT s.id FROM routes s WHERE s.name ILIKE ${pattern} UNION SELECT s.id FROM routes s WHERE s.project_id IN (${projects})`,
          transaction,
        )
      : null;
    conditions.push(ids === null ? filter : idsInSql('"Route"."id"', ids));
  }

  if (query.cursor) {
    const after = decodeRouteCursor(query.cursor, query.sort);
    conditions.push(
      query.sort === 'changed'
        ? `("Route"."changed_at", "Route"."id") < (${escape(after.key)}::timestamptz, ${escape(after.id)}::uuid)`
        : `(${NAME_KEY}, "Route"."id") > (${escape(after.key)}, ${escape(after.id)}::uuid)`,
    );
  }
  const sql = `SELECT "Route"."id", ${ROUTE_SUMMARY_JSON} AS "item", ${query.sort === 'changed' ? CHANGED_KEY : NAME_KEY} AS "sortKey"
       FROM ${ROUTE_VIEW_FROM}
      WHERE ${conditions.join(' AND ')}
      ORDER BY ${query.sort === 'changed' ? '"Route"."changed_at" DESC, "Route"."id" DESC' : `${NAME_KEY} ASC, "Route"."id" ASC`}
      LIMIT ${query.limit + 1}`;
  type Row = { id: string; item: string; sortKey: string };
  // Each row's JSON as text: building model instances, then objects, was most of a page's work.
  const rows = transaction
    ? await database().query<Row>(sql, { type: QueryTypes.SELECT, transaction })
    : await hotRead<Row>(sql, []);
  const routes = rows.slice(0, query.limit);
  const last = routes.at(-1);
  return {
    itemsJson: routes.map((row) => row.item),
    nextCursor:
      rows.length > query.limit && last
        ? encodeRouteCursor({ sort: query.sort, key: last.sortKey, id: last.id })
        : null,
  };
}

/**
 * What a route read and the list present: the route with its project, owner and draft as
 * plain rows (no model instances; a read builds none), shaped like a loaded Route.
 */
export interface RouteView {
  id: string;
  name: string;
  archivedAt: Date | null;
  version: number;
  workspaceId: string;
  updatedAt: Date;
  project: { id: string; name: string } | null;
  owner: { id: string; name: string } | null;
  draft: {
    version: number;
    updatedAt: Date;
    keyTotals: KeyTotals | null;
    stepCount: number;
    evaluationError?: unknown;
    updatedBy?: { id: string; name: string } | null;
  };
}

/**
 * A route for reading: its draft document stays the JSON text PostgreSQL stores (parsing and
 * re-serialising a few hundred kB per read was most of a read's work); the presenter splices
 * it into the reply as it is.
 */
export async function readRoute(
  workspaceId: string,
  routeId: string,
  transaction: Transaction | null,
): Promise<{ route: RouteView; documentJson: string }> {
  type Row = RouteView & { draft: { documentJson: string } };
  const [row] = transaction
    ? await database().query<Row>(
        `SELECT ${ROUTE_READ_COLUMNS} FROM ${ROUTE_VIEW_FROM}
          WHERE "Route"."id" = $routeId AND "Route"."workspace_id" = $workspaceId`,
        { type: QueryTypes.SELECT, nest: true, bind: { routeId, workspaceId }, transaction },
      )
    : (
        await hotRead<Record<string, unknown>>(ROUTE_READ_SQL, [routeId, workspaceId], 'route-read')
      ).map((r) => nested<Row>(r));
  if (!row) throw notFound();
  const { documentJson, ...draft } = row.draft;
  return { route: { ...row, ...nullIncludes(row), draft }, documentJson };
}

/** A left join that found nothing comes back from a raw query as an object of nulls. */
function nullIncludes(row: RouteView): Pick<RouteView, 'project' | 'owner'> {
  return {
    project: row.project?.id ? row.project : null,
    owner: row.owner?.id ? row.owner : null,
  };
}

/** A route of this workspace with its project, owner and draft; 404 otherwise. */
export async function loadRoute(
  workspaceId: string,
  routeId: string,
  transaction: Transaction | null,
): Promise<Route> {
  const route = await Route.findOne({
    where: { id: routeId, workspaceId },
    include: routeIncludes,
    transaction,
  });
  if (!route) throw notFound();
  return route;
}

/** The project of this name in the workspace (ignoring case), created when new. */
async function projectNamed(
  workspaceId: string,
  name: string,
  transaction: Transaction | null,
): Promise<Project> {
  const existing = await Project.findOne({
    where: { workspaceId, [Op.and]: [sqlWhere(fn('lower', col('name')), name.toLowerCase())] },
    transaction,
  });
  if (existing) return existing;
  return Project.create({ workspaceId, name }, { transaction });
}

export async function createRoute(
  input: {
    workspaceId: string;
    ownerId: string;
    name: string;
    projectName?: string;
    document: DraftDocument;
    /** The document's evaluation, made in the engine pool before the transaction. */
    evaluation: DraftEvaluation;
  },
  transaction: Transaction | null,
): Promise<Route> {
  const project = input.projectName
    ? await projectNamed(input.workspaceId, input.projectName, transaction)
    : null;
  const route = await Route.create(
    {
      workspaceId: input.workspaceId,
      projectId: project?.id ?? null,
      ownerId: input.ownerId,
      name: input.name,
    },
    { transaction },
  );
  const { document } = input;
  await createDraft(route.id, document, input.evaluation, input.ownerId, transaction);
  await recordAudit(
    {
      workspaceId: input.workspaceId,
      actorId: input.ownerId,
      action: 'route.create',
      entityType: 'route',
      entityId: route.id,
      after: { name: route.name, project: project?.name ?? null, stepCount: document.steps.length },
    },
    transaction,
  );
  return loadRoute(input.workspaceId, route.id, transaction);
}

export async function updateRoute(
  route: Route,
  changes: { name?: string; projectName?: string | null; archived?: boolean; baseVersion: number },
  actorId: string,
  transaction: Transaction | null,
): Promise<Route> {
  const workspaceId = route.workspaceId as string;
  const locked = await Route.findByPk(route.id, {
    attributes: ['id', 'version', 'updatedAt'],
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: Route } : undefined,
  });
  if (locked!.version !== changes.baseVersion) throw versionConflict('route', locked!);
  const audit = (action: string, before: unknown, after: unknown) =>
    recordAudit(
      { workspaceId, actorId, action, entityType: 'route', entityId: route.id, before, after },
      transaction,
    );

  if (changes.name !== undefined && changes.name !== route.name) {
    await audit('route.rename', { name: route.name }, { name: changes.name });
    route.name = changes.name;
  }
  if (changes.projectName !== undefined) {
    const project =
      changes.projectName === null
        ? null
        : await projectNamed(workspaceId, changes.projectName, transaction);
    if ((project?.id ?? null) !== (route.projectId ?? null)) {
      await audit(
        'route.move',
        { project: route.project?.name ?? null },
        { project: project?.name ?? null },
      );
      route.projectId = project?.id ?? null;
    }
  }
  if (changes.archived !== undefined && changes.archived !== (route.archivedAt !== null)) {
    await audit(
      changes.archived ? 'route.archive' : 'route.unarchive',
      { archived: !changes.archived },
      { archived: changes.archived },
    );
    route.archivedAt = changes.archived ? new Date() : null;
  }
  if (route.changed()) {
    route.version = locked!.version + 1;
    await route.save({ transaction });
  }
  return loadRoute(workspaceId, route.id, transaction);
}

export async function duplicateRoute(
  route: Route,
  name: string | undefined,
  evaluation: DraftEvaluation,
  actorId: string,
  transaction: Transaction | null,
): Promise<Route> {
  const workspaceId = route.workspaceId as string;
  const copyName = name ?? `${route.name} (copy)`.slice(0, 200);
  const copy = await Route.create(
    { workspaceId, projectId: route.projectId ?? null, ownerId: actorId, name: copyName },
    { transaction },
  );
  await createDraft(
    copy.id,
    route.draft!.document as DraftDocument,
    evaluation,
    actorId,
    transaction,
  );
  await recordAudit(
    {
      workspaceId,
      actorId,
      action: 'route.duplicate',
      entityType: 'route',
      entityId: copy.id,
      after: { name: copyName, sourceRouteId: route.id, sourceVersion: route.draft!.version },
    },
    transaction,
  );
  return loadRoute(workspaceId, copy.id, transaction);
}

const PROJECT_ORDER: KeysetOrder = {
  name: 'name',
  columns: [
    { sql: 'lower("Project"."name")', type: 'text' },
    { sql: '"Project"."id"', type: 'uuid' },
  ],
  direction: 'ASC',
};

/**
 * One page of the workspace's projects by name (projects_workspace_name_id_idx),
 * `q` matching part of the name (projects_name_trgm_idx), each with the count of
 * its current routes.
 */
export async function listProjects(
  workspaceId: string,
  query: { q?: string; limit: number; cursor?: string },
  transaction: Transaction | null,
): Promise<{
  items: Array<{ id: string; name: string; routeCount: number }>;
  nextCursor: string | null;
}> {
  const conditions: WhereOptions[] = [{ workspaceId }];
  if (query.q)
    conditions.push(
      await matchingRows(
        { model: 'Project', table: 'projects', expressions: [(t) => `${t}.name`] },
        query.q,
      ),
    );
  if (query.cursor) conditions.push(afterCursor(PROJECT_ORDER, query.cursor));
  // The count of current routes in the same statement (routes_project_idx per project).
  const rows = await Project.findAll({
    where: { [Op.and]: conditions },
    attributes: {
      include: [
        ...keyAttributes(PROJECT_ORDER),
        [
          literal(
            `(SELECT count(*) FROM routes r WHERE r.project_id = "Project"."id" AND r.archived_at IS NULL)::int`,
          ),
          'routeCount',
        ],
      ],
    },
    order: keyOrder(PROJECT_ORDER),
    limit: query.limit + 1,
    transaction,
  });
  const page = pageOf(rows, query.limit, PROJECT_ORDER);
  return {
    items: page.items.map((project) => ({
      id: project.id,
      name: project.name,
      routeCount: Number(project.get('routeCount')),
    })),
    nextCursor: page.nextCursor,
  };
}
