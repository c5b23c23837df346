/** Background jobs a user started (Monte Carlo runs), polled for progress. */
import { z } from 'zod';
import { text } from './text';
import type { MonteCarloResult as EngineMonteCarloResult } from '../engine/route/monte-carlo';
import type { Exactly } from './exact';

export const JOB_KINDS = ['monte-carlo'] as const;
export const JOB_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;

/** p5/p50/p95 of one quantity over the draws; null when no draw gave a number. */
export const percentilesSchema = z.object({
  p5: z.number().nullable(),
  p50: z.number().nullable(),
  p95: z.number().nullable(),
});
export type Percentiles = z.infer<typeof percentilesSchema>;

export const monteCarloResultSchema = z.object({
  draws: z.number().int(),
  seed: z.number().int(),
  yieldPct: percentilesSchema,
  purityWtPct: percentilesSchema,
  /** Purge factor of each impurity; null where the impurity is purged completely in most draws. */
  purgeFactor: z.record(text(), percentilesSchema),
  /** Draws for which the route could not be evaluated. */
  failedDraws: z.number().int(),
  engineVersion: text(),
  /** Cautions are prompts: defer to the site's process-safety review. */
  processSafetyNote: text(),
});
// The stored summary is the engine's plus the engine version and the safety note.
const _monteCarloMatchesEngine: Exactly<
  Omit<z.infer<typeof monteCarloResultSchema>, 'engineVersion' | 'processSafetyNote'>,
  EngineMonteCarloResult
> = true;
export type MonteCarloResult = z.infer<typeof monteCarloResultSchema>;

export const jobSchema = z.object({
  id: text(),
  kind: z.enum(JOB_KINDS),
  status: z.enum(JOB_STATUSES),
  /** 0..1: the share of draws done. */
  progress: z.number().min(0).max(1),
  result: monteCarloResultSchema.optional(),
  error: z.object({ code: text(), message: text() }).optional(),
  createdAt: text(),
  updatedAt: text(),
});
export type Job = z.infer<typeof jobSchema>;
