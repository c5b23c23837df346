/**
 * Monte Carlo runs as background jobs. The request validates the document
 * (a 422 names the step before anything is queued), writes an evaluation_jobs
 * row and a pg-boss job carrying only its id, in one transaction. A worker
 * runs the draws in small chunks, writing progress after each, and stores the
 * p5/p50/p95 summary. Small runs are evaluated inline but answer through the
 * same job row, so the client has one interface.
 */
import { setImmediate as nextTurn } from 'node:timers/promises';
import type { Transaction } from 'sequelize';
import type { RouteDocument } from '@shared/schemas/route';
import type { Job, MonteCarloResult } from '@shared/schemas/jobs';
import { parseRoute, prepareRoute, type PreparedRoute } from '@shared/engine/route/evaluate';
import {
  runMonteCarloChunk,
  startMonteCarlo as startRun,
  summariseMonteCarlo,
} from '@shared/engine/route/monte-carlo';
import { notFound } from '../errors';
import { EvaluationJob } from '../models';
import {
  describeFailure,
  ENGINE_VERSION,
  PROCESS_SAFETY_NOTE,
  RouteEvaluationFailed,
} from './evaluation';
import { enqueue, jobQueue, QUEUES } from './jobs';

export const MONTE_CARLO_QUEUE = QUEUES.monteCarlo;
/** Runs of at most this many draws are evaluated in the request. */
export const INLINE_MAX_DRAWS = 20;
/** Draws per chunk: a few tens of milliseconds of work between progress writes. */
const CHUNK_DRAWS = 10;

interface MonteCarloInput {
  document: RouteDocument;
  draws: number;
  seed: number;
}

/** The queue is created with the schema, by the owner (prepareJobQueue); nothing to do at run time. */
export function ensureMonteCarloQueue(): Promise<void> {
  return Promise.resolve();
}

function prepare(document: RouteDocument): PreparedRoute {
  try {
    return prepareRoute(parseRoute(document));
  } catch (error) {
    const failure = describeFailure(error, document);
    if (failure) throw new RouteEvaluationFailed(failure);
    throw error;
  }
}

/** Validates the document and queues the run (or runs it now when small). */
export async function startMonteCarlo(
  input: MonteCarloInput & { userId: string },
  transaction: Transaction | null,
): Promise<EvaluationJob> {
  const prepared = prepare(input.document);
  const { userId, ...stored } = input;
  const job = await EvaluationJob.create(
    { userId, kind: 'monte-carlo', input: stored },
    { transaction },
  );
  if (input.draws <= INLINE_MAX_DRAWS) {
    const state = runMonteCarloChunk(
      prepared,
      startRun({ draws: input.draws, seed: input.seed }),
      input.draws,
    );
    await job.update(
      {
        status: 'done',
        progress: 1,
        result: summary(state),
        startedAt: new Date(),
        finishedAt: new Date(),
      },
      { transaction },
    );
    return job;
  }
  await ensureMonteCarloQueue();
  await enqueue(MONTE_CARLO_QUEUE, { jobId: job.id }, { retryLimit: 1 }, transaction);
  return job;
}

function summary(state: ReturnType<typeof startRun>): MonteCarloResult {
  return {
    ...summariseMonteCarlo(state),
    engineVersion: ENGINE_VERSION,
    processSafetyNote: PROCESS_SAFETY_NOTE,
  };
}

/** Runs one queued job to the end, writing progress as it goes. Safe to call again for a finished job. */
export async function runMonteCarloJob(jobId: string): Promise<void> {
  const job = await EvaluationJob.findByPk(jobId);
  if (!job || job.status === 'done' || job.status === 'failed') return;
  const input = job.input as MonteCarloInput;
  await job.update({ status: 'running', progress: 0, startedAt: new Date() });
  try {
    const prepared = prepareRoute(parseRoute(input.document));
    let state = startRun({ draws: input.draws, seed: input.seed });
    let reported = 0;
    while (state.done < state.draws) {
      state = runMonteCarloChunk(prepared, state, CHUNK_DRAWS);
      const progress = state.done / state.draws;
      // Write progress about every 1 %, and let other requests run between chunks.
      if (progress - reported >= 0.01 && state.done < state.draws) {
        reported = progress;
        await job.update({ progress });
      }
      await nextTurn();
    }
    await job.update({
      status: 'done',
      progress: 1,
      result: summary(state),
      finishedAt: new Date(),
    });
  } catch (error) {
    const failure = describeFailure(error, input.document);
    await job.update({
      status: 'failed',
      error: failure
        ? { code: failure.code, message: failure.message }
        : { code: 'internal_error', message: 'The run stopped on a server error.' },
      finishedAt: new Date(),
    });
    if (!failure) console.error('[monte-carlo]', error);
  }
}

/** Starts this process's Monte Carlo worker; returns a function that stops it. */
export async function startMonteCarloWorker(pollSeconds: number): Promise<() => Promise<void>> {
  await ensureMonteCarloQueue();
  const boss = jobQueue();
  await boss.work<{ jobId: string }>(
    MONTE_CARLO_QUEUE,
    { pollingIntervalSeconds: pollSeconds, batchSize: 1 },
    async (jobs) => {
      for (const job of jobs) await runMonteCarloJob(job.data.jobId);
    },
  );
  return async () => {
    await boss.offWork(MONTE_CARLO_QUEUE);
  };
}

/** Loads a job by id; the caller authorizes (only its starter sees it). */
export async function loadJob(jobId: string): Promise<EvaluationJob> {
  const job = await EvaluationJob.findByPk(jobId);
  if (!job) throw notFound();
  return job;
}

export function presentJob(job: EvaluationJob): Job {
  return {
    id: job.id,
    kind: job.kind,
    status: job.status,
    progress: job.progress,
    ...(job.result ? { result: job.result as MonteCarloResult } : {}),
    ...(job.error ? { error: job.error } : {}),
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
  };
}
