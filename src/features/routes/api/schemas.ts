/**
 * Reply shapes of the routes, evaluation and jobs APIs, parsed on every reply.
 * They are the server's own contract (shared/schemas), re-exported under the
 * names the client uses; no local copies.
 */
import type { z } from 'zod';
import {
  draftSchema,
  keyTotalsSchema,
  projectListSchema,
  projectSummarySchema,
  routeDetailSchema,
  routeListSchema,
  routeSummarySchema,
  saveDraftResponseSchema,
  type DraftConflictDetails,
  type RouteDetail,
  type RouteSummary,
  type SaveDraftResponse,
} from '@shared/schemas/routes';
import { monteCarloStartedSchema } from '@shared/schemas/evaluate';
import { jobSchema, type Job, type MonteCarloResult, type Percentiles } from '@shared/schemas/jobs';

export {
  draftSchema,
  keyTotalsSchema as routeTotalsSchema,
  projectListSchema,
  routeDetailSchema,
  routeListSchema,
  routeSummarySchema,
};
export { projectSummarySchema as projectSchema };
export type { RouteDetail, RouteSummary, Job, MonteCarloResult, Percentiles };

export type Draft = z.infer<typeof draftSchema>;

export const saveDraftReplySchema = saveDraftResponseSchema;
export type SaveDraftReply = SaveDraftResponse;

/** What the editor needs after a draft_conflict: the draft as it now stands on the server. */
export type DraftConflict = DraftConflictDetails;

export { monteCarloStartedSchema as jobAcceptedSchema, jobSchema };
