import type { FacilityPoliciesPatch } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys, facilityKeys } from '../../../lib/query-keys';
import type { FacilityDetail } from './get-facility';

/** PATCH /api/facility/policies (admin): any subset of the policies and the session-log window. */
export const updateFacilityPolicies = (patch: FacilityPoliciesPatch) =>
  apiClient.patch<{ facility: FacilityDetail }>('/api/facility/policies', patch).then((body) => body.facility);

export function useUpdateFacilityPolicies() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateFacilityPolicies,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: facilityKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      ]);
    },
  });
}
