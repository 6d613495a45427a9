import { MutationCache, QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { type ReactNode, useState } from 'react';
import { Toaster } from 'sonner';
import { isApiError } from '../lib/api-client';
import { authKeys } from '../lib/query-keys';
import { ThemeProvider, useTheme } from '../lib/theme';

function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    // a 401 anywhere means the session ended: mark signed out so the guard sends them to sign-in
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isApiError(error) && error.status === 401 && query.queryKey[1] !== 'me') {
          client.setQueryData(authKeys.me(), null);
        }
      },
    }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isApiError(error) && error.status === 401 && error.code === 'unauthenticated') {
          client.setQueryData(authKeys.me(), null);
        }
      },
    }),
    defaultOptions: {
      queries: { retry: shouldRetry, refetchOnWindowFocus: false, staleTime: 30_000 },
      mutations: { retry: false },
    },
  });
  return client;
}

function ThemedToaster() {
  const { theme } = useTheme();
  return <Toaster position="bottom-right" richColors closeButton theme={theme} />;
}

/** `queryClient` is the one the router's loaders prefetch into; without it the provider makes its own. */
export function AppProvider({ children, queryClient: given }: { children: ReactNode; queryClient?: QueryClient }) {
  const [queryClient] = useState(() => given ?? createQueryClient());
  return (
    <ThemeProvider>
      <QueryClientProvider client={queryClient}>
        {children}
        <ThemedToaster />
      </QueryClientProvider>
    </ThemeProvider>
  );
}
