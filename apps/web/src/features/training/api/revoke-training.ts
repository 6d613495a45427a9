import type { TrainingRecordDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const revokeTraining = ({ id, reason }: { id: string; reason: string }) =>
  apiClient.post<{ record: TrainingRecordDto }>(`/api/training/records/${encodeURIComponent(id)}/revoke`, { reason });

export function useRevokeTraining() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: revokeTraining, onSuccess: async () => { await queryClient.invalidateQueries({ queryKey: trainingKeys.all }); } });
}
