import type { UpdateUserInput, User } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys, userKeys } from '../../../lib/query-keys';

export interface UpdateUserVariables {
  id: string;
  changes: UpdateUserInput;
}

export const updateUser = ({ id, changes }: UpdateUserVariables) =>
  apiClient.patch<{ user: User }>(`/api/users/${encodeURIComponent(id)}`, changes);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: async () => {
      // the signed-in person may have changed their own role
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: userKeys.all }),
        queryClient.invalidateQueries({ queryKey: authKeys.me() }),
      ]);
    },
  });
}
