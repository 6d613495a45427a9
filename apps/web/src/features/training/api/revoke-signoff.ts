import type { SignoffDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const revokeSignoff = ({ id, reason }: { id: string; reason: string }) =>
  apiClient.post<{ signoff: SignoffDto }>(`/api/training/signoffs/${encodeURIComponent(id)}/revoke`, { reason });

export function useRevokeSignoff() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: revokeSignoff, onSuccess: async () => { await queryClient.invalidateQueries({ queryKey: trainingKeys.all }); } });
}
