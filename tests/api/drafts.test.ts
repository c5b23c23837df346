import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { parseExact } from '@shared/schemas/exact';
import {
  draftConflictSchema,
  routeDetailSchema,
  saveDraftResponseSchema,
} from '@shared/schemas/routes';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { AuditEvent, type Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;
type Doc = {
  steps: { id: string; params: Record<string, unknown> }[];
  connections: { id: string }[];
};

describe('route drafts (autosave)', () => {
  let workspace: Workspace;
  let asChemist: SignedIn;
  let asColleague: SignedIn;
  let colleagueName: string;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    const chemist = await buildMember(workspace, ['chemist']);
    const colleague = await buildMember(workspace, ['chemist'], { name: 'Bea Colleague' });
    colleagueName = colleague.name;
    asChemist = await signIn(server.app, chemist.email);
    asColleague = await signIn(server.app, colleague.email);
  });

  const newRoute = async (document?: RouteDocumentInput) => {
    const response = await asChemist.agent
      .post(`/api/v1/workspaces/${workspace.id}/routes`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ name: 'Draft test', ...(document ? { document } : {}) });
    return routeDetailSchema.parse(response.body);
  };
  const draftPath = (routeId: string) =>
    `/api/v1/workspaces/${workspace.id}/routes/${routeId}/draft`;
  const save = (who: SignedIn, routeId: string, document: unknown, baseVersion: number) =>
    who.agent
      .put(draftPath(routeId))
      .set('X-CSRF-Token', who.csrfToken)
      .send({ document, baseVersion });

  it('requires authentication', async () => {
    const route = await newRoute();
    expect(
      (
        await request(server.app)
          .put(draftPath(route.id))
          .send({ document: demo(), baseVersion: 1 })
      ).status,
    ).toBe(401);
  });

  it('each save with the current baseVersion increments the version and stores the totals', async () => {
    const route = await newRoute();
    const first = await save(asChemist, route.id, demo(), 1);
    expect(first.status).toBe(200);
    const saved = saveDraftResponseSchema.parse(first.body);
    expect(saved.version).toBe(2);
    expect(saved.totals!.yieldPct).toBeGreaterThan(0);
    expect(saved.totals!.yieldPct).toBeLessThanOrEqual(100);
    expect(saved.evaluationError).toBeNull();
    expect(saved.processSafetyNote).toMatch(/process-safety review/);

    // A change the engine sees: less antisolvent leaves more product in the liquor.
    const lessHeptane = demo() as unknown as Doc;
    const mode = lessHeptane.steps.find((s) => s.id === 'antisolvent')!.params.mode as {
      volume: { value: unknown };
    };
    mode.volume.value = 1;
    const second = saveDraftResponseSchema.parse(
      (await save(asChemist, route.id, lessHeptane, 2)).body,
    );
    expect(second.version).toBe(3);
    expect(second.totals!.yieldPct).not.toEqual(saved.totals!.yieldPct);

    const detail = routeDetailSchema.parse(
      (await asColleague.agent.get(`/api/v1/workspaces/${workspace.id}/routes/${route.id}`)).body,
    );
    expect(detail.draftVersion).toBe(3);
    expect(detail.draft.version).toBe(3);
    expect(detail.draft.document).toEqual(lessHeptane);
    expect(detail.totals).toEqual(second.totals);
    expect(detail.stepCount).toBe(demoRoute.steps.length);
    expect(
      await AuditEvent.count({ where: { action: 'route.draft.save', entityId: route.id } }),
    ).toBe(2);
  });

  it('a save from a stale baseVersion answers 409 with the current draft and who changed it, and changes nothing', async () => {
    const route = await newRoute(demo());
    // The colleague saves first (another person, or another tab).
    const theirs = demo() as unknown as Doc;
    theirs.steps[0].params.temperatureC = 25;
    expect((await save(asColleague, route.id, theirs, 1)).status).toBe(200);

    const mine = demo() as unknown as Doc;
    mine.steps[0].params.temperatureC = 30;
    const response = await save(asChemist, route.id, mine, 1);
    expect(response.status).toBe(409);
    // The reply is one member of the error contract, as the client parses it (exactly).
    const contract = parseExact(apiErrorSchema, response.body);
    expect(contract.success, JSON.stringify(contract.error?.issues)).toBe(true);
    const { error } = draftConflictSchema.parse(response.body);
    expect(error.code).toBe('draft_conflict');
    expect(error.message).toContain(colleagueName);
    expect(error.details.current.version).toBe(2);
    expect(error.details.current.updatedBy).toEqual({
      id: asColleague.session.user.id,
      name: colleagueName,
    });
    expect(error.message).toContain(error.details.current.updatedAt);
    expect(error.details.current.document).toEqual(theirs);

    const detail = routeDetailSchema.parse(
      (await asChemist.agent.get(`/api/v1/workspaces/${workspace.id}/routes/${route.id}`)).body,
    );
    expect(detail.draft.version).toBe(2);
    expect((detail.draft.document as unknown as Doc).steps[0].params.temperatureC).toBe(25);

    // Rebased on the current version, the same edit goes through.
    expect((await save(asChemist, route.id, mine, 2)).body.version).toBe(3);
  });

  it('of two saves racing from the same version exactly one wins', async () => {
    const route = await newRoute();
    const results = await Promise.all([
      save(asChemist, route.id, demo(), 1),
      save(asColleague, route.id, demo(), 1),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
  });

  it('an invalid document answers 400 with the field path, and is not saved', async () => {
    const route = await newRoute();
    const bad = demo() as unknown as Doc;
    bad.steps[1].params.stages = 0;
    const response = await save(asChemist, route.id, bad, 1);
    expect(response.status).toBe(400);
    expect((response.body.error.details as { path: string }[]).map((d) => d.path)).toContain(
      'document.steps.1.params.stages',
    );
    const missingBase = await asChemist.agent
      .put(draftPath(route.id))
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ document: demo() });
    expect(missingBase.status).toBe(400);
    expect(missingBase.body.error.details.map((d: { path: string }) => d.path)).toContain(
      'baseVersion',
    );
    const detail = (
      await asChemist.agent.get(`/api/v1/workspaces/${workspace.id}/routes/${route.id}`)
    ).body;
    expect(detail.draft.version).toBe(1);
  });

  it('a valid document the engine cannot evaluate is saved with totals null and the reason on its step', async () => {
    const route = await newRoute();
    const unconnected = demo() as unknown as Doc;
    unconnected.connections = unconnected.connections.filter((c) => c.id !== 'c8');
    const response = await save(asChemist, route.id, unconnected, 1);
    expect(response.status).toBe(200);
    const saved = saveDraftResponseSchema.parse(response.body);
    expect(saved.version).toBe(2);
    expect(saved.totals).toBeNull();
    expect(saved.evaluationError!.code).toBe('route_invalid');
    expect(saved.evaluationError!.details).toContainEqual(
      expect.objectContaining({ stepId: 'dry', field: 'inputs.wet' }),
    );
    const detail = routeDetailSchema.parse(
      (await asChemist.agent.get(`/api/v1/workspaces/${workspace.id}/routes/${route.id}`)).body,
    );
    expect(detail.totals).toBeNull();
    expect(detail.draft.evaluationError!.details[0].stepId).toBe('dry');
  });

  it('an archived route refuses draft saves until it is unarchived', async () => {
    const route = await newRoute();
    const routePath = `/api/v1/workspaces/${workspace.id}/routes/${route.id}`;
    await asChemist.agent
      .patch(routePath)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ archived: true, baseVersion: 1 });
    const refused = await save(asChemist, route.id, demo(), 1);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('route_archived');
    await asChemist.agent
      .patch(routePath)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ archived: false, baseVersion: 2 });
    expect((await save(asChemist, route.id, demo(), 1)).status).toBe(200);
  });
});
