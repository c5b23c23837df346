/**
 * Route optimisations run as background jobs, like Monte Carlo runs: the
 * request checks the size limits and the person's job cap, checks the
 * request against the document in the engine pool (400 naming each free
 * parameter at fault, 422 naming the step when the route cannot run), then
 * writes an evaluation_jobs row and a pg-boss job carrying only its id, in
 * one transaction. A worker runs the search a few evaluations at a time in
 * the engine pool, writing progress after each chunk and stopping when the
 * job is cancelled (on any server instance: the cancel is read from the
 * database). pg-boss hands each job to one worker, and the status update
 * that claims it only succeeds once.
 */
import { Op, type Transaction } from 'sequelize';
import type { OptimiseRequestBody } from '@shared/schemas/optimise';
import type { OptimiseResult } from '@shared/schemas/jobs';
import {
  defaultEvaluations,
  UNCERTAINTY_DRAWS,
  type OptimiseState,
} from '@shared/engine/optimise/optimise';
import { database } from '../db/sequelize';
import { tooManyJobs } from '../errors';
import { EvaluationJob } from '../models';
import { enginePool } from '../pool';
import type { TaskOutput } from '../pool/tasks';
import { checkStepDraws, inUserSlot, type EvaluationLimits } from './evaluation-limits';
import { enqueue, jobQueue, QUEUES } from './jobs';
import { recordStoppedRun, reportProgress } from './job-runs';

export const OPTIMISE_QUEUE = QUEUES.optimise;
/** Evaluations per chunk: bounded work between progress writes and cancellation checks. */
const CHUNK_EVALUATIONS = 4;
const OPEN_STATUSES = ['queued', 'running'];

/** Checks the request and queues the run. */
export async function startOptimisation(
  input: OptimiseRequestBody & { userId: string },
  limits: EvaluationLimits,
): Promise<EvaluationJob> {
  checkStepDraws(
    input.document.steps.length,
    (input.budget?.evaluations ?? defaultEvaluations(input.free.length)) + UNCERTAINTY_DRAWS,
    limits,
  );
  const { userId, ...request } = input;
  const open = await EvaluationJob.count({
    where: { userId, status: { [Op.in]: OPEN_STATUSES } },
  });
  if (open >= limits.perUserJobs) throw tooManyJobs(limits.perUserJobs);
  await inUserSlot(userId, limits, () => enginePool().run('optimise.check', { request }));
  return database().transaction(async (transaction: Transaction) => {
    const job = await EvaluationJob.create(
      { userId, kind: 'optimise', input: request },
      { transaction },
    );
    await enqueue(OPTIMISE_QUEUE, { jobId: job.id }, { retryLimit: 1 }, transaction);
    return job;
  });
}

/** Runs in progress on this server, so a cancel stops the chunk already in a worker. */
const runningHere = new Map<string, AbortController>();

/** Stops the chunk of a run that this server is working on (the cancel itself is in the database). */
export function abortOptimisationHere(jobId: string): void {
  runningHere.get(jobId)?.abort(new Error('cancelled'));
}

/**
 * Runs one queued optimisation to the end, writing progress as it goes.
 * Stops when the job is cancelled. Safe to call again for a finished job.
 */
export async function runOptimiseJob(jobId: string, stopping?: AbortSignal): Promise<void> {
  const job = await EvaluationJob.findByPk(jobId);
  if (!job || !OPEN_STATUSES.includes(job.status)) return;
  const request = job.input as OptimiseRequestBody;
  const [claimed] = await EvaluationJob.update(
    { status: 'running', progress: 0, startedAt: new Date() },
    { where: { id: jobId, status: { [Op.in]: OPEN_STATUSES } } },
  );
  if (claimed === 0) return;
  const controller = new AbortController();
  runningHere.set(jobId, controller);
  const signal = stopping ? AbortSignal.any([controller.signal, stopping]) : controller.signal;
  try {
    let state: OptimiseState | null = null;
    let reported = 0;
    for (;;) {
      const chunk: TaskOutput<'optimise.chunk'> = await enginePool().run(
        'optimise.chunk',
        { cacheKey: jobId, request, state, evaluations: CHUNK_EVALUATIONS },
        { signal },
      );
      state = chunk.state;
      if (chunk.result) {
        const result: OptimiseResult = chunk.result;
        await EvaluationJob.update(
          { status: 'done', progress: 1, result, finishedAt: new Date() },
          { where: { id: jobId, status: 'running' } },
        );
        return;
      }
      reported = await reportProgress(jobId, chunk.progress, reported);
    }
  } catch (error) {
    await recordStoppedRun(jobId, error, {
      aborted: controller.signal.aborted,
      stopping,
      label: 'optimise',
      serverErrorMessage: 'The optimisation stopped on a server error.',
    });
  } finally {
    runningHere.delete(jobId);
  }
}

/** Starts this process's optimisation worker; returns a function that stops it. */
export async function startOptimiseWorker(pollSeconds: number): Promise<() => Promise<void>> {
  const boss = jobQueue();
  const stopping = new AbortController();
  await boss.work<{ jobId: string }>(
    OPTIMISE_QUEUE,
    { pollingIntervalSeconds: pollSeconds, batchSize: 1 },
    async (jobs) => {
      for (const job of jobs) await runOptimiseJob(job.data.jobId, stopping.signal);
    },
  );
  return async () => {
    stopping.abort(new Error('server stopping'));
    await boss.offWork(OPTIMISE_QUEUE);
  };
}
