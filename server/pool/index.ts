/**
 * The engine pool: worker threads that run the engine (route evaluation,
 * Monte Carlo draws, calculations) so the web thread only answers requests.
 * A well-known pool (piscina) sized to the machine's cores, with a bounded
 * queue, a time limit per task and a memory limit per worker.
 *
 * Use: `await enginePool().run('route.evaluate', input, { signal })`. The
 * task names and their input and output types come from ./tasks.ts; an
 * AppError thrown in a task arrives here as the same AppError.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { AppError, evaluationTimedOut, serverBusy } from '../errors';
import type { TaskInput, TaskName, TaskOutput, TaskReply } from './tasks';

export interface EnginePoolOptions {
  /** Worker threads; default the number of cores. */
  size: number;
  /** Tasks that may wait for a worker; beyond it, 503 server_busy. */
  maxQueue: number;
  /** Default time limit of one task. */
  taskTimeoutMs: number;
  /** Heap limit of each worker, MB: a runaway task ends its worker, not the server. */
  workerMemoryMb: number;
  /**
   * After this long with no task, the workers are stopped (each holds its own engine, data and
   * step memo), so an idle server goes back to its footprint before the first task; the next task
   * starts them again. 0 or unset keeps them for the life of the pool (the server sets it from
   * ENGINE_IDLE_SECONDS).
   */
  idleMs?: number;
}

export const defaultPoolSize = () => Math.max(1, availableParallelism());

export interface RunOptions {
  /** Aborts the task (a running task's worker is stopped and replaced). */
  signal?: AbortSignal;
  /** Overrides the default time limit. */
  timeoutMs?: number;
}

export interface EnginePool {
  run<K extends TaskName>(
    name: K,
    input: TaskInput<K>,
    options?: RunOptions,
  ): Promise<TaskOutput<K>>;
  /**
   * Workers, how many are busy, tasks waiting, whether the workers are running (started on first
   * use, stopped again after `idleMs` without a task), and how many times they have been retired.
   */
  stats(): {
    size: number;
    busy: number;
    queued: number;
    started: boolean;
    retirements: number;
    /** Retired workers still being stopped (the collection after it included). */
    retiring: number;
  };
  close(): Promise<void>;
}

/**
 * Once the workers have stopped, one full garbage collection of this thread, when the process
 * allows it (`node --expose-gc`, as the start command runs the server). What the workers sent here
 * (request documents, reply bytes) was allocated in their threads' memory; that memory goes back
 * to the system only once this thread has freed its last piece of it, and an idle thread may not
 * collect for a long time (nothing allocates): without this an idle server kept 60–70 MB it no
 * longer used (docs/deployment.md). The pause (tens of milliseconds) comes once per retirement,
 * on a server that has had no calculation for ENGINE_IDLE_SECONDS.
 */
function collectAfterRetirement(): void {
  const gc = (globalThis as { gc?: () => void }).gc;
  if (typeof gc === 'function') gc();
}

/** The reason a task was stopped because it ran out of time. */
class TaskTimeout extends Error {
  constructor(readonly ms: number) {
    super(`task took longer than ${ms} ms`);
    this.name = 'TaskTimeout';
  }
}

/**
 * The worker's entry: beside the compiled server (dist-server/pool-worker.js), or, when the
 * server runs from its TypeScript (development, tests), worker.mjs, which loads tsx itself.
 */
function workerFile(): string {
  const compiled = !import.meta.url.endsWith('.ts');
  return new URL(compiled ? './pool-worker.js' : './worker.mjs', import.meta.url).href;
}

/**
 * The pool starts its workers on first use, not at boot: a server that has not yet been asked
 * for engine work holds no engine in memory (each worker loads the whole engine), and the health
 * check never waits for one. The first task waits until every worker has loaded, and its time
 * limit starts only then, so loading is never counted as the task's own time.
 */
