import type { Facility, FacilityPolicies } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { facilityKeys } from '../../../lib/query-keys';

export type { FacilityPolicies };

/** The facility as GET /api/facility answers it; policies arrived with the booking API, the session-log window later. */
export type FacilityDetail = Facility & { policies?: FacilityPolicies; usageWindowMinutes?: number };

export const getFacility = (signal?: AbortSignal) =>
  apiClient.get<{ facility: FacilityDetail }>('/api/facility', signal).then((body) => body.facility);

export const facilityQueryOptions = () =>
  queryOptions({
    queryKey: facilityKeys.detail(),
    queryFn: ({ signal }) => getFacility(signal),
    staleTime: 30 * 60 * 1000,
  });

export function useFacility() {
  return useQuery(facilityQueryOptions());
}
