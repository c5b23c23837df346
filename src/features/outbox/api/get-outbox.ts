import { queryOptions, useQuery } from '@tanstack/react-query';
import { outboxMessageListSchema } from '@shared/schemas/outbox';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getOutbox = (signal?: AbortSignal) =>
  apiRequest(api.outbox, { schema: outboxMessageListSchema, signal });

export const getOutboxQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.outbox(), queryFn: ({ signal }) => getOutbox(signal) });

export const useOutbox = () => useQuery(getOutboxQueryOptions());
