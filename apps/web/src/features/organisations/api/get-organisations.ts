import type { Organisation } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { organisationKeys } from '../../../lib/query-keys';

export const getOrganisations = (signal?: AbortSignal) =>
  apiClient
    .get<{ organisations: Organisation[] }>('/api/organisations', signal)
    .then((body) => body.organisations);

export const organisationsQueryOptions = () =>
  queryOptions({
    queryKey: organisationKeys.list(),
    queryFn: ({ signal }) => getOrganisations(signal),
  });

export function useOrganisations({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...organisationsQueryOptions(), enabled });
}
