import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export const logout = () => apiClient.post<void>('/api/auth/logout');

/** The caller clears the query cache and leaves the signed-in pages once this settles. */
export function useLogout() {
  return useMutation({ mutationFn: logout });
}
