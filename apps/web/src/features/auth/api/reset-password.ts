import type { SetPasswordInput, User } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export const resetPassword = (input: SetPasswordInput) =>
  apiClient.post<{ user: User }>('/api/auth/reset-password', input);

export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    onSuccess: ({ user }) => {
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
