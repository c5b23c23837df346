/**
 * Monte Carlo runs as background jobs. The request checks the size limits
 * and the person's job cap, validates the document in the engine pool (a 422
 * names the step before anything is queued), then writes an evaluation_jobs
 * row and a pg-boss job carrying only its id, in one transaction. A worker
 * runs the draws in fixed blocks spread over the engine pool's workers
 * (monte-carlo-blocks.ts), writing progress as blocks finish and stopping
 * when the job is cancelled. Small runs are evaluated in
 * the request but answer through the same job row, so the client has one
 * interface.
 */
import { Op, type Transaction } from 'sequelize';
import type { RouteDocument } from '@shared/schemas/route';
import type { AnyJob, MonteCarloResult, OptimiseResult } from '@shared/schemas/jobs';
import type { MonteCarloResult as EngineMonteCarloResult } from '@shared/engine/route/monte-carlo';
import { database } from '../db/sequelize';
import { conflict, notFound, tooManyJobs } from '../errors';
import { EvaluationJob } from '../models';
import { enginePool } from '../pool';
import { ENGINE_VERSION, PROCESS_SAFETY_NOTE } from './evaluation';
import { checkStepDraws, inUserSlot, type EvaluationLimits } from './evaluation-limits';
import { enqueue, jobQueue, QUEUES } from './jobs';
import { JobCancelled, recordStoppedRun, reportProgress } from './job-runs';
import { runMonteCarloOnPool } from './monte-carlo-blocks';
import { abortOptimisationHere } from './optimise-jobs';

export const MONTE_CARLO_QUEUE = QUEUES.monteCarlo;
/** Runs of at most this many draws are evaluated in the request. */
export const INLINE_MAX_DRAWS = 20;

interface MonteCarloInput {
  document: RouteDocument;
  draws: number;
  seed: number;
}

/** The queue is created with the schema, by the owner (prepareJobQueue); nothing to do at run time. */
export function ensureMonteCarloQueue(): Promise<void> {
  return Promise.resolve();
}

const OPEN_STATUSES = ['queued', 'running'];

/** Validates the document and queues the run (or runs it now when small). */
export async function startMonteCarlo(
  input: MonteCarloInput & { userId: string },
  limits: EvaluationLimits,
): Promise<EvaluationJob> {
  checkStepDraws(input.document.steps.length, input.draws, limits);
  const { userId, ...stored } = input;
  const open = await EvaluationJob.count({
    where: { userId, status: { [Op.in]: OPEN_STATUSES } },
  });
  if (open >= limits.perUserJobs) throw tooManyJobs(limits.perUserJobs);

  if (input.draws <= INLINE_MAX_DRAWS) {
    const startedAt = new Date();
    const result = await inUserSlot(userId, limits, () =>
      enginePool().run('monteCarlo.run', stored),
    );
    return EvaluationJob.create({
      userId,
      kind: 'monte-carlo',
      input: stored,
      status: 'done',
      progress: 1,
      result: summary(result),
      startedAt,
      finishedAt: new Date(),
    });
  }
  await inUserSlot(userId, limits, () =>
    enginePool().run('route.check', { document: input.document }),
  );
  await ensureMonteCarloQueue();
  return database().transaction(async (transaction: Transaction) => {
    const job = await EvaluationJob.create(
      { userId, kind: 'monte-carlo', input: stored },
      { transaction },
    );
    await enqueue(MONTE_CARLO_QUEUE, { jobId: job.id }, { retryLimit: 1 }, transaction);
    return job;
  });
}

function summary(result: EngineMonteCarloResult): MonteCarloResult {
  return { ...result, engineVersion: ENGINE_VERSION, processSafetyNote: PROCESS_SAFETY_NOTE };
}

/** Runs in progress on this server, so a cancel stops the blocks already in the workers. */
const runningHere = new Map<string, AbortController>();

/**
 * Runs one queued job to the end, writing progress as it goes. Stops when the
 * job is cancelled (checked in the database as blocks finish, so a cancel on
 * any server instance counts). Safe to call again for a finished job.
 */
export async function runMonteCarloJob(jobId: string, stopping?: AbortSignal): Promise<void> {
  const job = await EvaluationJob.findByPk(jobId);
  if (!job || !OPEN_STATUSES.includes(job.status)) return;
  const input = job.input as MonteCarloInput;
  const claimed = await EvaluationJob.update(
    { status: 'running', progress: 0, startedAt: new Date() },
    { where: { id: jobId, status: { [Op.in]: OPEN_STATUSES } } },
  );
  if (claimed[0] === 0) return;
  const controller = new AbortController();
  runningHere.set(jobId, controller);
  const signal = stopping ? AbortSignal.any([controller.signal, stopping]) : controller.signal;
  try {
    let reported = 0;
    const result = await runMonteCarloOnPool(
      enginePool(),
      { cacheKey: jobId, document: input.document, draws: input.draws, seed: input.seed },
      {
        signal,
        onProgress: async (fraction) => {
          if (fraction < 1) reported = await reportProgress(jobId, fraction, reported);
        },
      },
    );
    await EvaluationJob.update(
      { status: 'done', progress: 1, result: summary(result), finishedAt: new Date() },
      { where: { id: jobId, status: 'running' } },
    );
  } catch (error) {
    await recordStoppedRun(jobId, error, {
      aborted: controller.signal.aborted,
      stopping,
      label: 'monte-carlo',
      serverErrorMessage: 'The run stopped on a server error.',
    });
  } finally {
    runningHere.delete(jobId);
  }
}

/** Starts this process's Monte Carlo worker; returns a function that stops it. */
export async function startMonteCarloWorker(pollSeconds: number): Promise<() => Promise<void>> {
  await ensureMonteCarloQueue();
  const boss = jobQueue();
  const stopping = new AbortController();
  await boss.work<{ jobId: string }>(
    MONTE_CARLO_QUEUE,
    { pollingIntervalSeconds: pollSeconds, batchSize: 1 },
    async (jobs) => {
      for (const job of jobs) await runMonteCarloJob(job.data.jobId, stopping.signal);
    },
  );
  return async () => {
    stopping.abort(new Error('server stopping'));
    await boss.offWork(MONTE_CARLO_QUEUE);
  };
}

/** Loads a job by id; the caller authorizes (only its starter sees it). */
export async function loadJob(
  jobId: string,
  transaction?: Transaction | null,
): Promise<EvaluationJob> {
  const job = await EvaluationJob.findByPk(jobId, { transaction });
  if (!job) throw notFound();
  return job;
}

/** Cancels a queued or running job; the run stops after its blocks in flight at the latest. */
export async function cancelJob(
  job: EvaluationJob,
  transaction: Transaction | null,
): Promise<EvaluationJob> {
  if (!OPEN_STATUSES.includes(job.status))
    throw conflict('job_finished', 'This run has already finished; there is nothing to cancel.');
  await job.update({ status: 'cancelled', finishedAt: new Date() }, { transaction });
  runningHere.get(job.id)?.abort(new JobCancelled());
  abortOptimisationHere(job.id);
  return job;
}

export function presentJob(job: EvaluationJob): AnyJob {
  const common = {
    id: job.id,
    status: job.status,
    progress: job.progress,
    ...(job.error ? { error: job.error } : {}),
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
  };
  if (job.kind === 'optimise')
    return {
      ...common,
      kind: 'optimise',
      ...(job.result ? { result: job.result as OptimiseResult } : {}),
    };
  return {
    ...common,
    kind: 'monte-carlo',
    ...(job.result ? { result: job.result as MonteCarloResult } : {}),
  };
}
