import type { PersonTrainingDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const getMyTraining = (signal?: AbortSignal) => apiClient.get<PersonTrainingDto>('/api/training/me', signal);

export const myTrainingQueryOptions = () => queryOptions({ queryKey: trainingKeys.me(), queryFn: ({ signal }) => getMyTraining(signal) });

export function useMyTraining() {
  return useQuery(myTrainingQueryOptions());
}
