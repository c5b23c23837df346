/**
 * In-process-control chromatograms on a route's steps: store the file and
 * its parsed trace, integrate it, assign peaks to route components, list,
 * present, re-integrate and delete. Callers load the workspace and route and
 * authorize first. A failed upload leaves nothing: the file is stored under
 * a fresh key first and removed again if the database row cannot be written;
 * a deleted row's file is removed after the deletion commits.
 */
import { randomUUID } from 'node:crypto';
import { Op, literal, type Transaction, type WhereOptions } from 'sequelize';
import type { IntegrationWindow, ProcessingResult } from '@shared/chromatography';
import type {
  ChromatogramCreated,
  ChromatogramDetail,
  ChromatogramPeak,
  ChromatogramSummary,
  ChromatogramUpdate,
  ChromatogramUploadFields,
  StoredPeak,
  StoredProcessing,
} from '@shared/schemas/chromatograms';
import { apiError, conflict, notFound, validationFailed } from '../errors';
import { Chromatogram, RouteDraft, RouteRevision, User, type Route } from '../models';
import type { FileStorage } from '../storage';
import { recordAudit } from './audit';
import { afterCursor, matchingRows, keyAttributes, keyOrder, pageOf, byCreation } from './keyset';
import { readUpload } from './chromatogram-files';

interface DocumentLike {
  steps: Array<{ id: string; name?: string }>;
  components: Array<{ id: string; name?: string; kind?: string }>;
}

/** Columns of a list row: everything but the packed trace. */
const SUMMARY_ATTRIBUTES = { exclude: ['traceTime', 'traceSignal'] as const };
const withCreator = [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }];

// ---------------------------------------------------------------- packing

/** float64 values as bytes (the platform's order, little-endian wherever Node runs). */
export function packFloats(values: ArrayLike<number>): Buffer {
  return Buffer.from(Float64Array.from(values as ArrayLike<number>).buffer);
}

export function unpackFloats(bytes: Buffer): Float64Array {
  const copy = new Uint8Array(bytes.byteLength);
  copy.set(bytes);
  return new Float64Array(copy.buffer);
}

// ---------------------------------------------------------------- route context

/** The document the sample belongs to: the revision's when a number is given, else the draft's. */
async function documentOf(
  route: Route,
  revision: number | null,
  transaction: Transaction | null,
): Promise<DocumentLike | null> {
  if (revision === null) {
    const draft =
      route.draft ?? (await RouteDraft.findOne({ where: { routeId: route.id }, transaction }));
    return (draft?.document as DocumentLike | undefined) ?? null;
  }
  const stored = await RouteRevision.findOne({
    where: { routeId: route.id, number: revision },
    attributes: ['document'],
    transaction,
  });
  return (stored?.document as DocumentLike | undefined) ?? null;
}

async function checkStep(
  route: Route,
  stepId: string,
  revision: number | null,
  transaction: Transaction | null,
): Promise<void> {
  const document = await documentOf(route, revision, transaction);
  if (!document)
    throw validationFailed([
      { path: 'revision', message: `This route has no revision ${revision}.` },
    ]);
  if (!document.steps.some((s) => s.id === stepId))
    throw validationFailed([
      {
        path: 'stepId',
        message:
          revision === null
            ? 'The route has no such step.'
            : `Revision ${revision} of the route has no such step.`,
      },
    ]);
}

export function refuseArchived(route: Route): void {
  if (route.archivedAt)
    throw conflict('route_archived', 'This route is archived; unarchive it to change its samples.');
}

// ---------------------------------------------------------------- processing

interface Integrated {
  peaks: StoredPeak[];
  processing: StoredProcessing;
}

/**
 * The trace processing (peak picking, smoothing, decimation and their numeric packages), loaded
 * at the first chromatogram read or stored rather than at boot: an idle server does not hold it.
 */
const traceProcessing = () => import('@shared/chromatography');

