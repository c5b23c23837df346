/**
 * Plant equipment of a workspace: list, add, change, remove, each change
 * written to the audit trail.
 */
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import {
  equipmentProblems,
  type Equipment as EquipmentPayload,
  type EquipmentCreateInput,
  type EquipmentInput,
  type EquipmentListQuery,
  type EquipmentUpdateInput,
} from '@shared/schemas/equipment';
import { conflict, notFound, validationFailed } from '../errors';
import { Equipment } from '../models';
import { recordAudit } from './audit';
import {
  afterCursor,
  matchingRows,
  keyAttributes,
  keyOrder,
  pageOf,
  type KeysetOrder,
} from './keyset';

const VESSEL_FIELDS = [
  'nominalL',
  'minStirrableL',
  'maxWorkingL',
  'minC',
  'maxC',
  'minMbar',
  'maxMbar',
  'material',
] as const;
const UNIT_FIELDS = ['areaM2', 'capacityL'] as const;
const FIELD_LABELS: Record<string, string> = {
  nominalL: 'nominal volume',
  minStirrableL: 'minimum stirrable volume',
  maxWorkingL: 'maximum working volume',
  minC: 'temperature range',
  maxC: 'temperature range',
  minMbar: 'pressure range',
  maxMbar: 'pressure range',
  material: 'material of construction',
  areaM2: 'area',
  capacityL: 'capacity',
};

export function presentEquipment(item: Equipment): EquipmentPayload {
  const stamps = {
    id: item.id,
    createdAt: item.createdAt.toISOString(),
    updatedAt: item.updatedAt.toISOString(),
  };
  if (item.kind === 'vessel')
    return {
      kind: 'vessel',
      name: item.name,
      nominalL: item.nominalL!,
      minStirrableL: item.minStirrableL!,
      maxWorkingL: item.maxWorkingL!,
      minC: item.minC!,
      maxC: item.maxC!,
      minMbar: item.minMbar!,
      maxMbar: item.maxMbar!,
      material: item.material!,
      ...stamps,
    };
  return {
    kind: item.kind,
    name: item.name,
    areaM2: item.areaM2!,
    capacityL: item.capacityL!,
    ...stamps,
  };
}

/** The record's fields as the payload names them (without id and stamps). */
function inputOf(item: Equipment): EquipmentInput {
  const { id: _id, createdAt: _c, updatedAt: _u, ...input } = presentEquipment(item);
  return input as EquipmentInput;
}

function columnsOf(input: EquipmentInput) {
  const empty = Object.fromEntries(
    [...VESSEL_FIELDS, ...UNIT_FIELDS].map((field) => [field, null]),
  ) as Record<(typeof VESSEL_FIELDS)[number] | (typeof UNIT_FIELDS)[number], null>;
  return { ...empty, ...input };
}

async function ensureNameFree(
  workspaceId: string,
  name: string,
  exceptId: string | null,
  transaction: Transaction | null,
): Promise<void> {
  const clash = await Equipment.findOne({
    where: {
      workspaceId,
      name: { [Op.iLike]: name.replace(/[\\%_]/g, (c) => `\\${c}`) },
      ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}),
    },
    transaction,
  });
  if (clash)
    throw conflict(
      'already_exists',
      `The workspace already has equipment named "${clash.name}": give this one another name.`,
    );
}

// Vessels, then filters, then dryers: the kind's rank keeps every key column in one direction.
const KIND_RANK = `(CASE "Equipment"."kind" WHEN 'vessel' THEN 0 WHEN 'filter' THEN 1 ELSE 2 END)`;
const EQUIPMENT_ORDERS: Record<'name' | 'size', KeysetOrder> = {
  name: {
    name: 'name',
    columns: [
      { sql: KIND_RANK, type: 'int' },
      { sql: 'lower("Equipment"."name")', type: 'text' },
      { sql: '"Equipment"."id"', type: 'uuid' },
    ],
    direction: 'ASC',
  },
  size: {
    name: 'size',
    columns: [
      { sql: KIND_RANK, type: 'int' },
      // Largest first: the working volume (vessels) or capacity (filters, dryers), negated.
      { sql: '(-coalesce("Equipment"."max_working_l", "Equipment"."capacity_l"))', type: 'float8' },
      { sql: '"Equipment"."id"', type: 'uuid' },
    ],
    direction: 'ASC',
  },
};

/**
 * One page of the workspace's equipment, vessels first, then by name or by
 * size, largest first (equipment_workspace_kind_name_idx,
 * equipment_workspace_kind_size_idx); `q` matches part of the name
 * (equipment_name_trgm_idx).
 */
