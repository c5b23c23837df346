import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { optimiseStartedSchema } from '@shared/schemas/optimise';
import { optimiseJobSchema, type OptimiseJob } from '@shared/schemas/jobs';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

describe('route optimisation jobs', () => {
  let asChemist: SignedIn;
  let asOther: SignedIn;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
    // Another workspace: a job is private to whoever started it.
    asOther = await signIn(
      server.app,
      (await buildMember(await buildWorkspace(), ['chemist'])).email,
    );
  });

  const start = (who: SignedIn, body: object) =>
    who.agent.post('/api/v1/optimise').set('X-CSRF-Token', who.csrfToken).send(body);

  async function untilFinished(jobId: string): Promise<OptimiseJob[]> {
    const seen: OptimiseJob[] = [];
    for (let attempt = 0; attempt < 1200; attempt++) {
      const response = await asChemist.agent.get(`/api/v1/jobs/${jobId}`);
      expect(response.status).toBe(200);
      const job = optimiseJobSchema.parse(response.body);
      seen.push(job);
      if (['done', 'failed', 'cancelled'].includes(job.status)) return seen;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    throw new Error(`job ${jobId} did not finish; last status ${seen.at(-1)?.status}`);
  }

  const body = (over: object = {}) => ({
    document: demo(),
    free: [
      { stepId: 'cool', param: 'mode.endC', min: -5, max: 30 },
      { stepId: 'swap', param: 'mode.cycles', min: 2, max: 5 },
    ],
    objective: 'pmi',
    constraints: { minSolventFreePurityPct: 99.5, ichResidualSolvents: true },
    seed: 17,
    budget: { evaluations: 10 },
    ...over,
  });

  it('requires authentication', async () => {
    expect((await request(server.app).post('/api/v1/optimise').send(body())).status).toBe(401);
    expect(
      (await request(server.app).delete('/api/v1/jobs/00000000-0000-4000-8000-000000000000'))
        .status,
    ).toBe(401);
  });

  it('runs to done with progress, the best candidate, the candidates and the spread', async () => {
    const response = await start(asChemist, body());
    expect(response.status).toBe(202);
    const { jobId } = optimiseStartedSchema.parse(response.body);
    const seen = await untilFinished(jobId);
    const last = seen.at(-1)!;
    expect(last.status).toBe('done');
    expect(last.kind).toBe('optimise');
    const progress = seen.map((job) => job.progress);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));
    const result = last.result!;
    expect(result.feasible).toBe(true);
    expect(Object.keys(result.best.params).sort()).toEqual(['cool.mode.endC', 'swap.mode.cycles']);
    expect(Number.isInteger(result.best.params['swap.mode.cycles'])).toBe(true);
    expect(result.best.totals.solventFreePurityPct!).toBeGreaterThanOrEqual(99.5);
    expect(result.candidates.length).toBeGreaterThan(1);
    expect(result.current?.params['swap.mode.cycles']).toBe(4);
    expect(result.best.uncertainty.draws).toBeGreaterThan(0);
    expect(result.processSafetyNote).toMatch(/process-safety/);
    expect(result.message).toMatch(/confirm it at the bench/);
    // The same seed gives the same answer.
    const again = await untilFinished(
      optimiseStartedSchema.parse((await start(asChemist, body())).body).jobId,
    );
    expect(again.at(-1)!.result!.best.params).toEqual(result.best.params);
    // Someone else cannot see the job.
    expect((await asOther.agent.get(`/api/v1/jobs/${jobId}`)).status).toBe(404);
  });

  it('refuses bad requests in the chemist’s words, naming each field', async () => {
    const response = await start(
      asChemist,
      body({
        free: [
          { stepId: 'cool', param: 'mode.endC', min: 30, max: -5 },
          { stepId: 'nowhere', param: 'stages', min: 1, max: 3 },
        ],
        constraints: { maxImpurityPct: { ghost: 0.1 } },
      }),
    );
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toEqual([
      {
        path: 'free.0.max',
        message: expect.stringMatching(/upper bound of the end temperature of step/),
      },
      { path: 'free.1.stepId', message: 'The route has no step “nowhere”.' },
      {
        path: 'constraints.maxImpurityPct.ghost',
        message: 'The route has no component “ghost” to limit.',
      },
    ]);
    const shape = await start(asChemist, body({ free: [], objective: 'cheapest', seed: 1.5 }));
    expect(shape.status).toBe(400);
    const messages = Object.fromEntries(
      shape.body.error.details.map((d: { path: string; message: string }) => [d.path, d.message]),
    );
    expect(messages.free).toBe('Free at least one parameter for the optimiser to vary.');
    expect(messages.objective).toBe('Choose what to minimise: pmi, solventLPerKg or cycleTimeH.');
    expect(messages.seed).toBe('Give a whole-number seed, so the run can be repeated.');
  });

  it('keeps a long run going when each chunk moves it by less than 1 %', async () => {
    // 2000 evaluations: a chunk of 4 is 0.18 % of the run, so most chunks write no new progress;
    // the run must still go on (it once stopped silently at 0 %, left "running").
    const { jobId } = optimiseStartedSchema.parse(
      (await start(asChemist, body({ budget: { evaluations: 2000 } }))).body,
    );
    let job: OptimiseJob | null = null;
    for (let attempt = 0; attempt < 120; attempt++) {
      job = optimiseJobSchema.parse((await asChemist.agent.get(`/api/v1/jobs/${jobId}`)).body);
      if (job.progress >= 0.02 || (job.status !== 'running' && job.status !== 'queued')) break;
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
    expect(job?.status).toBe('running');
    expect(job!.progress).toBeGreaterThanOrEqual(0.02);
    const cancelled = await asChemist.agent
      .delete(`/api/v1/jobs/${jobId}`)
      .set('X-CSRF-Token', asChemist.csrfToken);
    expect(optimiseJobSchema.parse(cancelled.body).status).toBe('cancelled');
  });

  it('cancels with DELETE; a finished job cannot be cancelled; another person’s job is 404', async () => {
    const { jobId } = optimiseStartedSchema.parse(
      (await start(asChemist, body({ budget: { evaluations: 400 } }))).body,
    );
    expect(
      (await asOther.agent.delete(`/api/v1/jobs/${jobId}`).set('X-CSRF-Token', asOther.csrfToken))
        .status,
    ).toBe(404);
    const cancelled = await asChemist.agent
      .delete(`/api/v1/jobs/${jobId}`)
      .set('X-CSRF-Token', asChemist.csrfToken);
    expect(cancelled.status).toBe(200);
    expect(optimiseJobSchema.parse(cancelled.body).status).toBe('cancelled');
    const again = await asChemist.agent
      .delete(`/api/v1/jobs/${jobId}`)
      .set('X-CSRF-Token', asChemist.csrfToken);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('job_finished');
  });
});
