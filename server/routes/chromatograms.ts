import { Router } from 'express';
import { z } from 'zod';
import {
  CHROMATOGRAM_LIMITS,
  chromatogramCreatedSchema,
  chromatogramDetailQuerySchema,
  chromatogramDetailSchema,
  chromatogramListQuerySchema,
  chromatogramListSchema,
  chromatogramUpdateSchema,
  chromatogramUploadFieldsSchema,
} from '@shared/schemas/chromatograms';
import { apiErrorSchema } from '@shared/schemas/errors';
import { text } from '@shared/schemas/text';
import type { AppConfig } from '../config';
import { notFound, validationFailed } from '../errors';
import { readMultipart } from '../http/multipart';
import { defineRoute, withTransaction } from '../http/route';
import { zodIssuesToDetails } from '../http/validation';
import { authorize } from '../policies';
import {
  deleteChromatogram,
  listChromatograms,
  loadChromatogram,
  presentChromatogramDetail,
  presentChromatogramSummary,
  presentCreated,
  readStoredFile,
  updateChromatogram,
  uploadChromatogram,
} from '../services/chromatograms';
import { loadWorkspace } from '../services/members';
import { loadRoute } from '../services/routes';
import { StoredFileMissing, type FileStorage } from '../storage';

const routeParams = z.object({ workspaceId: z.uuid(), routeId: z.uuid() });
const chromatogramParams = routeParams.extend({ chromatogramId: z.uuid() });
const notFoundResponse = {
  description: 'No such workspace, route or sample, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = {
  description: 'Only chemists and admins upload, edit or delete samples.',
  schema: apiErrorSchema,
};
const archivedResponse = {
  description: 'route_archived: the route is archived.',
  schema: apiErrorSchema,
};

/** The upload form as the OpenAPI document describes it. */
const uploadFormSchema = z.object({
  file: text().openapi({
    type: 'string',
    format: 'binary',
    description:
      'CSV/TSV text (time and signal columns), an ANDI/AIA netCDF chromatogram, or a PDF or image kept as it is. The type is read from the content.',
  }),
  stepId: text().openapi({ description: 'A step of the route (the sampling point).' }),
  revision: text()
    .optional()
    .openapi({ description: 'The revision number the sample belongs to; recorded when given.' }),
  sampleName: text(),
  takenAt: text().optional().openapi({ description: 'ISO 8601 date-time with offset.' }),
  signal: text()
    .optional()
    .openapi({ description: 'Signal column to read from a multi-signal text file.' }),
  methodNote: text().optional(),
});

const megabytes = (bytes: number) =>
  `${Number((bytes / 1024 / 1024).toFixed(bytes < 1024 * 1024 ? 3 : 1))} MB`;

