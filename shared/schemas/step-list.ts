/**
 * The plant step list: the request that asks for one (batch size, basis,
 * equipment per step, format), and the JSON document it is exported as and
 * imported from. docs/step-list-format.md documents every field.
 */
import { z } from 'zod';
import { text } from './text';
import { routeDocumentSchema } from './route';

export const STEP_LIST_FORMATS = ['json', 'csv', 'xlsx', 'pdf'] as const;
export type StepListFormat = (typeof STEP_LIST_FORMATS)[number];
export const STEP_LIST_CONTENT_TYPES: Record<StepListFormat, string> = {
  json: 'application/json; charset=utf-8',
  csv: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  pdf: 'application/pdf',
};
export const STEP_LIST_BASES = ['input', 'product'] as const;
export type StepListBasis = (typeof STEP_LIST_BASES)[number];
export const STEP_LIST_BASIS_LABELS: Record<StepListBasis, string> = {
  input: "kg of the route's reference input",
  product: 'kg of isolated product',
};
/** The largest batch a step list is made for, kg (the route document's mass limit). */
export const STEP_LIST_MAX_BATCH_KG = 1_000_000;
export const STEP_LIST_FORMAT_NAME = 'phasewright-step-list';
export const STEP_LIST_FORMAT_VERSION = 1;

/** POST .../revisions/{number}/step-list */
export const stepListRequestSchema = z
  .object({
    batchKg: z
      .number({ message: 'Enter the batch size in kg.' })
      .finite({ message: 'Enter the batch size in kg.' })
      .positive({ message: 'The batch size must be more than 0 kg.' })
      .max(STEP_LIST_MAX_BATCH_KG, {
        message: `The batch size cannot be above ${STEP_LIST_MAX_BATCH_KG.toLocaleString('en')} kg.`,
      }),
    basis: z.enum(STEP_LIST_BASES, {
      message: 'Choose whether the batch size is kg of input or kg of isolated product.',
    }),
    /** step id → equipment id; steps left out run without a vessel check. */
    equipment: z
      .record(
        text().min(1).max(100),
        z.uuid({ message: 'Choose equipment from the list of this workspace.' }),
      )
      .default({}),
    format: z.enum(STEP_LIST_FORMATS, { message: 'Choose json, csv, xlsx or pdf.' }),
  })
  .strict();
export type StepListRequest = z.input<typeof stepListRequestSchema>;

export const stepListChargeSchema = z
  .object({
    name: text(),
    kg: z.number(),
    /** Litres of a liquid; null for a solid. */
    L: z.number().nullable(),
  })
  .strict();
export type StepListCharge = z.infer<typeof stepListChargeSchema>;

export const vesselCheckSchema = z.object({ ok: z.boolean(), message: text() }).strict();
export type VesselCheck = z.infer<typeof vesselCheckSchema>;

export const stepListOperationSchema = z
  .object({
    number: z.number().int().positive(),
    stepId: text(),
    text: text(),
    charges: z.array(stepListChargeSchema),
    temperatureC: z.number().optional(),
    pressureMbar: z.number().optional(),
    durationH: z.number().optional(),
    /** Liquid (or cake) volume in the equipment when the operation ends, L. */
    volumeAfterL: z.number(),
    cautions: z.array(text()),
    vesselCheck: vesselCheckSchema.optional(),
  })
  .strict();
export type StepListOperation = z.infer<typeof stepListOperationSchema>;

/** The approving signature, in the signed decision's shape. */
export const stepListApprovalSchema = z
  .object({
    signer: z.object({ name: text(), email: text() }).strict(),
    signedAt: text(),
    meaning: text(),
    contentHash: text(),
  })
  .strict();
export type StepListApproval = z.infer<typeof stepListApprovalSchema>;

export const stepListEquipmentSchema = z
  .object({ stepId: text(), equipmentId: text(), name: text(), kind: text() })
  .strict();

export const stepListDocumentSchema = z
  .object({
    format: z.literal(STEP_LIST_FORMAT_NAME),
    formatVersion: z.literal(STEP_LIST_FORMAT_VERSION),
    route: z
      .object({
        id: text(),
        name: text(),
        /** The route document scaled to the batch: the step list's numbers are its evaluation. */
        document: routeDocumentSchema,
      })
      .strict(),
    revision: z.number().int().positive(),
    approval: stepListApprovalSchema.nullable(),
    draft: z.boolean(),
    batchKg: z.number().positive(),
    basis: z.enum(STEP_LIST_BASES),
    /** Batch / the revision's own scale. */
    scaleFactor: z.number().positive(),
    exportedAt: text(),
    equipment: z.array(stepListEquipmentSchema),
    operations: z.array(stepListOperationSchema),
    /**
     * The engine version that computed this step list's numbers, and the one stored with the
     * revision (and its signature); they differ after an upgrade. Absent in lists exported
     * before 3 December 2026.
     */
    engineVersion: text().optional(),
    revisionEngineVersion: text().optional(),
    processSafetyNote: text(),
  })
  .strict();
export type StepListDocument = z.infer<typeof stepListDocumentSchema>;
