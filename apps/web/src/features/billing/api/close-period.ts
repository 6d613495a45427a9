import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from '../../../lib/query-keys';
import type { BillingJob, BillingPeriod } from '../types';

export interface CloseAnswer {
  period: BillingPeriod;
  job: BillingJob | null;
  /** true (202) when this call queued a close; false (200) when one was already running or the period is closed */
  started: boolean;
}

export interface CloseRequest {
  periodId: string;
  /** the number of left-out bookings the user has read and accepts; needed when there are any */
  leftOutCount?: number;
}

export const closePeriod = ({ periodId, leftOutCount }: CloseRequest) =>
  apiClient.post<CloseAnswer>(`/api/billing/periods/${encodeURIComponent(periodId)}/close`, leftOutCount === undefined ? {} : { leftOutCount });

export function useClosePeriod() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: closePeriod,
    onSuccess: async (answer) => {
      if (answer.job) queryClient.setQueryData(billingKeys.job(answer.job.id), answer.job);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: billingKeys.period(answer.period.id) }),
        queryClient.invalidateQueries({ queryKey: billingKeys.periods() }),
      ]);
    },
  });
}
