import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { evaluateResponseSchema, routeEvaluationErrorSchema } from '@shared/schemas/evaluate';
import { parseExact } from '@shared/schemas/exact';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

/** A fresh copy of the invented demo route, safe to modify. */
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

describe('POST /api/v1/evaluate', () => {
  let asReviewer: SignedIn;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    // Evaluation stores nothing: any signed-in user may run it, whatever their role.
    const reviewer = await buildMember(workspace, ['reviewer']);
    asReviewer = await signIn(server.app, reviewer.email);
  });

  const evaluate = (document: unknown) =>
    asReviewer.agent
      .post('/api/v1/evaluate')
      .set('X-CSRF-Token', asReviewer.csrfToken)
      .send({ document });

  it('requires authentication', async () => {
    const response = await request(server.app).post('/api/v1/evaluate').send({ document: demo() });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });

  it('evaluates the demo route: every step has a result, totals are plausible, cautions carry the process-safety advice', async () => {
    const response = await evaluate(demo());
    expect(response.status).toBe(200);
    const body = evaluateResponseSchema.parse(response.body);
    expect(body.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    const stepIds = (demoRoute.steps as { id: string }[]).map((s) => s.id);
    expect(Object.keys(body.result.steps).sort()).toEqual([...stepIds].sort());
    expect(body.result.order).toHaveLength(stepIds.length);
    const { totals } = body.result;
    expect(totals.yieldPct).toBeGreaterThan(0);
    expect(totals.yieldPct).toBeLessThanOrEqual(100);
    expect(totals.purityWtPct).toBeGreaterThan(0);
    expect(totals.purityWtPct).toBeLessThanOrEqual(100);
    expect(totals.pmi).toBeGreaterThan(1);
    // Every impurity charged gets a purge entry, and a stream for every connection.
    expect(Object.keys(totals.purge).length).toBeGreaterThan(0);
    expect(Object.keys(body.result.streams).sort()).toEqual(
      (demoRoute.connections as { id: string }[]).map((c) => c.id).sort(),
    );
    expect(body.result.processSafetyNote).toMatch(/process-safety review/);
    // Purity as the trade reads it, each impurity against its limit, and where each went per step.
    expect(totals.solventFreePurityPct!).toBeGreaterThan(totals.purityWtPct!);
    expect(totals.impurities.map((i) => i.componentId)).toEqual([
      'pw417-acid',
      'pw417-amine',
      'deschloro-amide',
      'coupling-urea',
    ]);
    expect(totals.impurities.every((i) => i.limitPct !== null && i.pass === true)).toBe(true);
    const acidWash = body.result.steps['acid-wash'] as {
      purge: Record<string, { inKg: number; outKg: number; purgeFactor: number | null }>;
    };
    expect(acidWash.purge['pw417-amine'].purgeFactor!).toBeGreaterThan(1e4);
    expect(acidWash.purge['coupling-urea'].purgeFactor!).toBeGreaterThan(1e3);
  });

  it('is deterministic: the same document gives the same numbers', async () => {
    const [a, b] = [await evaluate(demo()), await evaluate(demo())];
    expect(a.body.result.totals).toEqual(b.body.result.totals);
  });

  it('answers 400 with the field path of a bad step parameter, listing every issue', async () => {
    const doc = demo() as unknown as { steps: { params: Record<string, unknown> }[] };
    doc.steps[2].params.stages = 0;
    doc.steps[3].params.temperatureC = 900;
    const response = await evaluate(doc);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    const paths = (response.body.error.details as { path: string }[]).map((d) => d.path);
    expect(paths).toContain('document.steps.2.params.stages');
    expect(paths).toContain('document.steps.3.params.temperatureC');
  });

  it('answers 422 route_invalid naming the steps of a cycle', async () => {
    const doc = demo();
    // Feed the distillate of the swap back into the acid wash: acid-wash → … → swap → acid-wash.
    doc.connections = doc.connections.filter((c) => c.id !== 'c1');
    doc.connections.push({
      id: 'loop',
      from: { stepId: 'swap', port: 'distillate' },
      to: { stepId: 'acid-wash', port: 'feed' },
    });
    const response = await evaluate(doc);
    expect(response.status).toBe(422);
    // The reply is one member of the error contract, as the client parses it (exactly).
    const contract = parseExact(apiErrorSchema, response.body);
    expect(contract.success, JSON.stringify(contract.error?.issues)).toBe(true);
    const { error } = routeEvaluationErrorSchema.parse(response.body);
    expect(error.code).toBe('route_invalid');
    const cycleSteps = error.details.filter((d) => /loop/.test(d.message)).map((d) => d.stepId);
    expect(cycleSteps).toEqual(
      expect.arrayContaining(['acid-wash', 'base-wash', 'brine-wash', 'swap']),
    );
    expect(cycleSteps).not.toContain('crude');
    // The loop is one problem, however many steps it stops.
    expect(new Set(error.details.map((d) => d.message)).size).toBe(1);
    expect(error.message).not.toMatch(/more\)/);
  });

  it('answers 422 naming the step and port of a required input left unconnected', async () => {
    const doc = demo();
    doc.connections = doc.connections.filter((c) => c.id !== 'c7');
    const response = await evaluate(doc);
    expect(response.status).toBe(422);
    const { error } = routeEvaluationErrorSchema.parse(response.body);
    expect(error.code).toBe('route_invalid');
    expect(error.details).toContainEqual(
      expect.objectContaining({ stepId: 'filter', field: 'inputs.slurry' }),
    );
    // The message names the step by its name and the input as its card shows it, no id.
    expect(error.message).toMatch(/Filter, wash with cold heptane/);
    expect(error.message).toMatch(/the slurry of the filtration/i);
    expect(error.message).not.toMatch(/"filter"|inputs\.slurry/);
  });

  it('answers 422 with the body path of an unknown component in a step', async () => {
    const doc = demo() as unknown as { steps: { params: { cakeWash: { solventId: string } } }[] };
    doc.steps[7].params.cakeWash.solventId = 'no-such-solvent';
    const response = await evaluate(doc);
    expect(response.status).toBe(422);
    expect(response.body.error.details).toContainEqual(
      expect.objectContaining({
        stepId: 'filter',
        field: 'params.cakeWash.solventId',
        path: 'document.steps.7.params.cakeWash.solventId',
      }),
    );
  });

  it('accepts a route document larger than the general 1 MB body limit', async () => {
    const body = JSON.stringify({ document: demo() });
    // JSON whitespace: the same document, 1.2 MB on the wire.
    const padded = `${body.slice(0, -1)}${' '.repeat(1_200_000)}}`;
    const response = await asReviewer.agent
      .post('/api/v1/evaluate')
      .set('X-CSRF-Token', asReviewer.csrfToken)
      .set('Content-Type', 'application/json')
      .send(padded);
    expect(response.status).toBe(200);
  });
});

