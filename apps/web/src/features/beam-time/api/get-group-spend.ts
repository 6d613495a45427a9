import type { GroupSpendDto } from '@femtoslot/shared/billing/spend.schemas';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { beamTimeKeys } from '../../../lib/query-keys';

export interface GroupSpendQuery {
  organisationId?: string;
  from?: string;
}

/** A PI's group, or a member's own bookings: billed charges plus confirmed usage not billed yet. */
export const getGroupSpend = (query: GroupSpendQuery, signal?: AbortSignal) => {
  const params = new URLSearchParams(Object.entries(query).filter((e): e is [string, string] => typeof e[1] === 'string'));
  const qs = params.toString();
  return apiClient.get<GroupSpendDto>(`/api/groups/spend${qs ? `?${qs}` : ''}`, signal);
};

export const groupSpendQueryOptions = (query: GroupSpendQuery) =>
  queryOptions({ queryKey: beamTimeKeys.spend(query), queryFn: ({ signal }) => getGroupSpend(query, signal) });

export function useGroupSpend(query: GroupSpendQuery, enabled = true) {
  return useQuery({ ...groupSpendQueryOptions(query), enabled });
}
