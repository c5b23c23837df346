import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { monteCarloStartedSchema } from '@shared/schemas/evaluate';
import { jobSchema, type Job } from '@shared/schemas/jobs';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { EvaluationJob } from '../../server/models';
import { database } from '../../server/db/sequelize';
import { INLINE_MAX_DRAWS, MONTE_CARLO_QUEUE } from '../../server/services/monte-carlo-jobs';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();
const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;

describe('Monte Carlo jobs', () => {
  let asChemist: SignedIn;
  let asOther: SignedIn;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
    // Same workspace, same role: a job is still private to whoever started it.
    asOther = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
  });

  const start = (who: SignedIn, body: object) =>
    who.agent.post('/api/v1/evaluate/monte-carlo').set('X-CSRF-Token', who.csrfToken).send(body);

  /** Polls until the job is finished; every status seen is kept so the test can check the sequence. */
  async function untilFinished(jobId: string): Promise<Job[]> {
    const seen: Job[] = [];
    for (let attempt = 0; attempt < 600; attempt++) {
      const response = await asChemist.agent.get(`/api/v1/jobs/${jobId}`);
      expect(response.status).toBe(200);
      const job = jobSchema.parse(response.body);
      seen.push(job);
      if (job.status === 'done' || job.status === 'failed') return seen;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    throw new Error(`job ${jobId} did not finish; last status ${seen.at(-1)?.status}`);
  }

  it('requires authentication', async () => {
    expect(
      (
        await request(server.app)
          .post('/api/v1/evaluate/monte-carlo')
          .send({ document: demo(), draws: 50, seed: 1 })
      ).status,
    ).toBe(401);
    expect(
      (await request(server.app).get('/api/v1/jobs/00000000-0000-4000-8000-000000000000')).status,
    ).toBe(401);
  });

  it('a background run reaches done with progress 1 and p5 ≤ p50 ≤ p95, progress never going back', async () => {
    const response = await start(asChemist, { document: demo(), draws: 60, seed: 417 });
    expect(response.status).toBe(202);
    const { jobId } = monteCarloStartedSchema.parse(response.body);
    expect(60).toBeGreaterThan(INLINE_MAX_DRAWS);

    const seen = await untilFinished(jobId);
    const last = seen.at(-1)!;
    expect(last.status).toBe('done');
    expect(last.kind).toBe('monte-carlo');
    expect(last.progress).toBe(1);
    const progress = seen.map((job) => job.progress);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));
    const result = last.result!;
    expect(result.draws).toBe(60);
    expect(result.failedDraws).toBe(0);
    for (const q of [result.yieldPct, result.purityWtPct]) {
      expect(q.p5).not.toBeNull();
      expect(q.p5!).toBeLessThanOrEqual(q.p50!);
      expect(q.p50!).toBeLessThanOrEqual(q.p95!);
    }
    expect(result.yieldPct.p95!).toBeLessThanOrEqual(100);
    // The demo route's ± ranges make the yield vary from draw to draw.
    expect(result.yieldPct.p95!).toBeGreaterThan(result.yieldPct.p5!);
    expect(Object.keys(result.purgeFactor).length).toBeGreaterThan(0);
    expect(result.processSafetyNote).toMatch(/process-safety review/);
    // It went through the queue: pg-boss holds a completed job carrying this id.
    const [queued] = (await database().query(
      `SELECT state FROM pgboss.job WHERE name = :name AND data->>'jobId' = :jobId
       UNION ALL SELECT state FROM pgboss.archive WHERE name = :name AND data->>'jobId' = :jobId`,
      { replacements: { name: MONTE_CARLO_QUEUE, jobId } },
    )) as [{ state: string }[], unknown];
    expect(queued.map((row) => row.state)).toEqual(['completed']);
  });

  it('is reproducible: the same seed gives the same percentiles, inline or in the background', async () => {
    const small = async () => {
      const response = await start(asChemist, {
        document: demo(),
        draws: INLINE_MAX_DRAWS,
        seed: 9,
      });
      expect(response.status).toBe(202);
      return (await untilFinished(response.body.jobId)).at(-1)!;
    };
    const [a, b] = [await small(), await small()];
    expect(a.status).toBe('done');
    // Small runs are evaluated in the request: done at the first look, never queued.
    expect(a.progress).toBe(1);
    expect(a.result!.yieldPct).toEqual(b.result!.yieldPct);
    expect(a.result!.purgeFactor).toEqual(b.result!.purgeFactor);
  });

  it('only the user who started a job sees it; others get 404 like for a missing job', async () => {
    const { jobId } = (await start(asChemist, { document: demo(), draws: 5, seed: 3 })).body;
    const foreign = await asOther.agent.get(`/api/v1/jobs/${jobId}`);
    const missing = await asOther.agent.get('/api/v1/jobs/00000000-0000-4000-8000-000000000000');
    expect(foreign.status).toBe(404);
    expect(foreign.body).toEqual(missing.body);
    expect((await asChemist.agent.get(`/api/v1/jobs/${jobId}`)).status).toBe(200);
  });

  it('checks the request: draws within 1..20000 (400 with the path), and an unevaluable route is refused before queuing (422)', async () => {
    const tooMany = await start(asChemist, { document: demo(), draws: 20_001, seed: 1 });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.details.map((d: { path: string }) => d.path)).toEqual(['draws']);
    const noSeed = await start(asChemist, { document: demo(), draws: 10 });
    expect(noSeed.body.error.details.map((d: { path: string }) => d.path)).toEqual(['seed']);

    const before = await EvaluationJob.count();
    const doc = demo();
    doc.connections = doc.connections.filter((c) => c.id !== 'c7');
    const unconnected = await start(asChemist, { document: doc, draws: 100, seed: 1 });
    expect(unconnected.status).toBe(422);
    expect(unconnected.body.error.details).toContainEqual(
      expect.objectContaining({ stepId: 'filter' }),
    );
    expect(await EvaluationJob.count()).toBe(before);
  });
});
