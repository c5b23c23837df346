/**
 * Plant equipment of a workspace: vessels (volumes, temperature and pressure
 * range, material of construction), filters and dryers (area, capacity). The
 * step list checks every operation's volume against the vessel chosen for it.
 */
import { z } from 'zod';
import { text } from './text';
import { listPagingSchema, listReplySchema } from './lists';

export const EQUIPMENT_NAME_MAX_LENGTH = 120;
export const EQUIPMENT_MATERIAL_MAX_LENGTH = 120;
export const EQUIPMENT_KINDS = ['vessel', 'filter', 'dryer'] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];
export const EQUIPMENT_KIND_LABELS: Record<EquipmentKind, string> = {
  vessel: 'Vessel',
  filter: 'Filter',
  dryer: 'Dryer',
};

/** Bounds of every field: the forms, the server and the database agree on them. */
export const EQUIPMENT_RANGES = {
  volumeL: [0, 1_000_000],
  temperatureC: [-150, 400],
  pressureMbar: [0, 100_000],
  areaM2: [0, 1000],
} as const;

const number = (label: string, unit: string, [min, max]: readonly [number, number]) =>
  z
    .number({ message: `Enter the ${label} in ${unit}.` })
    .finite({ message: `Enter the ${label} in ${unit}.` })
    .min(min, { message: `The ${label} cannot be below ${min} ${unit}.` })
    .max(max, { message: `The ${label} cannot be above ${max.toLocaleString('en')} ${unit}.` });
const positive = (label: string, unit: string, range: readonly [number, number]) =>
  number(label, unit, range).positive({ message: `The ${label} must be more than 0 ${unit}.` });

const name = text()
  .trim()
  .min(1, { message: 'Enter a name, e.g. the vessel tag.' })
  .max(EQUIPMENT_NAME_MAX_LENGTH, {
    message: `Use at most ${EQUIPMENT_NAME_MAX_LENGTH} characters.`,
  });

const vesselFields = {
  name,
  nominalL: positive('nominal volume', 'L', EQUIPMENT_RANGES.volumeL),
  minStirrableL: number('minimum stirrable volume', 'L', EQUIPMENT_RANGES.volumeL),
  maxWorkingL: positive('maximum working volume', 'L', EQUIPMENT_RANGES.volumeL),
  minC: number('lowest jacket temperature', '°C', EQUIPMENT_RANGES.temperatureC),
  maxC: number('highest jacket temperature', '°C', EQUIPMENT_RANGES.temperatureC),
  minMbar: number('lowest pressure', 'mbar', EQUIPMENT_RANGES.pressureMbar),
  maxMbar: positive('highest pressure', 'mbar', EQUIPMENT_RANGES.pressureMbar),
  material: text()
    .trim()
    .min(1, { message: 'Enter the material of construction, e.g. glass-lined steel.' })
    .max(EQUIPMENT_MATERIAL_MAX_LENGTH, {
      message: `Use at most ${EQUIPMENT_MATERIAL_MAX_LENGTH} characters.`,
    }),
};
const unitFields = {
  name,
  areaM2: positive('area', 'm²', EQUIPMENT_RANGES.areaM2),
  capacityL: positive('capacity', 'L', EQUIPMENT_RANGES.volumeL),
};

export const vesselInputSchema = z.object({ kind: z.literal('vessel'), ...vesselFields }).strict();
export const filterInputSchema = z.object({ kind: z.literal('filter'), ...unitFields }).strict();
export const dryerInputSchema = z.object({ kind: z.literal('dryer'), ...unitFields }).strict();

export type VesselInput = z.infer<typeof vesselInputSchema>;
export type EquipmentInput =
  VesselInput | z.infer<typeof filterInputSchema> | z.infer<typeof dryerInputSchema>;

export interface EquipmentProblem {
  path: string;
  message: string;
}

/**
 * The rules that join two fields (a lower limit below its upper limit, the
 * working volume inside the vessel), in the chemist's words. Used by the
 * create schema and, on the merged record, by a partial change.
 */
