import { queryOptions, useQuery } from '@tanstack/react-query';
import { solventDetailSchema } from '@shared/schemas/solvents';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getSolvent = (id: string, signal?: AbortSignal) =>
  apiRequest(api.solvent(id), { schema: solventDetailSchema, signal });

export const getSolventQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.solvents.detail(id),
    queryFn: ({ signal }) => getSolvent(id, signal),
    staleTime: Infinity,
  });

export const useSolvent = (id: string | null) =>
  useQuery({ ...getSolventQueryOptions(id ?? ''), enabled: id !== null });
