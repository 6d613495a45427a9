import type { RecordTrainingInput, TrainingRecordDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const recordTraining = (input: RecordTrainingInput) => apiClient.post<{ record: TrainingRecordDto }>('/api/training/records', input);

export function useRecordTraining() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: recordTraining, onSuccess: async () => { await queryClient.invalidateQueries({ queryKey: trainingKeys.all }); } });
}