export function equipmentProblems(item: EquipmentInput): EquipmentProblem[] {
  if (item.kind !== 'vessel') return [];
  const problems: EquipmentProblem[] = [];
  if (item.minStirrableL >= item.maxWorkingL)
    problems.push({
      path: 'minStirrableL',
      message: 'The minimum stirrable volume must be below the maximum working volume.',
    });
  if (item.maxWorkingL > item.nominalL * 1.5)
    problems.push({
      path: 'maxWorkingL',
      message:
        'The maximum working volume cannot be more than 1.5 times the nominal volume: check the units (L).',
    });
  if (item.minC > item.maxC)
    problems.push({
      path: 'minC',
      message: 'The lowest temperature must not be above the highest temperature.',
    });
  if (item.minMbar > item.maxMbar)
    problems.push({
      path: 'minMbar',
      message: 'The lowest pressure must not be above the highest pressure.',
    });
  return problems;
}

const withCrossChecks = <T extends z.ZodType<EquipmentInput>>(schema: T) =>
  schema.superRefine((item, ctx) => {
    for (const problem of equipmentProblems(item))
      ctx.addIssue({ code: 'custom', path: [problem.path], message: problem.message });
  });

/** POST body: one vessel, filter or dryer. */
export const equipmentCreateSchema = withCrossChecks(
  z.discriminatedUnion('kind', [vesselInputSchema, filterInputSchema, dryerInputSchema], {
    message: 'Choose the kind of equipment: vessel, filter or dryer.',
  }),
);
export type EquipmentCreateInput = z.infer<typeof equipmentCreateSchema>;

/**
 * PATCH body: the fields to change (the kind stays; naming it again is
 * allowed). The joined rules are checked on the record as it would become.
 */
export const equipmentUpdateSchema = z
  .object({
    kind: z.enum(EQUIPMENT_KINDS).optional(),
    name: name.optional(),
    nominalL: vesselFields.nominalL.optional(),
    minStirrableL: vesselFields.minStirrableL.optional(),
    maxWorkingL: vesselFields.maxWorkingL.optional(),
    minC: vesselFields.minC.optional(),
    maxC: vesselFields.maxC.optional(),
    minMbar: vesselFields.minMbar.optional(),
    maxMbar: vesselFields.maxMbar.optional(),
    material: vesselFields.material.optional(),
    areaM2: unitFields.areaM2.optional(),
    capacityL: unitFields.capacityL.optional(),
  })
  .strict()
  .refine((body) => Object.keys(body).some((key) => key !== 'kind'), {
    message: 'Change at least one field.',
  });
export type EquipmentUpdateInput = z.infer<typeof equipmentUpdateSchema>;

const stamps = { id: text(), createdAt: text(), updatedAt: text() };
export const vesselSchema = vesselInputSchema.extend(stamps);
export const filterSchema = filterInputSchema.extend(stamps);
export const dryerSchema = dryerInputSchema.extend(stamps);
export const equipmentSchema = z.discriminatedUnion('kind', [
  vesselSchema,
  filterSchema,
  dryerSchema,
]);
export type Equipment = z.infer<typeof equipmentSchema>;
export type Vessel = z.infer<typeof vesselSchema>;

export const equipmentListQuerySchema = listPagingSchema.extend({
  /** Only one kind. */
  kind: z.enum(EQUIPMENT_KINDS, { message: 'Choose vessel, filter or dryer.' }).optional(),
  /** Part of the name. */
  q: text().trim().max(200).optional(),
  /** By name (default), or by working volume / capacity, largest first. */
  sort: z.enum(['name', 'size']).default('name'),
});
export type EquipmentListQuery = z.input<typeof equipmentListQuerySchema>;
export const equipmentListSchema = listReplySchema(equipmentSchema);
export type EquipmentList = z.infer<typeof equipmentListSchema>;
