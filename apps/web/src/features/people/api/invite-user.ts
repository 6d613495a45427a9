import type { InviteInput, User } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { userKeys } from '../../../lib/query-keys';

export const inviteUser = (input: InviteInput) => apiClient.post<{ user: User }>('/api/users/invitations', input);

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteUser,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: userKeys.all });
    },
  });
}