async function integrate(
  timeMin: Float64Array,
  signal: Float64Array,
  windows: IntegrationWindow[] | null,
  readWarnings: string[],
): Promise<Integrated> {
  const { processTrace, TraceError } = await traceProcessing();
  let result: ProcessingResult;
  try {
    result = processTrace({ timeMin, signal }, { integration: windows?.length ? windows : null });
  } catch (error) {
    if (error instanceof TraceError) throw apiError('unreadable_file', error.message);
    throw error;
  }
  const { peaks, noise, baseline, integration, warnings, settings } = result;
  return { peaks, processing: { noise, baseline, integration, warnings, settings, readWarnings } };
}

/**
 * Assignments carried over by retention time: each earlier assignment goes to
 * the new peak whose limits hold its retention time (the nearest apex when
 * several do), within max(0.1 min, 2 % of the retention time).
 */
export function assignByRetention(
  peaks: StoredPeak[],
  known: Array<{ retentionMin: number; componentId: string }>,
  allowed: Set<string>,
): Record<string, string> {
  const out: Record<string, string> = {};
  const taken = new Set<string>();
  for (const { retentionMin, componentId } of known) {
    if (!allowed.has(componentId) || taken.has(componentId)) continue;
    const tolerance = Math.max(0.1, 0.02 * retentionMin);
    let best = -1;
    let bestDistance = Infinity;
    peaks.forEach((peak, index) => {
      const distance = Math.abs(peak.retentionMin - retentionMin);
      const inside = retentionMin >= peak.startMin && retentionMin <= peak.endMin;
      if ((inside || distance <= tolerance) && distance < bestDistance && !(String(index) in out)) {
        best = index;
        bestDistance = distance;
      }
    });
    if (best >= 0 && bestDistance <= tolerance) {
      out[String(best)] = componentId;
      taken.add(componentId);
    }
  }
  return out;
}

/** Assignments of the route's earlier chromatograms (the most recent first), as retention times. */
async function knownRetentions(
  routeId: string,
  stepId: string,
  transaction: Transaction | null,
): Promise<Array<{ retentionMin: number; componentId: string }>> {
  const earlier = await Chromatogram.findAll({
    where: { routeId, kind: 'trace' },
    attributes: ['stepId', 'peaks', 'assignments'],
    order: [
      [literal(`step_id = ${Chromatogram.sequelize!.escape(stepId)}`), 'DESC'],
      ['createdAt', 'DESC'],
    ],
    limit: 50,
    transaction,
  });
  const out: Array<{ retentionMin: number; componentId: string }> = [];
  for (const c of earlier)
    for (const [index, componentId] of Object.entries(c.assignments)) {
      const peak = c.peaks[Number(index)];
      if (peak) out.push({ retentionMin: peak.retentionMin, componentId });
    }
  return out;
}

// ---------------------------------------------------------------- upload

export interface UploadInput {
  workspaceId: string;
  route: Route;
  actorId: string;
  fields: ChromatogramUploadFields;
  file: { buffer: Buffer; originalName: string };
}

/**
 * Reads, integrates and stores an upload. The transaction is opened only for
 * the row, after the file is stored; when it fails the file is removed.
 */
