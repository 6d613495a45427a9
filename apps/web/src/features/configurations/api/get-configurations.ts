import type { OutputKind, RateClass } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { configurationKeys } from '../../../lib/query-keys';

export interface Configuration {
  id: string;
  instrumentId: string;
  key: string;
  name: string;
  outputKind: OutputKind;
  minNm: number;
  maxNm: number;
  defaultNm: number;
  rateClass: RateClass;
  requiredOd: number;
  retuneMinutesPerNm: number;
}

export const getConfigurations = (instrumentId?: string, signal?: AbortSignal) =>
  apiClient
    .get<{ configurations: Configuration[] }>(
      instrumentId ? `/api/configurations?instrumentId=${encodeURIComponent(instrumentId)}` : '/api/configurations',
      signal,
    )
    .then((body) => body.configurations);

export const configurationsQueryOptions = (instrumentId?: string) =>
  queryOptions({
    queryKey: configurationKeys.list(instrumentId),
    queryFn: ({ signal }) => getConfigurations(instrumentId, signal),
    staleTime: 5 * 60 * 1000,
  });

export function useConfigurations(instrumentId?: string) {
  return useQuery(configurationsQueryOptions(instrumentId));
}