export function createEnginePool(options: EnginePoolOptions): EnginePool {
  let piscina: Piscina | null = null;
  let started: Promise<Piscina> | null = null;
  let busy = 0;
  /** Tasks between entering run() and leaving it (waiting for start-up included). */
  let active = 0;
  let idleTimer: NodeJS.Timeout | null = null;
  /** Workers being stopped for idleness: close() waits for them too. */
  let retiring: Promise<void> = Promise.resolve();
  let retirements = 0;
  let stopping = 0;
  let closed = false;

  /**
   * Once no task is left, stops the workers after `idleMs`. A task arriving meanwhile cancels
   * the timer; one arriving while the old workers are being stopped starts fresh ones, so it
   * never waits for the old ones to go.
   */
  function retireWhenIdle(): void {
    const idleMs = options.idleMs ?? 0;
    if (idleMs <= 0 || active > 0 || !started || closed) return;
    idleTimer = setTimeout(() => {
      idleTimer = null;
      if (active > 0 || !started || closed) return;
      const old = started;
      started = null;
      piscina = null;
      retirements++;
      stopping++;
      retiring = Promise.all([
        retiring,
        old
          .then((pool) => pool.destroy())
          .catch(() => undefined)
          .then(collectAfterRetirement)
          .finally(() => stopping--),
      ]).then(() => undefined);
    }, idleMs);
    // An idle timer never keeps the process alive.
    idleTimer.unref();
  }

  function start(): Promise<Piscina> {
    started ??= (async () => {
      const pool = new Piscina({
        filename: workerFile(),
        minThreads: options.size,
        maxThreads: options.size,
        maxQueue: options.maxQueue,
        // One task at a time per worker: engine work is synchronous.
        concurrentTasksPerWorker: 1,
        idleTimeout: 60_000,
        // The worker loads its own TypeScript loader; the web thread's flags are not for it.
        execArgv: [],
        resourceLimits: { maxOldGenerationSizeMb: options.workerMemoryMb },
      });
      piscina = pool;
      try {
        await Promise.all(
          Array.from({ length: options.size }, () => pool.run({ name: 'pool.ready', input: null })),
        );
      } catch (error) {
        // A worker that cannot load: the next task tries a fresh start.
        started = null;
        piscina = null;
        await pool.destroy().catch(() => undefined);
        throw error;
      }
      return pool;
    })();
    return started;
  }

  async function run<K extends TaskName>(
    name: K,
    input: TaskInput<K>,
    runOptions: RunOptions = {},
  ): Promise<TaskOutput<K>> {
    active++;
    if (idleTimer) clearTimeout(idleTimer);
    idleTimer = null;
    try {
      return await runStarted(name, input, runOptions);
    } finally {
      active--;
      retireWhenIdle();
    }
  }

  async function runStarted<K extends TaskName>(
    name: K,
    input: TaskInput<K>,
    runOptions: RunOptions,
  ): Promise<TaskOutput<K>> {
    const pool = await start();
    const limitMs = runOptions.timeoutMs ?? options.taskTimeoutMs;
    const timer = new AbortController();
    const timeout = setTimeout(() => timer.abort(new TaskTimeout(limitMs)), limitMs);
    const signal = runOptions.signal
      ? AbortSignal.any([runOptions.signal, timer.signal])
      : timer.signal;
    if (pool.queueSize >= options.maxQueue && busy >= options.size) throw serverBusy();
    busy++;
    try {
      const reply = (await pool.run({ name, input }, { signal })) as TaskReply;
      if (reply.ok) return reply.value as TaskOutput<K>;
      throw new AppError(reply.error.body, reply.error.headers);
    } catch (error) {
      if (timer.signal.aborted && timer.signal.reason instanceof TaskTimeout)
        throw evaluationTimedOut(limitMs);
      if (runOptions.signal?.aborted) throw runOptions.signal.reason ?? error;
      if (error instanceof Error && /queue is at limit/i.test(error.message)) throw serverBusy();
      throw error;
    } finally {
      busy--;
      clearTimeout(timeout);
    }
  }

  return {
    run,
    stats: () => ({
      size: options.size,
      busy: Math.min(busy, options.size),
      queued: piscina?.queueSize ?? 0,
      started: piscina !== null,
      retirements,
      retiring: stopping,
    }),
    close: async () => {
      closed = true;
      if (idleTimer) clearTimeout(idleTimer);
      idleTimer = null;
      await retiring;
      if (!started) return;
      // A close during start-up waits for it, so no worker outlives the pool.
      await started.catch(() => undefined);
      await piscina?.destroy();
    },
  };
}

let current: EnginePool | null = null;

/** Starts the process's engine pool (once). */
export function startEnginePool(options: EnginePoolOptions): EnginePool {
  current ??= createEnginePool(options);
  return current;
}

export function enginePool(): EnginePool {
  if (!current) throw new Error('startEnginePool() has not been called');
  return current;
}

export async function stopEnginePool(): Promise<void> {
  if (!current) return;
  const stopping = current;
  current = null;
  await stopping.close();
}