export function chromatogramsRouter(
  config: AppConfig,
  storage: FileStorage,
  log: (error: unknown) => void,
): Router {
  const router = Router();
  const base = '/workspaces/{workspaceId}/routes/{routeId}/chromatograms';
  const maxBytes = config.chromatogramMaxBytes ?? CHROMATOGRAM_LIMITS.defaultMaxBytes;

  defineRoute(router, {
    method: 'post',
    path: base,
    summary:
      'Attach an IPC sample to a step (chemists and admins): a chromatogram (CSV/TSV or ANDI netCDF) is read and integrated; a PDF or image is kept as it is.',
    tags: ['chromatograms'],
    auth: true,
    params: routeParams,
    multipart: uploadFormSchema,
    responses: {
      201: { description: 'Stored, with its peak table.', schema: chromatogramCreatedSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: archivedResponse,
      413: { description: 'file_too_large: above the size limit.', schema: apiErrorSchema },
      415: {
        description: 'unsupported_file: the content is of no type the server reads.',
        schema: apiErrorSchema,
      },
      422: {
        description: 'unreadable_file: the file cannot be read, or has no data rows.',
        schema: apiErrorSchema,
      },
    },
    // The file is stored before its row is written; no transaction is held during the upload.
    transaction: false,
    handle: async ({ req, res, actor, params }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'chromatogram.upload', { workspaceId: workspace.id });
      const route = await loadRoute(workspace.id, params.routeId, null);
      const form = await readMultipart(req, res, {
        fileField: 'file',
        maxBytes,
        describeLimit: megabytes(maxBytes),
      });
      const parsed = chromatogramUploadFieldsSchema.safeParse(form.fields);
      const problems = parsed.success ? [] : zodIssuesToDetails(parsed.error.issues, []);
      if (!form.file) problems.unshift({ path: 'file', message: 'Choose a file to upload.' });
      if (problems.length || !parsed.success || !form.file) throw validationFailed(problems);
      const created = await uploadChromatogram(
        {
          workspaceId: workspace.id,
          route,
          actorId: actor.userId,
          fields: parsed.data,
          file: form.file,
        },
        storage,
        withTransaction,
        log,
      );
      return { status: 201, body: presentCreated(created) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: base,
    summary:
      'One page of the IPC samples of a route, or of one step (stepId), in the order they were uploaded (sort=newest for newest first); q matches part of the sample name; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['chromatograms'],
    auth: true,
    params: routeParams,
    query: chromatogramListQuerySchema,
    responses: {
      200: { description: 'A page of samples.', schema: chromatogramListSchema },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'chromatogram.list', { workspaceId: workspace.id });
      const route = await loadRoute(workspace.id, params.routeId, transaction);
      const page = await listChromatograms(route, query, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentChromatogramSummary), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: `${base}/{chromatogramId}`,
    summary:
      'One sample with its peak table, integration limits, assignments and the trace (at most 5,000 points unless full=1).',
    tags: ['chromatograms'],
    auth: true,
    params: chromatogramParams,
    query: chromatogramDetailQuerySchema,
    responses: {
      200: { description: 'The sample.', schema: chromatogramDetailSchema },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'chromatogram.read', { workspaceId: workspace.id });
      const route = await loadRoute(workspace.id, params.routeId, transaction);
      const chromatogram = await loadChromatogram(
        route,
        params.chromatogramId,
        { withTrace: true },
        transaction,
      );
      return { status: 200, body: await presentChromatogramDetail(chromatogram, query.full) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: `${base}/{chromatogramId}/file`,
    summary: 'The uploaded file as it was received.',
    tags: ['chromatograms'],
    auth: true,
    params: chromatogramParams,
    responses: {
      200: { description: 'The original file.' },
      404: notFoundResponse,
    },
    transaction: false,
    handle: async ({ actor, params }) => {
      const workspace = await loadWorkspace(params.workspaceId, null);
      authorize(actor, 'chromatogram.read', { workspaceId: workspace.id });
      const route = await loadRoute(workspace.id, params.routeId, null);
      const chromatogram = await loadChromatogram(
        route,
        params.chromatogramId,
        { withTrace: false },
        null,
      );
      let content: Buffer;
      try {
        content = await readStoredFile(chromatogram, storage);
      } catch (error) {
        if (error instanceof StoredFileMissing) {
          log(error);
          throw notFound('The stored file');
        }
        throw error;
      }
      return {
        status: 200,
        file: {
          contentType: chromatogram.contentType,
          filename: chromatogram.fileName,
          content,
        },
      };
    },
  });

  defineRoute(router, {
    method: 'patch',
    path: `${base}/{chromatogramId}`,
    summary:
      'Set hand-made integration limits (re-integrates; null or [] goes back to automatic) and the peaks assigned to route components (chemists and admins).',
    tags: ['chromatograms'],
    auth: true,
    params: chromatogramParams,
    body: chromatogramUpdateSchema,
    responses: {
      200: { description: 'Updated, with the decimated trace.', schema: chromatogramDetailSchema },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: archivedResponse,
      422: {
        description: 'unreadable_file: the limits hold nothing to integrate.',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ actor, params, body, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'chromatogram.update', { workspaceId: workspace.id });
      const route = await loadRoute(workspace.id, params.routeId, transaction);
      const chromatogram = await loadChromatogram(
        route,
        params.chromatogramId,
        { withTrace: true },
        transaction,
      );
      const updated = await updateChromatogram(
        chromatogram,
        route,
        body,
        actor.userId,
        transaction,
      );
      return { status: 200, body: await presentChromatogramDetail(updated, false) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: `${base}/{chromatogramId}`,
    summary: 'Delete a sample and its file (chemists and admins).',
    tags: ['chromatograms'],
    auth: true,
    params: chromatogramParams,
    responses: {
      204: { description: 'Deleted.' },
      403: forbiddenResponse,
      404: notFoundResponse,
      409: archivedResponse,
    },
    handle: async ({ actor, params, transaction }) => {
      const workspace = await loadWorkspace(params.workspaceId, transaction);
      authorize(actor, 'chromatogram.delete', { workspaceId: workspace.id });
      const route = await loadRoute(workspace.id, params.routeId, transaction);
      const chromatogram = await loadChromatogram(
        route,
        params.chromatogramId,
        { withTrace: false },
        transaction,
      );
      await deleteChromatogram(chromatogram, route, actor.userId, storage, log, transaction!);
      return { status: 204 };
    },
  });

  return router;
}
