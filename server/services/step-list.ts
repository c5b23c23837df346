/**
 * The plant step list of a revision: scale the revision's document to the
 * batch, run it in the chosen equipment through the engine (in the engine
 * pool), write the operations, and hand them over as JSON, CSV, XLSX or PDF.
 * Also the way back: a step list's JSON imported as a new route.
 */
import type { Transaction } from 'sequelize';
import type { DraftDocument } from '@shared/schemas/routes';
import type { RouteDocument } from '@shared/schemas/route';
import type { Equipment as EquipmentPayload } from '@shared/schemas/equipment';
import {
  STEP_LIST_FORMAT_NAME,
  STEP_LIST_FORMAT_VERSION,
  type StepListApproval,
  type StepListDocument,
  type StepListRequest,
} from '@shared/schemas/step-list';
import type { ApiErrorDetail } from '@shared/schemas/errors';
import { applyEquipment, scaleDocument, scaleFactorFor } from '@shared/steplist';
import { apiError, validationFailed } from '../errors';
import type { Route } from '../models';
import { enginePool } from '../pool';
import { allEquipment, presentEquipment } from './equipment';
import { inUserSlot, type EvaluationLimits } from './evaluation-limits';
import { ENGINE_VERSION, PROCESS_SAFETY_NOTE } from './evaluation';
import { approvalOf, loadRevision, type RevisionWithReviews } from './revisions';

/** The approving signature a step list carries: the last one that completed the approval. */
export function stepListApproval(revision: RevisionWithReviews): StepListApproval | null {
  const approval = approvalOf(revision);
  const last = approval?.signatures.at(-1);
  if (!last) return null;
  return {
    signer: { name: last.signer.name, email: last.signer.email },
    signedAt: last.signedAt,
    meaning: last.meaning,
    contentHash: last.contentHash,
  };
}

export async function loadStepListRevision(
  route: Route,
  number: number,
  transaction: Transaction | null,
): Promise<RevisionWithReviews> {
  return loadRevision(route, number, transaction, { withContent: true });
}

/** Turns `{ stepId: equipmentId }` into the items, refusing steps and equipment that do not exist. */
export async function resolveAssignments(
  workspaceId: string,
  document: RouteDocument,
  requested: Record<string, string>,
  transaction: Transaction | null,
): Promise<{ assignments: Record<string, EquipmentPayload>; available: EquipmentPayload[] }> {
  const available = (await allEquipment(workspaceId, transaction)).map(presentEquipment);
  const byId = new Map(available.map((item) => [item.id, item]));
  const steps = new Set(document.steps.map((step) => step.id));
  const problems: ApiErrorDetail[] = [];
  const assignments: Record<string, EquipmentPayload> = {};
  for (const [stepId, equipmentId] of Object.entries(requested)) {
    const item = byId.get(equipmentId);
    if (!steps.has(stepId))
      problems.push({
        path: `equipment.${stepId}`,
        message: `This revision has no step "${stepId}": choose equipment for its own steps.`,
      });
    else if (!item)
      problems.push({
        path: `equipment.${stepId}`,
        message: 'Choose equipment from the list of this workspace.',
      });
    else assignments[stepId] = item;
  }
  if (problems.length > 0) throw validationFailed(problems);
  return { assignments, available };
}

export interface StepListContext {
  route: Route;
  revision: RevisionWithReviews;
  request: StepListRequest & { equipment: Record<string, string> };
  userId: string;
  limits: EvaluationLimits;
  transaction: Transaction | null;
}

/** Builds the step list document (the JSON format; the other formats are written from it). */
export async function makeStepList(context: StepListContext): Promise<StepListDocument> {
  const { route, revision, request } = context;
  const document = revision.document as unknown as RouteDocument;
  const result = revision.result as { totals?: { isolatedProductKg?: number } } | null;
  if (!result)
    throw apiError(
      'not_computable',
      'This revision could not be evaluated when it was saved, so it has no numbers to scale: save a revision that evaluates.',
    );
  const factor = scaleFactorFor(
    document,
    request.basis,
    request.batchKg,
    result.totals?.isolatedProductKg ?? null,
  );
  if (factor === null)
    throw apiError(
      'not_computable',
      'This revision isolates no product, so a batch cannot be given as kg of product: give it as kg of input.',
    );
  const { assignments, available } = await resolveAssignments(
    route.workspaceId as string,
    document,
    request.equipment,
    context.transaction,
  );
  const scaled = applyEquipment(scaleDocument(document, factor), assignments);
  const built = await inUserSlot(context.userId, context.limits, () =>
    enginePool().run('stepList.build', { document: scaled, assignments, available }),
  );
  const approval = stepListApproval(revision);
  return {
    format: STEP_LIST_FORMAT_NAME,
    formatVersion: STEP_LIST_FORMAT_VERSION,
    route: { id: route.id, name: route.name, document: scaled },
    revision: revision.number,
    approval,
    draft: approval === null,
    batchKg: request.batchKg,
    basis: request.basis,
    scaleFactor: factor,
    exportedAt: new Date().toISOString(),
    equipment: Object.entries(assignments).map(([stepId, item]) => ({
      stepId,
      equipmentId: item.id,
      name: item.name,
      kind: item.kind,
    })),
    operations: built.operations,
    engineVersion: ENGINE_VERSION,
    revisionEngineVersion: revision.engineVersion,
    processSafetyNote: PROCESS_SAFETY_NOTE,
  };
}

/** The name an imported step list's route gets. */
export function importedRouteName(list: StepListDocument): string {
  const batch = `${Number(list.batchKg.toPrecision(6))} kg`;
  const name = `${list.route.name} — step list of revision ${list.revision}, ${batch}`;
  return name.length <= 200 ? name : `${name.slice(0, 199)}…`;
}

export const importedDocument = (list: StepListDocument) =>
  list.route.document as unknown as DraftDocument;
