import type { SetPasswordInput, User } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export const acceptInvitation = (input: SetPasswordInput) =>
  apiClient.post<{ user: User }>('/api/auth/accept-invitation', input);

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: ({ user }) => {
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