export async function uploadChromatogram(
  input: UploadInput,
  storage: FileStorage,
  withTransaction: <T>(work: (t: Transaction) => Promise<T>) => Promise<T>,
  log: (error: unknown) => void,
): Promise<Chromatogram> {
  const { route, fields, file } = input;
  refuseArchived(route);
  await checkStep(route, fields.stepId, fields.revision, null);
  const read = await readUpload(file.buffer, fields.signal);
  const id = randomUUID();
  const storageKey = `chromatograms/${input.workspaceId}/${id}`;

  let traceColumns: Pick<
    Chromatogram,
    'traceTime' | 'traceSignal' | 'points' | 'peaks' | 'processing' | 'assignments'
  > = {
    traceTime: null,
    traceSignal: null,
    points: 0,
    peaks: [],
    processing: null,
    assignments: {},
  };
  if (read.kind === 'trace') {
    const { peaks, processing } = await integrate(read.timeMin, read.signal, null, read.warnings);
    const document = await documentOf(route, fields.revision, null);
    const allowed = new Set((document?.components ?? []).map((c) => c.id));
    const assignments = assignByRetention(
      peaks,
      await knownRetentions(route.id, fields.stepId, null),
      allowed,
    );
    traceColumns = {
      traceTime: packFloats(read.timeMin),
      traceSignal: packFloats(read.signal),
      points: read.timeMin.length,
      peaks,
      processing,
      assignments,
    };
  }

  await storage.put(storageKey, file.buffer, read.contentType);
  try {
    return await withTransaction(async (transaction) => {
      const created = await Chromatogram.create(
        {
          id,
          workspaceId: input.workspaceId,
          routeId: route.id,
          stepId: fields.stepId,
          revision: fields.revision,
          sampleName: fields.sampleName,
          takenAt: fields.takenAt
            ? new Date(fields.takenAt)
            : read.kind === 'trace' && read.takenAt
              ? new Date(read.takenAt)
              : null,
          methodNote: fields.methodNote,
          kind: read.kind,
          contentType: read.contentType,
          fileName: safeFileName(file.originalName, read.format),
          sizeBytes: file.buffer.length,
          storageKey,
          format: read.format,
          signalName: read.kind === 'trace' ? read.signalName : null,
          signals: read.kind === 'trace' ? read.signals : [],
          ...traceColumns,
          integration: null,
          createdById: input.actorId,
        },
        { transaction },
      );
      await recordAudit(
        {
          workspaceId: input.workspaceId,
          actorId: input.actorId,
          action: 'chromatogram.upload',
          entityType: 'chromatogram',
          entityId: id,
          after: {
            routeId: route.id,
            stepId: fields.stepId,
            revision: fields.revision,
            sampleName: fields.sampleName,
            kind: read.kind,
            fileName: created.fileName,
            sizeBytes: created.sizeBytes,
            peaks: traceColumns.peaks.length,
          },
        },
        transaction,
      );
      return created;
    });
  } catch (error) {
    await storage.delete(storageKey).catch((cleanup: unknown) => log(cleanup));
    throw error;
  }
}

/** The name shown and given to downloads: the uploaded name without folders or odd characters. */
export function safeFileName(original: string, format: string): string {
  const base = original.split(/[\\/]/).pop() ?? '';
  const cleaned = Array.from(base, (c) =>
    c.charCodeAt(0) < 0x20 || c.charCodeAt(0) === 0x7f || '"<>|*?:'.includes(c) ? '_' : c,
  )
    .join('')
    .trim()
    .slice(0, 200);
  return cleaned || `chromatogram.${format}`;
}

// ---------------------------------------------------------------- reading

export async function loadChromatogram(
  route: Route,
  id: string,
  options: { withTrace: boolean },
  transaction: Transaction | null,
): Promise<Chromatogram> {
  const found = await Chromatogram.findOne({
    where: { id, routeId: route.id, workspaceId: route.workspaceId },
    attributes: options.withTrace ? undefined : (SUMMARY_ATTRIBUTES as never),
    include: withCreator,
    transaction,
  });
  if (!found) throw notFound();
  return found;
}

const CHROMATOGRAM_ORDERS = byCreation('Chromatogram');

/**
 * One page of a route's samples (of one step with `stepId`), oldest first by
 * default (chromatograms_route_idx, chromatograms_route_step_idx serve both
 * orders); `q` matches part of the sample name (chromatograms_sample_name_trgm_idx).
 */
