import type { TrainingPersonDto } from '@femtoslot/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const searchPeople = (q: string, signal?: AbortSignal) =>
  apiClient.get<{ people: TrainingPersonDto[] }>(`/api/training/people?q=${encodeURIComponent(q)}`, signal).then((b) => b.people);

export const peopleSearchQueryOptions = (q: string) =>
  queryOptions({ queryKey: trainingKeys.people(q), queryFn: ({ signal }) => searchPeople(q, signal), placeholderData: keepPreviousData });

export function usePeopleSearch(q: string, enabled: boolean) {
  return useQuery({ ...peopleSearchQueryOptions(q), enabled });
}
