import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import type { Session } from '@shared/schemas/session';
import { configureApiClient, isApiError } from '@/api/client';
import { queryKeys } from '@/api/query-keys';
import { markSessionEnded } from '@/features/auth/session-end';
import { Toaster } from '@/components/toaster';
import { AppErrorBoundary } from './error-boundary';

export function createQueryClient() {
  const queryClient = new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        refetchOnWindowFocus: false,
        // Answers that will not change on a retry are shown at once.
        retry: (count, error) =>
          !(isApiError(error) && error.status >= 400 && error.status < 500) && count < 2,
      },
    },
  });
  configureApiClient({
    getCsrfToken: () => queryClient.getQueryData<Session | null>(queryKeys.session())?.csrfToken,
    onUnauthorized: () => {
      // The session ended (idle timeout, signed out elsewhere): forget it, and
      // the guard sends the person to sign in, where they are told why.
      if (queryClient.getQueryData<Session | null>(queryKeys.session())) markSessionEnded();
      queryClient.setQueryData(queryKeys.session(), null);
    },
  });
  return queryClient;
}

export function AppProvider({
  children,
  queryClient,
}: {
  children: ReactNode;
  queryClient: QueryClient;
}) {
  return (
    <AppErrorBoundary>
      <QueryClientProvider client={queryClient}>
        {children}
        <Toaster />
      </QueryClientProvider>
    </AppErrorBoundary>
  );
}
