import { Sequelize } from 'sequelize';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { projectListSchema, routeDetailSchema, routeListSchema } from '@shared/schemas/routes';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { ENGINE_VERSION } from '@shared/engine/version';
import { AuditEvent, RouteDraft, type User, type Workspace } from '../../server/models';
import { runMigrations, runSeeders } from '../../server/db/migrator';
import { DEMO_PROJECT_NAME, DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { clusterAdminUrl, useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

describe('routes of a workspace', () => {
  let workspace: Workspace;
  let chemist: User;
  let asChemist: SignedIn;
  let asAdmin: SignedIn;
  let asReviewer: SignedIn;
  let asEngineer: SignedIn;
  let asOutsider: SignedIn;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    const otherWorkspace = await buildWorkspace();
    chemist = await buildMember(workspace, ['chemist'], { name: 'Ada Chemist' });
    const admin = await buildMember(workspace, ['admin']);
    const reviewer = await buildMember(workspace, ['reviewer']);
    const engineer = await buildMember(workspace, ['engineer']);
    const outsider = await buildMember(otherWorkspace, ['chemist', 'admin']);
    [asChemist, asAdmin, asReviewer, asEngineer, asOutsider] = await Promise.all(
      [chemist, admin, reviewer, engineer, outsider].map((u) => signIn(server.app, u.email)),
    );
  });

  const routesPath = () => `/api/v1/workspaces/${workspace.id}/routes`;
  const post = (who: SignedIn, path: string, body: object) =>
    who.agent.post(path).set('X-CSRF-Token', who.csrfToken).send(body);
  // Edits name the version they were based on: the current one, unless the test says otherwise.
  const patch = async (who: SignedIn, path: string, body: object) => {
    const current = await who.agent.get(path);
    return who.agent
      .patch(path)
      .set('X-CSRF-Token', who.csrfToken)
      .send({ baseVersion: current.body.version ?? 1, ...body });
  };

  it('refuses an edit based on an older version (409), and of two concurrent edits keeps one', async () => {
    const route = (await post(asChemist, routesPath(), { name: 'Versioned (invented)' })).body;
    const path = `${routesPath()}/${route.id}`;
    expect(route.version).toBe(1);
    const [a, b] = await Promise.all([
      asChemist.agent
        .patch(path)
        .set('X-CSRF-Token', asChemist.csrfToken)
        .send({ name: 'First writer', baseVersion: 1 }),
      asChemist.agent
        .patch(path)
        .set('X-CSRF-Token', asChemist.csrfToken)
        .send({ name: 'Second writer', baseVersion: 1 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    const winner = a.status === 409 ? b : a;
    expect(loser.body.error).toMatchObject({ code: 'version_conflict', details: { version: 2 } });
    expect((await asChemist.agent.get(path)).body).toMatchObject({
      name: winner.body.name,
      version: 2,
    });
    const missing = await asChemist.agent
      .patch(path)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ name: 'No base' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details.map((d: { path: string }) => d.path)).toContain(
      'baseVersion',
    );
  });

  it('requires authentication', async () => {
    expect((await request(server.app).get(routesPath())).status).toBe(401);
    expect((await request(server.app).post(routesPath()).send({ name: 'x' })).status).toBe(401);
    expect(
      (await request(server.app).get(`/api/v1/workspaces/${workspace.id}/projects`)).status,
    ).toBe(401);
  });

  it('a chemist creates an empty route: draft version 1, no totals yet, and the reason', async () => {
    const response = await post(asChemist, routesPath(), {
      name: 'Empty start',
      projectName: 'Programme A (invented)',
    });
    expect(response.status).toBe(201);
    const route = routeDetailSchema.parse(response.body);
    expect(route).toMatchObject({
      name: 'Empty start',
      status: 'draft',
      draftVersion: 1,
      totals: null,
      stepCount: 0,
      project: { name: 'Programme A (invented)' },
    });
    expect(route.owner).toEqual({ id: chemist.id, name: 'Ada Chemist' });
    expect(route.draft.document).toMatchObject({
      schemaVersion: 1,
      steps: [],
      connections: [],
      components: [],
    });
    expect(route.draft.evaluationError?.code).toBe('route_incomplete');
    expect(route.draft.updatedBy.id).toBe(chemist.id);
    expect(route.abilities).toMatchObject({
      read: true,
      edit: true,
      rename: true,
      duplicate: true,
      archive: true,
    });
    const audit = await AuditEvent.findOne({
      where: { action: 'route.create', entityId: route.id },
    });
    expect(audit?.actorId).toBe(chemist.id);
  });

  it('creates a route from a document and stores its key totals', async () => {
    const response = await post(asChemist, routesPath(), {
      name: 'From the demo',
      projectName: 'programme a (INVENTED)',
      document: demo(),
    });
    expect(response.status).toBe(201);
    const route = routeDetailSchema.parse(response.body);
    expect(route.stepCount).toBe(demoRoute.steps.length);
    expect(route.totals!.yieldPct).toBeGreaterThan(0);
    expect(route.totals!.yieldPct).toBeLessThanOrEqual(100);
    expect(route.totals!.purityPct).toBeGreaterThan(0);
    expect(route.totals!.pmi).toBeGreaterThan(1);
    expect(route.draft.evaluationError).toBeNull();
    // A read and the list take the key totals (and the document) from the stored rows without
    // loading them whole: the same values as the reply of the write, which did.
    const read = await asReviewer.agent.get(`${routesPath()}/${route.id}`);
    expect(read.body).toEqual({ ...route, abilities: read.body.abilities });
    expect(read.body.draft.document).toEqual(demo());
    const listed = await asReviewer.agent.get(
      `${routesPath()}?q=${encodeURIComponent('From the demo')}`,
    );
    const item = listed.body.items.find((r: { id: string }) => r.id === route.id);
    expect(item.totals).toEqual(route.totals);
    // The list writes its rows' JSON in SQL: field for field what the read presents.
    const { draft: _draft, abilities: _abilities, ...summary } = read.body;
    expect(item).toEqual(summary);
    expect(item.project.name.toLowerCase()).toBe('programme a (invented)');
    // The project name matched the existing one, ignoring case.
    const projects = projectListSchema.parse(
      (await asReviewer.agent.get(`/api/v1/workspaces/${workspace.id}/projects`)).body,
    ).items;
    expect(projects.filter((p) => p.name.toLowerCase() === 'programme a (invented)')).toHaveLength(
      1,
    );
    expect(
      projects.find((p) => p.name === 'Programme A (invented)')!.routeCount,
    ).toBeGreaterThanOrEqual(2);
  });

  it('says which engine computed the stored figures, so a list can tell figures from before an upgrade', async () => {
    const created = routeDetailSchema.parse(
      (await post(asChemist, routesPath(), { name: 'Saved before an upgrade', document: demo() }))
        .body,
    );
    expect(created.totals!.engineVersion).toBe(ENGINE_VERSION);
    // As if saved by the engine before this one: the stored figures keep the version that made them.
    await RouteDraft.update({ engineVersion: '1.1.0' }, { where: { routeId: created.id } });
    const path = `${routesPath()}/${created.id}`;
    const read = routeDetailSchema.parse((await asReviewer.agent.get(path)).body);
    expect(read.totals!.engineVersion).toBe('1.1.0');
    const listed = routeListSchema.parse(
      (
        await asReviewer.agent.get(
          `${routesPath()}?q=${encodeURIComponent('Saved before an upgrade')}`,
        )
      ).body,
    );
    expect(listed.items.find((r) => r.id === created.id)!.totals!.engineVersion).toBe('1.1.0');
    // Saving the draft again computes and stores today's figures.
    const saved = await asChemist.agent
      .put(`${path}/draft`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ document: demo(), baseVersion: read.draftVersion });
    expect(saved.status).toBe(200);
    expect(saved.body.totals.engineVersion).toBe(ENGINE_VERSION);
    const again = routeDetailSchema.parse((await asReviewer.agent.get(path)).body);
    expect(again.totals!.engineVersion).toBe(ENGINE_VERSION);
  });

  it('renames, moves to a project, archives and unarchives, with audit entries', async () => {
    const created = routeDetailSchema.parse(
      (await post(asChemist, routesPath(), { name: 'Old name' })).body,
    );
    const path = `${routesPath()}/${created.id}`;
    const renamed = await patch(asChemist, path, {
      name: 'New name',
      projectName: 'Programme B (invented)',
    });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({
      name: 'New name',
      project: { name: 'Programme B (invented)' },
    });
    const rename = await AuditEvent.findOne({
      where: { action: 'route.rename', entityId: created.id },
    });
    expect(rename).toMatchObject({ before: { name: 'Old name' }, after: { name: 'New name' } });

    const archived = await patch(asAdmin, path, { archived: true });
    expect(archived.status).toBe(200);
    expect(archived.body).toMatchObject({ status: 'archived', abilities: { edit: false } });
    expect(
      await AuditEvent.count({ where: { action: 'route.archive', entityId: created.id } }),
    ).toBe(1);

    const out = await patch(asChemist, path, { projectName: null, archived: false });
    expect(out.body).toMatchObject({ status: 'draft', project: null });
    expect(
      await AuditEvent.count({ where: { action: 'route.unarchive', entityId: created.id } }),
    ).toBe(1);
  });

  it('duplicates a route with its draft, owned by whoever duplicated it', async () => {
    const source = routeDetailSchema.parse(
      (await post(asChemist, routesPath(), { name: 'Original', document: demo() })).body,
    );
    const response = await post(asAdmin, `${routesPath()}/${source.id}/duplicate`, {});
    expect(response.status).toBe(201);
    const copy = routeDetailSchema.parse(response.body);
    expect(copy.id).not.toBe(source.id);
    expect(copy.name).toBe('Original (copy)');
    expect(copy.owner.id).toBe(asAdmin.session.user.id);
    expect(copy.draftVersion).toBe(1);
    expect(copy.draft.document).toEqual(source.draft.document);
    expect(copy.totals).toEqual(source.totals);
    const named = await post(asChemist, `${routesPath()}/${source.id}/duplicate`, {
      name: 'Variant with more heptane',
    });
    expect(named.body.name).toBe('Variant with more heptane');
    expect(
      await AuditEvent.findOne({ where: { action: 'route.duplicate', entityId: copy.id } }),
    ).toMatchObject({ after: { sourceRouteId: source.id } });
  });

  it('reviewers and scale-up engineers read routes but get 403 on every write', async () => {
    const route = routeDetailSchema.parse(
      (await post(asChemist, routesPath(), { name: 'Read only for some' })).body,
    );
    const path = `${routesPath()}/${route.id}`;
    for (const reader of [asReviewer, asEngineer]) {
      expect((await reader.agent.get(routesPath())).status).toBe(200);
      const detail = await reader.agent.get(path);
      expect(detail.status).toBe(200);
      expect(detail.body.abilities).toMatchObject({
        read: true,
        edit: false,
        rename: false,
        duplicate: false,
        archive: false,
      });
      expect((await post(reader, routesPath(), { name: 'Nope' })).status).toBe(403);
      expect((await patch(reader, path, { name: 'Nope' })).status).toBe(403);
      expect((await patch(reader, path, { archived: true })).status).toBe(403);
      expect((await post(reader, `${path}/duplicate`, {})).status).toBe(403);
      const save = await reader.agent
        .put(`${path}/draft`)
        .set('X-CSRF-Token', reader.csrfToken)
        .send({ document: demo(), baseVersion: 1 });
      expect(save.status).toBe(403);
    }
    expect((await asReviewer.agent.get(path)).body.name).toBe('Read only for some');
  });

  it("another workspace's routes answer 404, the same as missing ones", async () => {
    const route = routeDetailSchema.parse(
      (await post(asChemist, routesPath(), { name: 'Hidden' })).body,
    );
    const foreign = await asOutsider.agent.get(`${routesPath()}/${route.id}`);
    const missing = await asOutsider.agent.get(
      `${routesPath()}/00000000-0000-4000-8000-000000000000`,
    );
    expect(foreign.status).toBe(404);
    expect(foreign.body).toEqual(missing.body);
    expect((await asOutsider.agent.get(routesPath())).status).toBe(404);
    expect((await patch(asOutsider, `${routesPath()}/${route.id}`, { name: 'Taken' })).status).toBe(
      404,
    );
    expect((await post(asOutsider, `${routesPath()}/${route.id}/duplicate`, {})).status).toBe(404);
    // A route id of one workspace under another workspace the caller belongs to is not found either.
    const own = await post(
      asOutsider,
      `/api/v1/workspaces/${asOutsider.session.workspaces[0].id}/routes`,
      { name: 'Mine' },
    );
    expect((await asChemist.agent.get(`${routesPath()}/${own.body.id}`)).status).toBe(404);
  });

  it('lists active routes by default, archived ones on request, and searches route and project names', async () => {
    const make = async (name: string, projectName?: string) =>
      routeDetailSchema.parse(
        (await post(asChemist, routesPath(), { name, ...(projectName ? { projectName } : {}) }))
          .body,
      );
    const kept = await make('Zeta crystallisation screen', 'Project Quokka (invented)');
    const gone = await make('Zeta old attempt');
    await patch(asChemist, `${routesPath()}/${gone.id}`, { archived: true });

    const active = routeListSchema.parse((await asChemist.agent.get(routesPath())).body).items;
    expect(active.map((r) => r.id)).toContain(kept.id);
    expect(active.map((r) => r.id)).not.toContain(gone.id);
    expect(active.every((r) => r.status === 'draft')).toBe(true);

    const archived = routeListSchema.parse(
      (await asChemist.agent.get(`${routesPath()}?archived=true`)).body,
    ).items;
    expect(archived.map((r) => r.id)).toContain(gone.id);
    expect(archived.every((r) => r.status === 'archived')).toBe(true);

    const byName = routeListSchema.parse(
      (await asChemist.agent.get(`${routesPath()}?q=zeta`)).body,
    ).items;
    expect(byName.map((r) => r.id)).toEqual([kept.id]);
    const byProject = routeListSchema.parse(
      (await asChemist.agent.get(`${routesPath()}?q=quokka`)).body,
    ).items;
    expect(byProject.map((r) => r.id)).toEqual([kept.id]);
    // LIKE wildcards in the search are taken literally.
    expect((await asChemist.agent.get(`${routesPath()}?q=%25`)).body).toEqual({
      items: [],
      nextCursor: null,
    });
    const row = byName[0];
    expect(row).toMatchObject({
      owner: { id: chemist.id, name: 'Ada Chemist' },
      project: { name: 'Project Quokka (invented)' },
      draftVersion: 1,
      stepCount: 0,
      totals: null,
    });

    const bad = await asChemist.agent.get(`${routesPath()}?archived=maybe`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('query.archived');
  });

  it('orders by last change, newest first: a route just renamed comes first', async () => {
    const list = routeListSchema.parse((await asChemist.agent.get(routesPath())).body).items;
    const times = list.map((r) => Date.parse(r.updatedAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    const oldest = list.at(-1)!;
    await patch(asChemist, `${routesPath()}/${oldest.id}`, { name: 'Renamed last (invented)' });
    const after = routeListSchema.parse((await asChemist.agent.get(routesPath())).body).items;
    expect(after[0]!.id).toBe(oldest.id);
  });

  it('answers 400 with the path of a bad name or document', async () => {
    const response = await post(asChemist, routesPath(), {
      name: '  ',
      document: { ...demo(), steps: [{ id: 'x', kind: 'wash', name: 'w', params: {} }] },
    });
    expect(response.status).toBe(400);
    const paths = (response.body.error.details as { path: string }[]).map((d) => d.path);
    expect(paths).toContain('name');
    expect(paths.some((p) => p.startsWith('document.steps.0.params'))).toBe(true);
  });
});

describe('demo seed', () => {
  it('gives the demo workspace the invented demo route, evaluated, once', async () => {
    // A database of its own: seeding the shared test database would change what other files see.
    const baseUrl = new URL(process.env.DATABASE_URL!);
    const name = `${baseUrl.pathname.slice(1)}_routes_seed`;
    const admin = new Sequelize(clusterAdminUrl(), {
      dialect: 'postgres',
      logging: false,
    });
    await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${name}`);
    const fresh = new Sequelize(clusterAdminUrl(name), {
      dialect: 'postgres',
      logging: false,
    });
    try {
      await runMigrations(fresh);
      const { applied } = await runSeeders(fresh, 'test');
      expect(applied).toContain('20261203000000-demo-route.ts');
      const routesOfDemo = async () =>
        (
          await fresh.query(
            `SELECT r.name, p.name AS project, u.email AS owner, d.version, d.step_count, d.totals, d.evaluation_error, d.document
               FROM routes r JOIN workspaces w ON w.id = r.workspace_id JOIN route_drafts d ON d.route_id = r.id
               JOIN users u ON u.id = r.owner_id LEFT JOIN projects p ON p.id = r.project_id
              WHERE w.slug = 'demo-process-group' AND r.name = '${DEMO_ROUTE_NAME.replace(/'/g, "''")}'`,
          )
        )[0] as Array<{
          name: string;
          project: string;
          owner: string;
          version: number;
          step_count: number;
          totals: { yieldPct: number; purityWtPct: number } | null;
          evaluation_error: unknown;
          document: unknown;
        }>;
      const rows = await routesOfDemo();
      expect(rows).toHaveLength(1);
      const [route] = rows;
      expect(route).toMatchObject({
        name: DEMO_ROUTE_NAME,
        project: DEMO_PROJECT_NAME,
        owner: 'chemist@example.com',
        version: 1,
        step_count: demoRoute.steps.length,
        evaluation_error: null,
      });
      expect(route.name).toMatch(/invented/);
      expect(route.project).toMatch(/invented/);
      expect(route.document).toEqual(demoRoute);
      expect(route.totals!.yieldPct).toBeGreaterThan(0);
      expect(route.totals!.yieldPct).toBeLessThanOrEqual(100);
      const [otherSite] = (
        await fresh.query(
          `SELECT count(*)::int AS n FROM routes r JOIN workspaces w ON w.id = r.workspace_id WHERE w.slug = 'second-site'`,
        )
      )[0] as [{ n: number }];
      expect(otherSite.n).toBe(0);

      // Idempotent, even when the record of the seed run is lost.
      await fresh.query(`DELETE FROM "SequelizeData" WHERE name = '20261203000000-demo-route.ts'`);
      expect((await runSeeders(fresh, 'test')).applied).toEqual(['20261203000000-demo-route.ts']);
      expect(await routesOfDemo()).toHaveLength(1);
    } finally {
      await fresh.close();
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await admin.close();
    }
  });
});
