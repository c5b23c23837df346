/**
 * What every background calculation run (Monte Carlo, optimisation) does the
 * same way: progress written about every 1 % in the statement that also finds
 * out whether the job was cancelled, and how a run that stops is recorded.
 */
import { Op, QueryTypes } from 'sequelize';
import { database } from '../db/sequelize';
import { AppError } from '../errors';
import { EvaluationJob } from '../models';
import { QUEUES } from './jobs';

export class JobCancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'JobCancelled';
  }
}

/**
 * Writes the run's progress when it moved by 1 % or more since `reported`
 * (else writes the progress already reported, which touches the job), and
 * throws JobCancelled when the job is no longer running. Returns the progress
 * now reported.
 *
 * Every call writes a column of the job: an update of the timestamp alone is
 * skipped by the model layer and reports no row, which read as a cancel and
 * left a long run (under 1 % per chunk) "running" at 0 % for good.
 */
export async function reportProgress(
  jobId: string,
  progress: number,
  reported: number,
): Promise<number> {
  const now = progress - reported >= 0.01 ? progress : reported;
  const [still] = await EvaluationJob.update(
    { progress: now },
    { where: { id: jobId, status: 'running' } },
  );
  if (still === 0) throw new JobCancelled();
  return now;
}

/**
 * Records a run that stopped on `error`: nothing for a cancel; back to the
 * queue (and the error rethrown) when the server is shutting down, so another
 * run picks it up; otherwise failed, with the coded error or `serverErrorMessage`.
 */
export async function recordStoppedRun(
  jobId: string,
  error: unknown,
  options: { aborted: boolean; stopping?: AbortSignal; label: string; serverErrorMessage: string },
): Promise<void> {
  if (error instanceof JobCancelled || options.aborted) return;
  if (options.stopping?.aborted) {
    await EvaluationJob.update(
      { status: 'queued', progress: 0 },
      { where: { id: jobId, status: 'running' } },
    );
    throw error;
  }
  const known = error instanceof AppError;
  await EvaluationJob.update(
    {
      status: 'failed',
      error: known
        ? { code: error.code, message: error.message }
        : { code: 'internal_error', message: options.serverErrorMessage },
      finishedAt: new Date(),
    },
    { where: { id: jobId, status: 'running' } },
  );
  if (!known) console.error(`[${options.label}]`, error);
}

/** What the chemist reads on a run whose server stopped or crashed under it. */
export const SERVER_STOPPED_ERROR = {
  code: 'server_stopped',
  message: 'The server stopped during this run; start it again.',
} as const;

/**
 * Marks failed every run still "running" whose progress was last written more
 * than `staleSeconds` ago: its server stopped or crashed under it (a live run
 * touches its row after every engine chunk, and a chunk ends within the
 * engine's time limit). Returns how many were marked.
 *
 * Failed, not queued again, because that is what is safe with several
 * instances on one database: another instance may be running the job
 * (this instance cannot tell a dead run from a live one elsewhere except by
 * its silence), and pg-boss may still hold the original queue entry and
 * retry it, so queueing it again could run it twice at once; and a run that
 * brought its server down (memory) would bring the next one down too. One
 * conditional UPDATE: any number of instances may sweep together, each row
 * changes once. Should the run be alive after all, its next progress write
 * finds it no longer running and it stops without writing (JobCancelled), and
 * a later retry of its queue entry finds it finished and does nothing.
 *
 * The cut-off is this instance's clock, like the timestamps the runs write;
 * clocks of instances differ by seconds, the staleness is minutes.
 */
export async function failAbandonedRuns(staleSeconds: number): Promise<number> {
  const [count] = await EvaluationJob.update(
    { status: 'failed', error: { ...SERVER_STOPPED_ERROR }, finishedAt: new Date() },
    {
      where: {
        status: 'running',
        updatedAt: { [Op.lt]: new Date(Date.now() - staleSeconds * 1000) },
      },
    },
  );
  return count;
}

/** What the chemist reads on a run the queue gave up on before it could finish. */
export const RUN_GAVE_UP_ERROR = {
  code: 'run_gave_up',
  message:
    'This run could not be finished: the server stopped or failed each time it was tried. Start it again.',
} as const;

/**
 * Marks failed every run still "queued" that no queue entry will start any more:
 * its pg-boss entry ran out of retries (the server stopped under it twice, or
 * it failed on every attempt), expired, or was deleted. Without this the run
 * stays "queued" for good and holds one of its owner's open jobs.
 *
 * A run's row and its queue entry are written in one transaction
 * (startMonteCarlo, startOptimise), and a run handed back on shutdown is set
 * "queued" before its entry is failed for a retry, so a live entry exists
 * whenever the run can still start. Only runs unchanged for `staleSeconds`
 * are looked at, so rows written by hand moments ago are left alone. One
 * conditional UPDATE, safe with several instances sweeping together.
 */
export async function failRunsWithoutQueueEntry(staleSeconds: number): Promise<number> {
  const [, count] = await database().query(
    `UPDATE evaluation_jobs e
        SET status = 'failed', error = CAST(:error AS jsonb), finished_at = now(), updated_at = now()
      WHERE e.status = 'queued'
        AND e.updated_at < now() - make_interval(secs => :staleSeconds)
        AND NOT EXISTS (
          SELECT 1 FROM pgboss.job j
           WHERE j.name IN (:queues)
             AND j.state IN ('created', 'retry', 'active')
             AND j.data ->> 'jobId' = e.id::text)`,
    {
      replacements: {
        error: JSON.stringify(RUN_GAVE_UP_ERROR),
        staleSeconds,
        queues: [QUEUES.monteCarlo, QUEUES.optimise],
      },
      type: QueryTypes.UPDATE,
    },
  );
  return count;
}