export async function listEquipment(
  workspaceId: string,
  query: EquipmentListQuery & { limit: number },
  transaction: Transaction | null,
): Promise<{ items: Equipment[]; nextCursor: string | null }> {
  const order = EQUIPMENT_ORDERS[query.sort ?? 'name'];
  const where: WhereOptions[] = [{ workspaceId }];
  if (query.kind) where.push({ kind: query.kind });
  if (query.q)
    where.push(
      await matchingRows(
        { model: 'Equipment', table: 'equipment', expressions: [(t) => `${t}.name`] },
        query.q,
      ),
    );
  if (query.cursor) where.push(afterCursor(order, query.cursor));
  const rows = await Equipment.findAll({
    where: { [Op.and]: where },
    attributes: { include: keyAttributes(order) },
    order: keyOrder(order),
    limit: query.limit + 1,
    transaction,
  });
  return pageOf(rows, query.limit, order);
}

/**
 * Every piece of equipment of the workspace, vessels first (for the step list). No cap: the step
 * list fits the batch to the whole register, and a silent cut-off would drop a vessel unseen; a
 * site register is hundreds of items, not millions.
 */
export async function allEquipment(
  workspaceId: string,
  transaction: Transaction | null,
): Promise<Equipment[]> {
  return Equipment.findAll({
    where: { workspaceId },
    order: [
      ['kind', 'DESC'],
      ['name', 'ASC'],
    ],
    transaction,
  });
}

export async function loadEquipment(
  workspaceId: string,
  id: string,
  transaction: Transaction | null,
): Promise<Equipment> {
  const item = await Equipment.findOne({ where: { id, workspaceId }, transaction });
  if (!item) throw notFound('The equipment');
  return item;
}

export async function createEquipment(
  workspaceId: string,
  actorId: string,
  input: EquipmentCreateInput,
  transaction: Transaction | null,
): Promise<Equipment> {
  await ensureNameFree(workspaceId, input.name, null, transaction);
  const item = await Equipment.create(
    { workspaceId, createdById: actorId, ...columnsOf(input) },
    { transaction },
  );
  await recordAudit(
    {
      workspaceId,
      actorId,
      action: 'equipment.create',
      entityType: 'equipment',
      entityId: item.id,
      after: input,
    },
    transaction,
  );
  return item;
}

export async function updateEquipment(
  item: Equipment,
  actorId: string,
  change: EquipmentUpdateInput,
  transaction: Transaction | null,
): Promise<Equipment> {
  const before = inputOf(item);
  const { kind, ...fields } = change;
  if (kind !== undefined && kind !== item.kind)
    throw validationFailed([
      {
        path: 'kind',
        message: `A ${item.kind} stays a ${item.kind}: remove it and add the ${kind} instead.`,
      },
    ]);
  const allowed: readonly string[] = item.kind === 'vessel' ? VESSEL_FIELDS : UNIT_FIELDS;
  const misplaced = Object.keys(fields).filter((key) => key !== 'name' && !allowed.includes(key));
  if (misplaced.length > 0)
    throw validationFailed(
      misplaced.map((path) => ({
        path,
        message:
          item.kind === 'vessel'
            ? `A vessel has no ${FIELD_LABELS[path] ?? path}: that belongs to filters and dryers.`
            : `A ${item.kind} has no ${FIELD_LABELS[path] ?? path}: give its area and capacity.`,
      })),
    );
  const after = { ...before, ...fields } as EquipmentInput;
  const problems = equipmentProblems(after);
  if (problems.length > 0) throw validationFailed(problems);
  if (fields.name !== undefined)
    await ensureNameFree(item.workspaceId as string, fields.name, item.id, transaction);
  await item.update(columnsOf(after), { transaction });
  await recordAudit(
    {
      workspaceId: item.workspaceId as string,
      actorId,
      action: 'equipment.update',
      entityType: 'equipment',
      entityId: item.id,
      before,
      after,
    },
    transaction,
  );
  return item;
}

export async function deleteEquipment(
  item: Equipment,
  actorId: string,
  transaction: Transaction | null,
): Promise<void> {
  const before = inputOf(item);
  await item.destroy({ transaction });
  await recordAudit(
    {
      workspaceId: item.workspaceId as string,
      actorId,
      action: 'equipment.delete',
      entityType: 'equipment',
      entityId: item.id,
      before,
    },
    transaction,
  );
}