export async function listChromatograms(
  route: Route,
  query: {
    stepId?: string;
    q?: string;
    sort?: 'oldest' | 'newest';
    limit: number;
    cursor?: string;
  },
  transaction: Transaction | null,
): Promise<{ items: Chromatogram[]; nextCursor: string | null }> {
  const order = CHROMATOGRAM_ORDERS[query.sort ?? 'oldest'];
  const conditions: WhereOptions[] = [{ routeId: route.id, workspaceId: route.workspaceId }];
  if (query.stepId) conditions.push({ stepId: query.stepId });
  if (query.q)
    conditions.push(
      await matchingRows(
        {
          model: 'Chromatogram',
          table: 'chromatograms',
          expressions: [(t) => `${t}.sample_name`],
        },
        query.q,
      ),
    );
  if (query.cursor) conditions.push(afterCursor(order, query.cursor));
  const rows = await Chromatogram.findAll({
    where: { [Op.and]: conditions },
    attributes: { exclude: [...SUMMARY_ATTRIBUTES.exclude], include: keyAttributes(order) },
    include: withCreator,
    order: keyOrder(order),
    limit: query.limit + 1,
    subQuery: false,
    transaction,
  });
  return pageOf(rows, query.limit, order);
}

export async function readStoredFile(
  chromatogram: Chromatogram,
  storage: FileStorage,
): Promise<Buffer> {
  return storage.get(chromatogram.storageKey);
}

// ---------------------------------------------------------------- editing

/**
 * Re-integrates with hand-set windows (or automatically again when they are
 * cleared) and sets the assignments. Without new assignments, the earlier
 * ones follow their peaks by retention time.
 */
export async function updateChromatogram(
  chromatogram: Chromatogram,
  route: Route,
  change: ChromatogramUpdate,
  actorId: string,
  transaction: Transaction | null,
): Promise<Chromatogram> {
  refuseArchived(route);
  const before = {
    integration: chromatogram.integration,
    assignments: chromatogram.assignments,
  };
  const document = await documentOf(route, chromatogram.revision, transaction);
  const components = new Set((document?.components ?? []).map((c) => c.id));

  if (change.integration !== undefined) {
    if (chromatogram.kind !== 'trace')
      throw validationFailed([
        { path: 'integration', message: 'A PDF or image has no trace to integrate.' },
      ]);
    const windows = change.integration?.length
      ? [...change.integration].sort((a, b) => a.startMin - b.startMin)
      : null;
    const oldPeaks = chromatogram.peaks;
    const oldAssignments = chromatogram.assignments;
    const { peaks, processing } = await integrate(
      unpackFloats(chromatogram.traceTime!),
      unpackFloats(chromatogram.traceSignal!),
      windows,
      chromatogram.processing?.readWarnings ?? [],
    );
    chromatogram.peaks = peaks;
    chromatogram.processing = processing;
    chromatogram.integration = windows;
    chromatogram.assignments = assignByRetention(
      peaks,
      Object.entries(oldAssignments).flatMap(([index, componentId]) => {
        const peak = oldPeaks[Number(index)];
        return peak ? [{ retentionMin: peak.retentionMin, componentId }] : [];
      }),
      components,
    );
  }

  if (change.assignments !== undefined) {
    const problems: Array<{ path: string; message: string }> = [];
    const used = new Map<string, string>();
    for (const [index, componentId] of Object.entries(change.assignments)) {
      if (Number(index) >= chromatogram.peaks.length)
        problems.push({
          path: `assignments.${index}`,
          message: `There is no peak ${Number(index) + 1}; this sample has ${chromatogram.peaks.length}.`,
        });
      else if (!components.has(componentId))
        problems.push({
          path: `assignments.${index}`,
          message: 'The route has no such component.',
        });
      else if (used.has(componentId))
        problems.push({
          path: `assignments.${index}`,
          message: `This component is already assigned to peak ${Number(used.get(componentId)) + 1}.`,
        });
      used.set(componentId, index);
    }
    if (problems.length) throw validationFailed(problems);
    chromatogram.assignments = Object.fromEntries(
      Object.entries(change.assignments).map(([index, componentId]) => [
        String(Number(index)),
        componentId,
      ]),
    );
  }

  chromatogram.changed('peaks', true);
  chromatogram.changed('assignments', true);
  await chromatogram.save({ transaction });
  await recordAudit(
    {
      workspaceId: chromatogram.workspaceId as string,
      actorId,
      action: 'chromatogram.update',
      entityType: 'chromatogram',
      entityId: chromatogram.id,
      before,
      after: { integration: chromatogram.integration, assignments: chromatogram.assignments },
    },
    transaction,
  );
  return chromatogram;
}

