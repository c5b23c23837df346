/**
 * In-process-control chromatograms attached to a step of a route: the
 * multipart upload's fields, the peak table, the list and detail replies and
 * the integration edit. Times in minutes; areas in signal units × minutes.
 */
import { z } from 'zod';
import type { ProcessedPeak, ProcessingResult } from '../chromatography/types';
import { listQuerySchema, listReplySchema } from './lists';
import { identifier, text } from './text';

export const CHROMATOGRAM_LIMITS = {
  sampleNameMax: 200,
  methodNoteMax: 2000,
  stepIdMax: 80,
  signalMax: 200,
  /** Hand-set integration windows in one chromatogram. */
  windowsMax: 200,
  /** Default upload size limit [bytes]; the server's CHROMATOGRAM_MAX_MB overrides it. */
  defaultMaxBytes: 20 * 1024 * 1024,
} as const;

export const CHROMATOGRAM_KINDS = ['trace', 'document'] as const;
export type ChromatogramKind = (typeof CHROMATOGRAM_KINDS)[number];

/** The multipart form fields of an upload (besides `file`); every value arrives as text. */
export const chromatogramUploadFieldsSchema = z.object({
  stepId: identifier().max(CHROMATOGRAM_LIMITS.stepIdMax),
  revision: z
    .union([z.literal(''), z.coerce.number().int({ message: 'Use a whole number.' }).min(1)])
    .optional()
    .transform((value) => (value === '' || value === undefined ? null : value)),
  sampleName: text()
    .trim()
    .min(1, { message: 'Give the sample a name.' })
    .max(CHROMATOGRAM_LIMITS.sampleNameMax),
  takenAt: z
    .union([
      z.literal(''),
      z.iso.datetime({ offset: true, message: 'Give the time as a date and time.' }),
    ])
    .optional()
    .transform((value) => (value ? value : null)),
  signal: text()
    .trim()
    .max(CHROMATOGRAM_LIMITS.signalMax)
    .optional()
    .transform((value) => (value ? value : null)),
  methodNote: text().max(CHROMATOGRAM_LIMITS.methodNoteMax).optional().default(''),
});
export type ChromatogramUploadFields = z.output<typeof chromatogramUploadFieldsSchema>;

/** One row of the peak table, as the API gives it. */
export const chromatogramPeakSchema = z.object({
  retentionMin: z.number(),
  height: z.number(),
  area: z.number(),
  areaPct: z.number(),
  /** Null when the signal does not fall to half height inside the limits. */
  widthHalfMin: z.number().nullable(),
  plates: z.number().optional(),
  symmetry: z.number().optional(),
  resolution: z.number().optional(),
  componentId: text().optional(),
});
export type ChromatogramPeak = z.infer<typeof chromatogramPeakSchema>;

/** 201 reply of an upload. */
export const chromatogramCreatedSchema = z.object({
  id: z.uuid(),
  stepId: text(),
  kind: z.enum(CHROMATOGRAM_KINDS),
  peaks: z.array(chromatogramPeakSchema),
});
export type ChromatogramCreated = z.infer<typeof chromatogramCreatedSchema>;

const finiteMinutes = () =>
  z
    .number({ error: 'Enter a time in minutes.' })
    .min(0, { message: 'Use a time of 0 min or later.' })
    .max(1e5);

export const integrationWindowSchema = z
  .object({ startMin: finiteMinutes(), endMin: finiteMinutes() })
  .refine((w) => w.endMin > w.startMin, {
    message: 'The end must come after the start.',
    path: ['endMin'],
  });
export type IntegrationWindowPayload = z.infer<typeof integrationWindowSchema>;

const personSchema = z.object({ id: text(), name: text() });

export const chromatogramSummarySchema = z.object({
  id: z.uuid(),
  routeId: z.uuid(),
  stepId: text(),
  revision: z.number().int().nullable(),
  sampleName: text(),
  takenAt: text().nullable(),
  methodNote: text(),
  kind: z.enum(CHROMATOGRAM_KINDS),
  contentType: text(),
  fileName: text(),
  sizeBytes: z.number().int(),
  /** 'csv' (any delimited text), 'andi' (netCDF), 'pdf', 'png', 'jpg', ... */
  format: text(),
  signalName: text().nullable(),
  /** Every signal column of a multi-signal text file. */
  signals: z.array(text()),
  points: z.number().int(),
  peaks: z.array(chromatogramPeakSchema),
  createdAt: text(),
  createdBy: personSchema.nullable(),
});
export type ChromatogramSummary = z.infer<typeof chromatogramSummarySchema>;

export const chromatogramListSchema = listReplySchema(chromatogramSummarySchema);
export type ChromatogramList = z.infer<typeof chromatogramListSchema>;

/** Oldest first (default) or newest first; q matches part of the sample name; stepId keeps one step's. */
export const chromatogramListQuerySchema = listQuerySchema(
  ['oldest', 'newest'],
  'Sort oldest first (oldest) or newest first (newest).',
).extend({
  stepId: identifier().max(CHROMATOGRAM_LIMITS.stepIdMax).optional(),
});

const seriesSchema = z.object({ timeMin: z.array(z.number()), signal: z.array(z.number()) });

export const chromatogramDetailSchema = chromatogramSummarySchema.extend({
  /** The integration limits of each peak, in the order of `peaks`. */
  limits: z.array(z.object({ startMin: z.number(), endMin: z.number() })),
  /** The straight baseline under each peak: its value at the start and end limits. */
  peakBaselines: z.array(z.object({ start: z.number(), end: z.number() })),
  /** 'manual' when hand-set integration windows replace the automatic detection. */
  integrationMode: z.enum(['automatic', 'manual']),
  /** Peak index → route component id. */
  assignments: z.record(text(), text()),
  warnings: z.array(text()),
  /** Standard deviation of the baseline noise [signal units]; null for a document. */
  noise: z.number().nullable(),
  /** The global baseline used to find peaks, decimated for drawing; null for a document. */
  baseline: seriesSchema.nullable(),
  /** The trace, decimated to at most 5,000 points unless ?full=1; null for a document. */
  trace: seriesSchema.nullable(),
  /** Whether `trace` was decimated. */
  decimated: z.boolean(),
  updatedAt: text(),
});
export type ChromatogramDetail = z.infer<typeof chromatogramDetailSchema>;

export const chromatogramDetailQuerySchema = z.object({
  full: z
    .enum(['1', '0', 'true', 'false'], { message: 'Use full=1 for every point.' })
    .optional()
    .transform((v) => v === '1' || v === 'true'),
});

export const chromatogramUpdateSchema = z
  .object({
    /** Hand-set integration windows (each one peak); null or [] goes back to automatic detection. */
    integration: z
      .array(integrationWindowSchema)
      .max(CHROMATOGRAM_LIMITS.windowsMax)
      .nullable()
      .optional(),
    /** The whole new assignment map: peak index ("0", "1", ...) → route component id. */
    assignments: z
      .record(text().regex(/^\d{1,4}$/, { message: 'Peak numbers are 0, 1, 2, ...' }), identifier())
      .optional(),
  })
  .strict();
export type ChromatogramUpdate = z.infer<typeof chromatogramUpdateSchema>;

/** What the database keeps per peak: the whole processed row (assignments are kept apart). */
export type StoredPeak = ProcessedPeak;
/** What the database keeps of the processing besides the peaks. */
export type StoredProcessing = Pick<
  ProcessingResult,
  'noise' | 'baseline' | 'integration' | 'warnings' | 'settings'
> & { readWarnings: string[] };
