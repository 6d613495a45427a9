import { useQueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { Outlet, useNavigate } from 'react-router-dom';
import { toast } from 'sonner';
import { AccountMenu } from '../../components/layout/account-menu';
import { AppShell } from '../../components/layout/app-shell';
import { navigationFor } from '../../config/navigation';
import { paths } from '../../config/paths';
import { useFacility } from '../../features/facility/api/get-facility';
import { useLogout } from '../../features/auth/api/logout';
import { isApiError } from '../../lib/api-client';
import { useSignedInUser } from '../../lib/auth';
import { authKeys } from '../../lib/query-keys';
import { useTheme } from '../../lib/theme';

/** The signed-in frame: header, role-aware navigation, and the page below. Rendered inside RequireAuth. */
export function AppRoot() {
  const user = useSignedInUser();
  const facility = useFacility();
  const logout = useLogout();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const { theme, toggle } = useTheme();
  const navigation = useMemo(() => navigationFor(user.role), [user.role]);

  // signed-out first, so the guard unmounts this shell before the cache is emptied under it
  const leave = async () => {
    queryClient.setQueryData(authKeys.me(), null);
    await navigate(paths.signIn, { replace: true });
    queryClient.clear();
    queryClient.setQueryData(authKeys.me(), null);
  };

  const signOut = () =>
    logout.mutate(undefined, {
      onSuccess: () => void leave(),
      onError: (error) => {
        if (isApiError(error) && error.status === 401) void leave();
        else toast.error(error.message);
      },
    });

  return (
    <AppShell
      facilityName={facility.data?.name}
      navigation={navigation}
      account={
        <AccountMenu
          user={user}
          theme={theme}
          onToggleTheme={toggle}
          onSignOut={signOut}
          signingOut={logout.isPending}
        />
      }
    >
      <Outlet />
    </AppShell>
  );
}
