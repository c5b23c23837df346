/**
 * Payloads of route evaluation: the single evaluation (nothing stored) and
 * the Monte Carlo request that starts a background job.
 */
import { z } from 'zod';
import { text } from './text';
import type { RouteResult, RouteTotals } from '../engine/route/evaluate';
import type { Exactly } from './exact';
import { routeDocumentSchema, streamSchema, warningSchema } from './route';

/** Highest number of Monte Carlo draws one job may ask for. */
export const MONTE_CARLO_MAX_DRAWS = 20_000;

export const evaluateRequestSchema = z.object({ document: routeDocumentSchema });
export type EvaluateRequest = z.input<typeof evaluateRequestSchema>;

/** One reason a valid document cannot be evaluated, on the step it belongs to. */
export const routeIssueSchema = z.object({
  /** The step, or null for the document as a whole (components, reference input). */
  stepId: text().nullable(),
  /** Field inside the step (or the document), e.g. "params.mode.targetVolume" or "inputs.feed". */
  field: text(),
  message: text(),
  /** The same place as a dotted path from the request body, for forms ("document.steps.2.params.stages"). */
  path: text(),
});
export type RouteIssuePayload = z.infer<typeof routeIssueSchema>;

export const ROUTE_EVALUATION_CODES = ['route_invalid', 'route_unevaluable'] as const;

/** Why a valid document cannot be evaluated: route_invalid (graph, references, a step's parameters) or route_unevaluable (a model cannot run). */
export const routeEvaluationFailureSchema = z.object({
  code: z.enum(ROUTE_EVALUATION_CODES),
  message: text(),
  details: z.array(routeIssueSchema),
});

/** 422 reply of an evaluation that failed; one member of the error contract (errors.ts). */
export const routeEvaluationErrorSchema = z.object({ error: routeEvaluationFailureSchema });
export type RouteEvaluationError = z.infer<typeof routeEvaluationFailureSchema>;

/** The engine's route totals (shared/engine/route/evaluate.ts RouteTotals). */
export const routeTotalsSchema = z.object({
  productId: text().nullable(),
  productInKg: z.number(),
  isolatedProductKg: z.number(),
  isolatedSolidKg: z.number(),
  yieldPct: z.number().nullable(),
  /** Assay of the isolated solid including residual solvents and water [wt %]. */
  purityWtPct: z.number().nullable(),
  /** Product / (product + organic impurities) in the isolated solid [%], the area-% basis. */
  solventFreePurityPct: z.number().nullable(),
  /** Each compound charged other than the product: level in the isolated solid (solvent-free) against its limit. */
  impurities: z.array(
    z.object({
      componentId: text(),
      levelPct: z.number(),
      limitPct: z.number().nullable(),
      pass: z.boolean().nullable(),
    }),
  ),
  purge: z.record(
    text(),
    z.object({ inKg: z.number(), outKg: z.number(), purgeFactor: z.number().nullable() }),
  ),
  solventUseLPerKg: z.number().nullable(),
  pmi: z.number().nullable(),
  eFactor: z.number().nullable(),
  eFactorExcludingWater: z.number().nullable(),
  totalInputKg: z.number(),
  peakVolumeL: z.record(text(), z.number()),
  cycleTimeH: z.number(),
  cycleTimeBasis: text(),
});
// The type-check fails when the engine's totals and this schema drift apart.
const _totalsMatchEngine: Exactly<z.infer<typeof routeTotalsSchema>, RouteTotals> = true;

/** A warning or caution with the step it belongs to (null for the route). */
export const stepWarningSchema = warningSchema.extend({ stepId: text().nullable() });

/** A route result as the engine returns it; step results are kind-specific and kept open. */
export const routeResultSchema = z.object({
  engineVersion: text(),
  schemaVersion: z.number(),
  order: z.array(text()),
  steps: z.record(text(), z.record(text(), z.unknown())),
  streams: z.record(text(), streamSchema),
  terminals: z.array(
    z.object({
      stepId: text(),
      port: text(),
      isolated: z.boolean(),
      stream: streamSchema,
    }),
  ),
  totals: routeTotalsSchema,
  /** Every warning and caution, on its step (null for the route). */
  warnings: z.array(stepWarningSchema),
  /** Cautions are prompts: defer to the site's process-safety review. */
  processSafetyNote: text(),
});
// Step results stay open (kind-specific records); the result's own fields must match the engine's.
const _resultMatchesEngine: Exactly<keyof z.infer<typeof routeResultSchema>, keyof RouteResult> =
  true;

export const evaluateResponseSchema = z.object({
  engineVersion: text(),
  result: routeResultSchema,
});
export type EvaluateResponse = z.infer<typeof evaluateResponseSchema>;

export const monteCarloRequestSchema = z.object({
  document: routeDocumentSchema,
  draws: z.number().int().min(1).max(MONTE_CARLO_MAX_DRAWS),
  seed: z.number().int().min(-2_147_483_648).max(4_294_967_295),
});
export type MonteCarloRequest = z.input<typeof monteCarloRequestSchema>;

export const monteCarloStartedSchema = z.object({ jobId: text() });