describe('OpenAPI document', () => {
  it('lists the evaluation, job, route, draft and project operations', async () => {
    const response = await request(server.app).get('/api/v1/openapi.json');
    expect(response.status).toBe(200);
    const paths = response.body.paths as Record<string, Record<string, unknown>>;
    const operations = Object.entries(paths).flatMap(([path, ops]) =>
      Object.keys(ops).map((method) => `${method} ${path}`),
    );
    expect(operations).toEqual(
      expect.arrayContaining([
        'post /api/v1/evaluate',
        'post /api/v1/evaluate/monte-carlo',
        'get /api/v1/jobs/{jobId}',
        'get /api/v1/workspaces/{workspaceId}/routes',
        'post /api/v1/workspaces/{workspaceId}/routes',
        'get /api/v1/workspaces/{workspaceId}/routes/{routeId}',
        'patch /api/v1/workspaces/{workspaceId}/routes/{routeId}',
        'post /api/v1/workspaces/{workspaceId}/routes/{routeId}/duplicate',
        'put /api/v1/workspaces/{workspaceId}/routes/{routeId}/draft',
        'get /api/v1/workspaces/{workspaceId}/projects',
      ]),
    );
    expect(
      Object.keys((paths['/api/v1/evaluate'].post as { responses: object }).responses),
    ).toEqual(expect.arrayContaining(['200', '400', '401', '422']));
    expect(
      Object.keys(
        (
          paths['/api/v1/workspaces/{workspaceId}/routes/{routeId}/draft'].put as {
            responses: object;
          }
        ).responses,
      ),
    ).toContain('409');
  });
});
