/**
 * Runs left "running" by a server that stopped or crashed: the next server to
 * start marks them failed in the chemist's words, which frees the person's
 * open-job limit; a run another instance is still writing progress for is
 * left alone. The server under test is a real process started on the test
 * database (as `npm start` does), after the abandoned rows are written.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { anyJobSchema } from '@shared/schemas/jobs';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { database } from '../../server/db/sequelize';
import { EvaluationJob } from '../../server/models';
import {
  failRunsWithoutQueueEntry,
  RUN_GAVE_UP_ERROR,
  SERVER_STOPPED_ERROR,
} from '../../server/services/job-runs';
import { jobQueue, QUEUES } from '../../server/services/jobs';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';
import { startServerProcess, type ServerProcess } from '../support/server-process';

// This file's own server never counts an hour-old run as abandoned, so only the
// server started below can recover them.
const server = useTestServer({ JOB_STALE_MINUTES: '1000' });

describe('runs abandoned by a stopped server', () => {
  let asChemist: SignedIn;
  let asColleague: SignedIn;
  let started: ServerProcess | null = null;

  beforeAll(async () => {
    const workspace = await buildWorkspace();
    asChemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
    asColleague = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
  });
  afterAll(async () => {
    await started?.stop();
  });

  const jobOf = async (who: SignedIn, jobId: string) => {
    const response = await who.agent.get(`/api/v1/jobs/${jobId}`);
    expect(response.status).toBe(200);
    return anyJobSchema.parse(response.body);
  };
  const startMonteCarlo = (who: SignedIn) =>
    who.agent
      .post('/api/v1/evaluate/monte-carlo')
      .set('X-CSRF-Token', who.csrfToken)
      .send({ document: structuredClone(demoRoute), draws: 60, seed: 5 });

  it('are failed with a message at the next start, freeing the limit; a live run elsewhere is kept', async () => {
    // Two runs (the default limit) whose server went away an hour ago, mid-run.
    const abandoned = await Promise.all(
      (['monte-carlo', 'optimise'] as const).map((kind) =>
        EvaluationJob.create({
          userId: asChemist.session.user.id,
          kind,
          input: {},
          status: 'running',
          progress: 0.4,
          startedAt: new Date(Date.now() - 65 * 60_000),
        }),
      ),
    );
    // A colleague's run that another instance wrote progress for a moment ago.
    const live = await EvaluationJob.create({
      userId: asColleague.session.user.id,
      kind: 'monte-carlo',
      input: {},
      status: 'running',
      progress: 0.2,
      startedAt: new Date(),
    });
    await database().query(
      `UPDATE evaluation_jobs SET updated_at = now() - interval '1 hour' WHERE id IN (:ids)`,
      { replacements: { ids: abandoned.map((job) => job.id) } },
    );

    // Before: the two dead runs hold the chemist's limit.
    const refused = await startMonteCarlo(asChemist);
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_jobs');

    started = await startServerProcess();

    for (const job of abandoned) {
      const seen = await jobOf(asChemist, job.id);
      expect(seen.status).toBe('failed');
      expect(seen.error).toEqual(SERVER_STOPPED_ERROR);
      expect(seen.error!.message).toBe('The server stopped during this run; start it again.');
    }
    expect((await jobOf(asColleague, live.id)).status).toBe('running');

    // After: the limit is free again.
    const accepted = await startMonteCarlo(asChemist);
    expect(accepted.status).toBe(202);

    // Tidy: neither run should be left for other files' servers to find.
    for (const jobId of [accepted.body.jobId as string, live.id])
      await EvaluationJob.update({ status: 'cancelled' }, { where: { id: jobId } });
  }, 120_000);

  it("a queued run whose queue entry ran out of retries ends failed in the chemist's words; one still queued is kept", async () => {
    const queuedRun = () =>
      EvaluationJob.create({
        userId: asChemist.session.user.id,
        kind: 'monte-carlo',
        input: {},
        status: 'queued',
        progress: 0,
      });
    const [givenUp, waiting] = [await queuedRun(), await queuedRun()];
    // Queue entries due in an hour, so no worker takes them; the first is failed on its
    // last attempt, as pg-boss does when the server stopped under the run once too often.
    const boss = jobQueue();
    const later = new Date(Date.now() + 3_600_000);
    const givenUpEntry = await boss.send(
      QUEUES.monteCarlo,
      { jobId: givenUp.id },
      { retryLimit: 0, startAfter: later },
    );
    await boss.send(QUEUES.monteCarlo, { jobId: waiting.id }, { retryLimit: 0, startAfter: later });
    await boss.fail(QUEUES.monteCarlo, givenUpEntry!, new Error('server stopping'));
    expect((await boss.getJobById(QUEUES.monteCarlo, givenUpEntry!))?.state).toBe('failed');
    await database().query(
      `UPDATE evaluation_jobs SET updated_at = now() - interval '1 hour' WHERE id IN (:ids)`,
      { replacements: { ids: [givenUp.id, waiting.id] } },
    );

    // (The server process the first test started sweeps too; either sweep may get there first.)
    await failRunsWithoutQueueEntry(600);

    const seen = await jobOf(asChemist, givenUp.id);
    expect(seen.status).toBe('failed');
    expect(seen.error).toEqual(RUN_GAVE_UP_ERROR);
    expect(seen.error!.message).toBe(
      'This run could not be finished: the server stopped or failed each time it was tried. Start it again.',
    );
    expect((await jobOf(asChemist, waiting.id)).status).toBe('queued');
    // A second sweep changes nothing.
    expect(await failRunsWithoutQueueEntry(600)).toBe(0);

    await EvaluationJob.update({ status: 'cancelled' }, { where: { id: waiting.id } });
  }, 60_000);
});
