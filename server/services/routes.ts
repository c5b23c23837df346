/**
 * Routes of a workspace: list (grouped by project on the client), create,
 * rename, move between projects, archive, duplicate. Callers load the
 * workspace and authorize first; a route of another workspace is not found.
 */
import {
  Op,
  col,
  fn,
  literal,
  where as sqlWhere,
  type Transaction,
  type WhereOptions,
} from 'sequelize';
import type { DraftDocument } from '@shared/schemas/routes';
import { notFound, versionConflict } from '../errors';
import { Project, Route, RouteDraft, User } from '../models';
import { recordAudit } from './audit';
import { createDraft, type DraftEvaluation } from './drafts';

const summaryIncludes = (withDocument: boolean) => [
  { model: Project, as: 'project', attributes: ['id', 'name'] },
  { model: User, as: 'owner', attributes: ['id', 'name'] },
  {
    model: RouteDraft,
    as: 'draft',
    required: true,
    attributes: withDocument ? undefined : { exclude: ['document'] },
    include: [{ model: User, as: 'updatedBy', attributes: ['id', 'name'] }],
  },
];

const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export async function listRoutes(
  workspaceId: string,
  filter: { archived: boolean; q?: string },
  transaction: Transaction | null,
): Promise<Route[]> {
  const conditions: WhereOptions[] = [
    { workspaceId },
    { archivedAt: filter.archived ? { [Op.ne]: null } : null },
  ];
  if (filter.q) {
    const pattern = likePattern(filter.q);
    conditions.push({
      [Op.or]: [{ name: { [Op.iLike]: pattern } }, { '$project.name$': { [Op.iLike]: pattern } }],
    });
  }
  return Route.findAll({
    where: { [Op.and]: conditions },
    include: summaryIncludes(false),
    order: [
      [literal('"project"."name" IS NULL'), 'ASC'],
      [fn('lower', col('project.name')), 'ASC'],
      ['updatedAt', 'DESC'],
    ],
    limit: 1000,
    // One row per route (every include is to-one), so the filter on the project name can stay in one query.
    subQuery: false,
    transaction,
  });
}

/** A route of this workspace with its project, owner and draft; 404 otherwise. */
export async function loadRoute(
  workspaceId: string,
  routeId: string,
  transaction: Transaction | null,
): Promise<Route> {
  const route = await Route.findOne({
    where: { id: routeId, workspaceId },
    include: summaryIncludes(true),
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

export async function listProjects(
  workspaceId: string,
  transaction: Transaction | null,
): Promise<Array<{ id: string; name: string; routeCount: number }>> {
  const projects = await Project.findAll({
    where: { workspaceId },
    order: [[fn('lower', col('name')), 'ASC']],
    transaction,
  });
  const counts = (await Route.findAll({
    attributes: ['projectId', [fn('count', col('id')), 'count']],
    where: { workspaceId, archivedAt: null, projectId: { [Op.ne]: null } },
    group: ['projectId'],
    raw: true,
    transaction,
  })) as unknown as Array<{ projectId: string; count: string }>;
  const byProject = new Map(counts.map((row) => [row.projectId, Number(row.count)]));
  return projects.map((project) => ({
    id: project.id,
    name: project.name,
    routeCount: byProject.get(project.id) ?? 0,
  }));
}
