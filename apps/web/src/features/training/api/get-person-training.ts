import type { PersonTrainingDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const getPersonTraining = (id: string, signal?: AbortSignal) =>
  apiClient.get<PersonTrainingDto>(`/api/training/people/${encodeURIComponent(id)}`, signal);

export const personTrainingQueryOptions = (id: string) =>
  queryOptions({ queryKey: trainingKeys.person(id), queryFn: ({ signal }) => getPersonTraining(id, signal) });

export function usePersonTraining(id: string | null) {
  return useQuery({ ...personTrainingQueryOptions(id ?? ''), enabled: id !== null });
}
