import type { User } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { type ReactNode, createContext, useContext } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { NotAvailable } from '../components/layout/not-available';
import { PageLoading } from '../components/ui/spinner';
import { type Area, canReach } from '../config/navigation';
import { paths } from '../config/paths';
import { apiClient, isApiError } from './api-client';
import { authKeys } from './query-keys';

/** The signed-in person, or null when the API says 401 unauthenticated (signed out is not an error). */
export async function getCurrentUser(signal?: AbortSignal): Promise<User | null> {
  try {
    const body = await apiClient.get<{ user: User }>('/api/auth/me', signal);
    return body.user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const currentUserQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getCurrentUser(signal),
    staleTime: 5 * 60 * 1000,
    retry: false,
  });

export function useCurrentUser() {
  return useQuery(currentUserQueryOptions());
}

// Handed down by RequireAuth so the shell and the pages read the same user the guard checked,
// even while a sign-out is being rendered.
const SignedInUserContext = createContext<User | null>(null);

/** For components rendered below RequireAuth, where a user is guaranteed. */
export function useSignedInUser(): User {
  const user = useContext(SignedInUserContext);
  if (!user) throw new Error('useSignedInUser used outside RequireAuth');
  return user;
}

export interface SignInRedirectState {
  from?: string;
}

export function RequireAuth({ children }: { children?: ReactNode }) {
  const location = useLocation();
  const { data: user, isPending, isError, error, refetch } = useCurrentUser();

  if (isPending) return <PageLoading label="Checking your session" />;
  if (isError) {
    return (
      <div role="alert" className="mx-auto mt-24 max-w-md rounded-xl border border-line bg-panel p-6 text-sm">
        <p className="font-semibold">Femtoslot could not check your session.</p>
        <p className="mt-1 text-ink-muted">{error.message}</p>
        <button
          type="button"
          onClick={() => void refetch()}
          className="mt-4 rounded-lg bg-accent px-3 py-1.5 font-semibold text-accent-ink hover:bg-accent-hover"
        >
          Try again
        </button>
      </div>
    );
  }
  if (!user) {
    const state: SignInRedirectState = { from: `${location.pathname}${location.search}${location.hash}` };
    return <Navigate to={paths.signIn} replace state={state} />;
  }
  return <SignedInUserContext.Provider value={user}>{children ?? <Outlet />}</SignedInUserContext.Provider>;
}

export function RequireRole({ area, children }: { area: Area; children?: ReactNode }) {
  const user = useSignedInUser();
  if (!canReach(user.role, area)) return <NotAvailable area={area} role={user.role} />;
  return children ?? <Outlet />;
}
