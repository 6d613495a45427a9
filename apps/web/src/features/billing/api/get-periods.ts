import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from '../../../lib/query-keys';
import type { BillingPeriod } from '../types';

/** Every billing period, newest month first (finance and admin). */
export const getPeriods = (signal?: AbortSignal) =>
  apiClient.get<{ periods: BillingPeriod[] }>('/api/billing/periods', signal).then((body) => body.periods);

export const periodsQueryOptions = () => queryOptions({ queryKey: billingKeys.periods(), queryFn: ({ signal }) => getPeriods(signal) });

export function usePeriods(enabled = true) {
  return useQuery({ ...periodsQueryOptions(), enabled });
}
