import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiTokenListSchema } from '@shared/schemas/tokens';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getTokens = (signal?: AbortSignal) =>
  apiRequest(api.tokens, { schema: apiTokenListSchema, signal });

export const getTokensQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.tokens(), queryFn: ({ signal }) => getTokens(signal) });

export const useTokens = () => useQuery(getTokensQueryOptions());
