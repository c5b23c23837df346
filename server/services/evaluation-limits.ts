/**
 * Limits on the engine work one request or one person may ask for: steps
 * per evaluation, steps × draws per Monte Carlo run, and how many
 * calculations one person may have running at once on this server (the
 * slots are per server instance; queued Monte Carlo jobs are capped in the
 * database, across instances).
 */
import { routeTooLarge, tooManyEvaluations } from '../errors';

export interface EvaluationLimits {
  /** Steps one evaluation may have. */
  maxSteps: number;
  /** Steps × draws one Monte Carlo run may ask for. */
  maxStepDraws: number;
  /** Largest evaluation reply, bytes. */
  maxReplyBytes: number;
  /** Calculations one person may have running at once (per server). */
  perUserConcurrent: number;
  /** Monte Carlo jobs one person may have queued or running. */
  perUserJobs: number;
}

export function checkStepCount(steps: number, limits: EvaluationLimits): void {
  if (steps > limits.maxSteps)
    throw routeTooLarge(`route has ${steps} steps`, `${limits.maxSteps} steps`);
}

export function checkStepDraws(steps: number, draws: number, limits: EvaluationLimits): void {
  checkStepCount(steps, limits);
  if (steps * draws > limits.maxStepDraws)
    throw routeTooLarge(
      `run asks for ${draws} draws of ${steps} steps (${steps * draws} step evaluations)`,
      `${limits.maxStepDraws} step evaluations`,
    );
}

const running = new Map<string, number>();

/** Calculations the person has running on this server now (their slots in use). */
export function calculationsRunning(userId: string): number {
  return running.get(userId) ?? 0;
}

/** Runs `work` in one of the person's calculation slots; 429 when they are all taken. */
export async function inUserSlot<T>(
  userId: string,
  limits: EvaluationLimits,
  work: () => Promise<T>,
): Promise<T> {
  const count = running.get(userId) ?? 0;
  if (count >= limits.perUserConcurrent) throw tooManyEvaluations(limits.perUserConcurrent);
  running.set(userId, count + 1);
  try {
    return await work();
  } finally {
    const left = (running.get(userId) ?? 1) - 1;
    if (left > 0) running.set(userId, left);
    else running.delete(userId);
  }
}
