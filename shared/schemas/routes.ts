/**
 * The routes list, route detail and draft payloads. A draft is the route
 * document being edited; it may still be incomplete (no steps or components
 * yet), so drafts use the route document schema with those lists allowed
 * empty. Everything else about the document is checked exactly as for
 * evaluation.
 */
import { z } from 'zod';
import { text } from './text';
import { listPagingSchema, listQuerySchema, listReplySchema } from './lists';
import {
  componentSchema,
  ROUTE_SCHEMA_VERSION,
  routeDocumentSchema,
  stepSchema,
  type RouteDocumentInput,
} from './route';
import { routeIssueSchema, stepWarningSchema } from './evaluate';

export const ROUTE_NAME_MAX_LENGTH = 200;
export const PROJECT_NAME_MAX_LENGTH = 120;

/** A route document that may not have steps or components yet. */
export const draftDocumentSchema = routeDocumentSchema.extend({
  components: z.array(componentSchema).max(100),
  steps: z.array(stepSchema).max(1000),
});
export type DraftDocument = z.infer<typeof draftDocumentSchema>;

/** Placeholder reference input of a new route, to be pointed at the crude's main component. */
export const EMPTY_REFERENCE_COMPONENT_ID = 'product';

/** What a new route starts from when no document is given. */
export function emptyRouteDocument(name?: string): RouteDocumentInput {
  return {
    schemaVersion: ROUTE_SCHEMA_VERSION,
    ...(name ? { name } : {}),
    referenceInput: { componentId: EMPTY_REFERENCE_COMPONENT_ID, massKg: 1 },
    components: [],
    steps: [],
    connections: [],
  } as unknown as RouteDocumentInput;
}

export const routeNameSchema = text()
  .trim()
  .min(1, { message: 'Enter a name.' })
  .max(ROUTE_NAME_MAX_LENGTH);
export const projectNameSchema = text()
  .trim()
  .min(1, { message: 'Enter a project name.' })
  .max(PROJECT_NAME_MAX_LENGTH);

export const personRefSchema = z.object({ id: text(), name: text() });
export const projectRefSchema = z.object({ id: text(), name: text() });

/** The key totals a list row shows; null until the draft evaluates. */
export const keyTotalsSchema = z.object({
  yieldPct: z.number().nullable(),
  purityPct: z.number().nullable(),
  pmi: z.number().nullable(),
  /** The engine version that computed these figures; an earlier one than today's may differ. */
  engineVersion: text().nullable(),
});
export type KeyTotals = z.infer<typeof keyTotalsSchema>;

export const routeStatusSchema = z.enum(['draft', 'archived']);

export const routeSummarySchema = z.object({
  id: text(),
  name: text(),
  project: projectRefSchema.nullable(),
  status: routeStatusSchema,
  owner: personRefSchema,
  /** Last change to the route or its draft. */
  updatedAt: text(),
  draftVersion: z.number().int(),
  /** Version of the route's own fields (name, project, archived); PATCH names it as baseVersion. */
  version: z.number().int(),
  totals: keyTotalsSchema.nullable(),
  stepCount: z.number().int(),
});
export type RouteSummary = z.infer<typeof routeSummarySchema>;
export const routeListSchema = listReplySchema(routeSummarySchema);
export type RouteList = z.infer<typeof routeListSchema>;

/** Why the stored draft has no totals (it could not be evaluated), or null. */
export const draftEvaluationErrorSchema = z
  .object({ code: text(), message: text(), details: z.array(routeIssueSchema) })
  .nullable();

export const draftSchema = z.object({
  document: draftDocumentSchema,
  version: z.number().int(),
  updatedAt: text(),
  updatedBy: personRefSchema,
  evaluationError: draftEvaluationErrorSchema,
});

export const routeAbilitiesSchema = z.object({
  read: z.boolean(),
  edit: z.boolean(),
  rename: z.boolean(),
  duplicate: z.boolean(),
  archive: z.boolean(),
});

export const routeDetailSchema = routeSummarySchema.extend({
  draft: draftSchema,
  abilities: routeAbilitiesSchema,
});
export type RouteDetail = z.infer<typeof routeDetailSchema>;

/** How the routes list is ordered: last change, newest first (default), or name A to Z. */
export const ROUTE_SORTS = ['changed', 'name'] as const;
export type RouteSort = (typeof ROUTE_SORTS)[number];

export const listRoutesQuerySchema = listPagingSchema.extend({
  archived: z
    .enum(['true', 'false'], { message: 'Use true or false.' })
    .default('false')
    .transform((value) => value === 'true'),
  /** Part of the route's or its project's name. */
  q: text().trim().max(200).optional(),
  sort: z
    .enum(ROUTE_SORTS, { message: 'Sort by last change (changed) or by name (name).' })
    .default('changed'),
});

export const createRouteSchema = z.object({
  name: routeNameSchema,
  projectName: projectNameSchema.optional(),
  document: draftDocumentSchema.optional(),
});
export type CreateRouteInput = z.input<typeof createRouteSchema>;

export const updateRouteSchema = z
  .object({
    name: routeNameSchema.optional(),
    /** A project name (created when new), or null to take the route out of its project. */
    projectName: projectNameSchema.nullable().optional(),
    archived: z.boolean().optional(),
    /** The route version the change was based on; a newer one is a conflict (409 version_conflict). */
    baseVersion: z.number().int().min(1),
  })
  .refine(
    (body) =>
      body.name !== undefined || body.projectName !== undefined || body.archived !== undefined,
    {
      message: 'Send at least one of name, projectName, archived.',
    },
  );
export type UpdateRouteInput = z.input<typeof updateRouteSchema>;

export const duplicateRouteSchema = z.object({ name: routeNameSchema.optional() });

export const saveDraftSchema = z.object({
  document: draftDocumentSchema,
  /** The version the edit started from; a different current version is a conflict. */
  baseVersion: z.number().int().min(1),
});
export type SaveDraftInput = z.input<typeof saveDraftSchema>;

export const saveDraftResponseSchema = z.object({
  version: z.number().int(),
  updatedAt: text(),
  totals: keyTotalsSchema.nullable(),
  evaluationError: draftEvaluationErrorSchema,
  /** The engine's warnings and cautions for the saved document. */
  warnings: z.array(stepWarningSchema),
  processSafetyNote: text(),
});
export type SaveDraftResponse = z.infer<typeof saveDraftResponseSchema>;

/** Details of a 409 draft_conflict: the draft as it now stands, and who saved it. */
export const draftConflictDetailsSchema = z.object({
  current: z.object({
    version: z.number().int(),
    updatedAt: text(),
    updatedBy: personRefSchema,
    document: draftDocumentSchema,
  }),
});
export type DraftConflictDetails = z.infer<typeof draftConflictDetailsSchema>;

/** 409 draft_conflict: someone (or another tab) saved since baseVersion. */
export const draftConflictSchema = z.object({
  error: z.object({
    code: z.literal('draft_conflict'),
    message: text(),
    details: draftConflictDetailsSchema,
  }),
});

export const projectSummarySchema = z.object({
  id: text(),
  name: text(),
  /** Routes in the project that are not archived. */
  routeCount: z.number().int(),
});
export const projectListSchema = listReplySchema(projectSummarySchema);
export const projectListQuerySchema = listQuerySchema(['name'], 'Sort projects by name (name).');
