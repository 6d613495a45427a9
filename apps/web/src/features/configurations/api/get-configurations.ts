import type { ConfigurationDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { configurationKeys } from '../../../lib/query-keys';

/** Shared with the API so the two cannot drift. */
export type Configuration = ConfigurationDto;

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
