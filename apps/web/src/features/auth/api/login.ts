import type { LoginInput, User } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export const login = (input: LoginInput) => apiClient.post<{ user: User }>('/api/auth/login', input);

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ user }) => {
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
