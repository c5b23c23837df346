import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { structurePreviewSchema, type StructurePreviewRequest } from '@shared/schemas/compounds';
import { apiRequest, isApiError } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const previewStructure = (input: StructurePreviewRequest, signal?: AbortSignal) =>
  apiRequest(api.structurePreview, {
    method: 'POST',
    body: input,
    schema: structurePreviewSchema,
    signal,
  });

export const previewStructureQueryOptions = (input: StructurePreviewRequest | null) =>
  queryOptions({
    queryKey: queryKeys.structurePreview(input),
    queryFn: ({ signal }) => previewStructure(input!, signal),
    enabled: input !== null,
    staleTime: Infinity,
    // An unparsable structure (422) is an answer, not a hiccup: do not retry it.
    retry: (count, error) => !isApiError(error, 422) && count < 2,
    placeholderData: keepPreviousData,
  });

/** The preview of what is typed; pass the debounced structure, or null when there is none. */
export const useStructurePreview = (input: StructurePreviewRequest | null) =>
  useQuery(previewStructureQueryOptions(input));
