/**
 * The engine runs in a pool of worker threads, never on the web thread. Each
 * request is held to a size limit (steps, steps × draws, reply size) and a
 * per-person cap. Monte Carlo runs can be cancelled. Someone removed from
 * every workspace can no longer evaluate.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { jobSchema } from '@shared/schemas/jobs';
import { saveDraftResponseSchema } from '@shared/schemas/routes';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { generateRoute } from '../fixtures/routes/generate';
import { Membership, type Workspace } from '../../server/models';
import { calculationsRunning } from '../../server/services/evaluation-limits';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer({
  ENGINE_WORKERS: '1',
  // Generous: the time limit has its own file (engine-time-limit.test.ts) with a short one, so a
  // loaded test machine cannot turn these size and cap checks into time-outs.
  ENGINE_TASK_SECONDS: '15',
  EVALUATE_MAX_STEPS: '120',
  EVALUATE_MAX_REPLY_MB: '0.5',
  MONTE_CARLO_MAX_STEP_DRAWS: '5000',
  CALCULATIONS_PER_USER: '1',
  MONTE_CARLO_JOBS_PER_USER: '1',
});

const demo = (): RouteDocumentInput => structuredClone(demoRoute) as RouteDocumentInput;
/** About half a second per evaluation: 20 draws keep a worker busy for longer than the time limit. */
const heavy = generateRoute({ seed: 11, steps: 100, compounds: 3 });

const post = (who: SignedIn, path: string, body: unknown) =>
  who.agent
    .post(`/api/v1${path}`)
    .set('X-CSRF-Token', who.csrfToken)
    .send(body as object);

/**
 * Waits until the person's calculation holds its slot and every worker is busy. Waiting for a
 * busy pool alone is not enough: a task left from an earlier request can fill the worker before
 * the person's request has taken its slot, and the next request then takes it instead.
 */
async function untilRunning(who: SignedIn): Promise<void> {
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    const { busy, size } = server.runtime.pool.stats();
    if (calculationsRunning(who.session.user.id) > 0 && busy >= size) return;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  throw new Error('the calculation never started');
}

describe('the engine pool', () => {
  let workspace: Workspace;
  let asChemist: SignedIn;
  let asColleague: SignedIn;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
    asColleague = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
  });

  it('refuses a route with more steps than one evaluation may have (413), and saves such a draft without totals', async () => {
    const big = generateRoute({ seed: 3, steps: 130, compounds: 2 });
    const evaluated = await post(asChemist, '/evaluate', { document: big });
    expect(evaluated.status).toBe(413);
    expect(evaluated.body.error.code).toBe('route_too_large');
    expect(evaluated.body.error.message).toMatch(/130 steps.*at most 120/);

    const created = await post(asChemist, `/workspaces/${workspace.id}/routes`, {
      name: 'Large route (invented)',
    });
    const saved = await asChemist.agent
      .put(`/api/v1/workspaces/${workspace.id}/routes/${created.body.id}/draft`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ document: big, baseVersion: 1 });
    expect(saved.status).toBe(200);
    const body = saveDraftResponseSchema.parse(saved.body);
    expect(body.totals).toBeNull();
    expect(body.evaluationError?.code).toBe('route_too_large');
  });

  it('refuses a Monte Carlo run of more steps × draws than allowed (413)', async () => {
    const response = await post(asChemist, '/evaluate/monte-carlo', {
      document: heavy,
      draws: 60,
      seed: 1,
    });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('route_too_large');
  });

  it('refuses a reply larger than the limit (422 result_too_large) rather than sending it', async () => {
    const wide = generateRoute({ seed: 5, steps: 40, compounds: 40 });
    const response = await post(asChemist, '/evaluate', { document: wide });
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('result_too_large');
    expect(response.body.error.message).toMatch(/more than the 0.5 MB/);
  });

  it('caps the calculations one person may run at once (429), not other people', async () => {
    // then() sends the request now; supertest sends nothing until asked for the reply.
    const first = post(asChemist, '/evaluate/monte-carlo', {
      document: heavy,
      draws: 20,
      seed: 2,
    }).then((response) => response);
    await untilRunning(asChemist);
    const second = await post(asChemist, '/evaluate', { document: demo() });
    expect(second.status).toBe(429);
    expect(second.body.error.code).toBe('too_many_evaluations');
    expect(second.headers['retry-after']).toBeDefined();
    const colleague = await post(asColleague, '/evaluate', { document: demo() });
    expect(colleague.status).not.toBe(429);
    await first;
  });

  it('cancels a background Monte Carlo run, and caps the runs one person may have open', async () => {
    const started = await post(asChemist, '/evaluate/monte-carlo', {
      document: demo(),
      draws: 300,
      seed: 9,
    });
    expect(started.status).toBe(202);
    const { jobId } = started.body as { jobId: string };

    const another = await post(asChemist, '/evaluate/monte-carlo', {
      document: demo(),
      draws: 200,
      seed: 9,
    });
    expect(another.status).toBe(429);
    expect(another.body.error.code).toBe('too_many_jobs');

    const notYours = await post(asColleague, `/jobs/${jobId}/cancel`, {});
    expect(notYours.status).toBe(404);

    const cancelled = await post(asChemist, `/jobs/${jobId}/cancel`, {});
    expect(cancelled.status).toBe(200);
    expect(jobSchema.parse(cancelled.body).status).toBe('cancelled');

    // It stays cancelled: the runner stops instead of finishing it.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    const polled = jobSchema.parse((await asChemist.agent.get(`/api/v1/jobs/${jobId}`)).body);
    expect(polled.status).toBe('cancelled');
    expect(polled.result).toBeUndefined();

    const again = await post(asChemist, `/jobs/${jobId}/cancel`, {});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('job_finished');

    // With the run cancelled, the person may start another.
    const next = await post(asChemist, '/evaluate/monte-carlo', {
      document: demo(),
      draws: 10,
      seed: 9,
    });
    expect(next.status).toBe(202);
  });

  it('a member removed from every workspace can no longer evaluate', async () => {
    const leaver = await buildMember(workspace, ['chemist']);
    const asLeaver = await signIn(server.app, leaver.email);
    expect((await post(asLeaver, '/evaluate', { document: demo() })).status).toBe(200);
    await Membership.destroy({ where: { userId: leaver.id } });
    const evaluated = await post(asLeaver, '/evaluate', { document: demo() });
    expect(evaluated.status).toBe(403);
    const mc = await post(asLeaver, '/evaluate/monte-carlo', {
      document: demo(),
      draws: 5,
      seed: 1,
    });
    expect(mc.status).toBe(403);
    const calc = await post(asLeaver, '/calc/vapour-pressure', {
      component: { smiles: 'CCO' },
      temperatureC: 25,
    });
    expect(calc.status).toBe(403);
  });
});
