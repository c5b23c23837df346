import { useMutation } from '@tanstack/react-query';
import {
  stepListDocumentSchema,
  type StepListFormat,
  type StepListRequest,
} from '@shared/schemas/step-list';
import { apiDownload, apiRequest } from '@/api/client';
import { api } from '@/paths';

type Where = { workspaceId: string; routeId: string; number: number };

/** The step list as JSON, parsed with the shared schema. */
export const getStepList = (where: Where, request: Omit<StepListRequest, 'format'>) =>
  apiRequest(api.stepList(where.workspaceId, where.routeId, where.number), {
    method: 'POST',
    body: { ...request, format: 'json' },
    schema: stepListDocumentSchema,
  });

export const useStepList = (where: Where) =>
  useMutation({
    mutationFn: (request: Omit<StepListRequest, 'format'>) => getStepList(where, request),
  });

/** Downloads the step list in one format as a file (the server names it). */
export const downloadStepList = (
  where: Where,
  request: Omit<StepListRequest, 'format'>,
  format: StepListFormat,
) =>
  apiDownload(api.stepList(where.workspaceId, where.routeId, where.number), {
    ...request,
    format,
  });

export const useDownloadStepList = (where: Where) =>
  useMutation({
    mutationFn: ({
      request,
      format,
    }: {
      request: Omit<StepListRequest, 'format'>;
      format: StepListFormat;
    }) => downloadStepList(where, request, format),
  });
