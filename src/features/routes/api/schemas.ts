/**
 * Reply shapes of the routes API, parsed on every reply. They follow the
 * agreed contract of the routes endpoints; when shared/schemas/routes.ts
 * lands these re-export from there.
 */
import { z } from 'zod';

const person = z.object({ id: z.string(), name: z.string() });

export const routeTotalsSchema = z
  .object({ yieldPct: z.number().nullable(), purityPct: z.number().nullable(), pmi: z.number().nullable() })
  .nullable();

export const routeSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  project: z.object({ id: z.string(), name: z.string() }).nullable(),
  status: z.enum(['draft', 'archived']),
  owner: person,
  updatedAt: z.string(),
  draftVersion: z.number(),
  totals: routeTotalsSchema,
  stepCount: z.number(),
});
export type RouteSummary = z.infer<typeof routeSummarySchema>;
export const routeListSchema = z.array(routeSummarySchema);

/** The document is checked by the editor against the route schema itself; a draft may be unfinished. */
export const draftSchema = z.object({
  document: z.record(z.string(), z.unknown()),
  version: z.number(),
  updatedAt: z.string(),
  updatedBy: person.nullable(),
});
export type Draft = z.infer<typeof draftSchema>;

export const routeDetailSchema = routeSummarySchema.extend({
  draft: draftSchema,
  abilities: z.object({ edit: z.boolean() }).passthrough(),
});
export type RouteDetail = z.infer<typeof routeDetailSchema>;

export const saveDraftReplySchema = z.object({ version: z.number(), updatedAt: z.string(), totals: routeTotalsSchema.optional() });
export type SaveDraftReply = z.infer<typeof saveDraftReplySchema>;

export const draftConflictSchema = z.object({ current: draftSchema });
export type DraftConflict = z.infer<typeof draftConflictSchema>;

export const projectSchema = z.object({ id: z.string(), name: z.string() }).passthrough();
export const projectListSchema = z.array(projectSchema);

export const jobAcceptedSchema = z.object({ jobId: z.string() });
export const jobSchema = z.object({
  status: z.string(),
  progress: z.number().nullable().optional(),
  result: z.unknown().optional(),
  error: z.unknown().optional(),
});
export type Job = z.infer<typeof jobSchema>;
