/** Background jobs a user started (Monte Carlo runs), polled for progress. */
import { z } from 'zod';
import { text } from './text';
import { listQuerySchema, listReplySchema } from './lists';
import { routeDocumentSchema } from './route';
import { OBJECTIVES } from '../engine/optimise/optimise';
import type { MonteCarloResult as EngineMonteCarloResult } from '../engine/route/monte-carlo';
import type { Exactly } from './exact';

export const JOB_KINDS = ['monte-carlo'] as const;
/** Every kind of background job (Monte Carlo runs, route optimisations). */
export const ALL_JOB_KINDS = ['monte-carlo', 'optimise'] as const;
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

/** The figures of one candidate route the optimiser evaluated. */
export const candidateTotalsSchema = z.object({
  pmi: z.number().nullable(),
  solventLPerKg: z.number().nullable(),
  cycleTimeH: z.number(),
  yieldPct: z.number().nullable(),
  purityWtPct: z.number().nullable(),
  solventFreePurityPct: z.number().nullable(),
  impurityPct: z.record(text(), z.number()),
  peakVolumeL: z.number(),
  residualSolventPpm: z.record(text(), z.number()),
});

export const candidateSchema = z.object({
  /** `{ "<stepId>.<param>": value }`. */
  params: z.record(text(), z.number()),
  totals: candidateTotalsSchema,
  feasible: z.boolean(),
});
export type Candidate = z.infer<typeof candidateSchema>;

/** Monte Carlo spread of the constrained figures at the chosen point. */
export const optimiseUncertaintySchema = z.object({
  draws: z.number().int(),
  failedDraws: z.number().int(),
  objective: percentilesSchema,
  yieldPct: percentilesSchema,
  solventFreePurityPct: percentilesSchema,
  peakVolumeL: percentilesSchema,
  impurityPct: z.record(text(), percentilesSchema),
});

export const optimiseResultSchema = z.object({
  objective: z.enum(OBJECTIVES),
  feasible: z.boolean(),
  message: text(),
  best: candidateSchema.extend({
    document: routeDocumentSchema,
    uncertainty: optimiseUncertaintySchema,
    unmet: z.array(text()),
  }),
  current: candidateSchema.extend({ unmet: z.array(text()) }).nullable(),
  candidates: z.array(candidateSchema),
  evaluations: z.number().int(),
  failedEvaluations: z.number().int(),
  seed: z.number().int(),
  engineVersion: text(),
  processSafetyNote: text(),
});
export type OptimiseResult = z.infer<typeof optimiseResultSchema>;

/** A route optimisation job: the job fields with the optimiser's result. */
export const optimiseJobSchema = jobSchema.extend({
  kind: z.literal('optimise'),
  result: optimiseResultSchema.optional(),
});
export type OptimiseJob = z.infer<typeof optimiseJobSchema>;

/** A job in the list of your jobs: its state without the result (GET /jobs/{jobId} has it). */
export const jobSummarySchema = jobSchema.omit({ result: true }).extend({
  kind: z.enum(ALL_JOB_KINDS),
});
export type JobSummary = z.infer<typeof jobSummarySchema>;
export const jobListSchema = listReplySchema(jobSummarySchema);
/** Newest first (default) or oldest first; kind and status filter; q matches part of either. */
export const jobListQuerySchema = listQuerySchema(
  ['newest', 'oldest'],
  'Sort newest first (newest) or oldest first (oldest).',
).extend({
  kind: z.enum(ALL_JOB_KINDS, { message: 'Choose monte-carlo or optimise.' }).optional(),
  status: z
    .enum(JOB_STATUSES, { message: 'Choose queued, running, done, failed or cancelled.' })
    .optional(),
});
export type JobListQuery = z.infer<typeof jobListQuerySchema>;

/** Any job, as GET /jobs/{jobId} answers it. */
export const anyJobSchema = z.union([jobSchema, optimiseJobSchema]);
export type AnyJob = z.infer<typeof anyJobSchema>;
