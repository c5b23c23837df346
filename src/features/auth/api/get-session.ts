import { queryOptions, useQuery } from '@tanstack/react-query';
import { sessionSchema, type Session } from '@shared/schemas/session';
import { apiRequest, isApiError } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';
import { markSessionEnded } from '../session-end';

/** The signed-in session, or null when signed out (the API answers 401). */
export async function getSession(signal?: AbortSignal): Promise<Session | null> {
  try {
    return await apiRequest(api.session, {
      schema: sessionSchema,
      signal,
      ignoreUnauthorized: true,
    });
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

export const getSessionQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.session(),
    queryFn: async ({ signal, client }) => {
      const session = await getSession(signal);
      // Signed in a moment ago, signed out now: the session ended on the server.
      if (!session && client.getQueryData<Session | null>(queryKeys.session())) markSessionEnded();
      return session;
    },
    staleTime: 60_000,
  });

export const useSession = () => useQuery(getSessionQueryOptions());
