import type { GrantSignoffInput, SignoffDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const grantSignoff = (input: GrantSignoffInput) => apiClient.post<{ signoff: SignoffDto }>('/api/training/signoffs', input);

export function useGrantSignoff() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: grantSignoff, onSuccess: async () => { await queryClient.invalidateQueries({ queryKey: trainingKeys.all }); } });
}
