import type { BillingPeriodInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from '../../../lib/query-keys';
import type { PeriodDetail } from '../types';

/** Creates the month's period, or answers the one there already is, with its preview. */
export const openPeriod = (input: BillingPeriodInput) => apiClient.post<PeriodDetail>('/api/billing/periods', input);

export function useOpenPeriod() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: openPeriod,
    onSuccess: async (detail) => {
      queryClient.setQueryData(billingKeys.period(detail.period.id), detail);
      await queryClient.invalidateQueries({ queryKey: billingKeys.periods() });
    },
  });
}