export async function deleteChromatogram(
  chromatogram: Chromatogram,
  route: Route,
  actorId: string,
  storage: FileStorage,
  log: (error: unknown) => void,
  transaction: Transaction,
): Promise<void> {
  refuseArchived(route);
  const key = chromatogram.storageKey;
  await chromatogram.destroy({ transaction });
  await recordAudit(
    {
      workspaceId: chromatogram.workspaceId as string,
      actorId,
      action: 'chromatogram.delete',
      entityType: 'chromatogram',
      entityId: chromatogram.id,
      before: {
        routeId: route.id,
        stepId: chromatogram.stepId,
        sampleName: chromatogram.sampleName,
        fileName: chromatogram.fileName,
      },
    },
    transaction,
  );
  // The file goes once the row is gone for good; a rolled-back deletion keeps both.
  transaction.afterCommit(() => {
    storage.delete(key).catch((error: unknown) => log(error));
  });
}

// ---------------------------------------------------------------- presenting

function presentPeaks(
  peaks: StoredPeak[],
  assignments: Record<string, string>,
): ChromatogramPeak[] {
  return peaks.map((p, index) => {
    const row: ChromatogramPeak = {
      retentionMin: p.retentionMin,
      height: p.height,
      area: p.area,
      areaPct: p.areaPct,
      widthHalfMin: p.widthHalfMin,
    };
    if (p.plates !== null) row.plates = p.plates;
    if (p.symmetry !== null) row.symmetry = p.symmetry;
    if (p.resolution !== null) row.resolution = p.resolution;
    const componentId = assignments[String(index)];
    if (componentId) row.componentId = componentId;
    return row;
  });
}

export function presentCreated(c: Chromatogram): ChromatogramCreated {
  return { id: c.id, stepId: c.stepId, kind: c.kind, peaks: presentPeaks(c.peaks, c.assignments) };
}

export function presentChromatogramSummary(c: Chromatogram): ChromatogramSummary {
  return {
    id: c.id,
    routeId: c.routeId as string,
    stepId: c.stepId,
    revision: c.revision,
    sampleName: c.sampleName,
    takenAt: c.takenAt ? c.takenAt.toISOString() : null,
    methodNote: c.methodNote,
    kind: c.kind,
    contentType: c.contentType,
    fileName: c.fileName,
    sizeBytes: c.sizeBytes,
    format: c.format,
    signalName: c.signalName,
    signals: c.signals,
    points: c.points,
    peaks: presentPeaks(c.peaks, c.assignments),
    createdAt: c.createdAt.toISOString(),
    createdBy: c.createdBy ? { id: c.createdBy.id, name: c.createdBy.name } : null,
  };
}

export async function presentChromatogramDetail(
  c: Chromatogram,
  full: boolean,
): Promise<ChromatogramDetail> {
  const { decimateTrace } = await traceProcessing();
  let trace: ChromatogramDetail['trace'] = null;
  let decimated = false;
  if (c.kind === 'trace' && c.traceTime && c.traceSignal) {
    const t = unpackFloats(c.traceTime);
    const y = unpackFloats(c.traceSignal);
    trace = full ? { timeMin: Array.from(t), signal: Array.from(y) } : decimateTrace(t, y);
    decimated = trace.timeMin.length < t.length;
  }
  const processing = c.processing;
  return {
    ...presentChromatogramSummary(c),
    limits: c.peaks.map((p) => ({ startMin: p.startMin, endMin: p.endMin })),
    peakBaselines: c.peaks.map((p) => ({ start: p.baselineStart, end: p.baselineEnd })),
    integrationMode: processing?.integration ?? 'automatic',
    assignments: c.assignments,
    warnings: processing ? [...processing.readWarnings, ...processing.warnings] : [],
    noise: processing?.noise ?? null,
    baseline: processing?.baseline ?? null,
    trace,
    decimated,
    updatedAt: c.updatedAt.toISOString(),
  };
}
