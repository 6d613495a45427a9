import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from '../../../lib/query-keys';
import { type BillingJob, isJobActive } from '../types';

export const getBillingJob = (id: string, signal?: AbortSignal) =>
  apiClient.get<{ job: BillingJob }>(`/api/billing/jobs/${encodeURIComponent(id)}`, signal).then((body) => body.job);

/** Polled every second while the close is queued or running; still once it has finished. */
export const billingJobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: billingKeys.job(id),
    queryFn: ({ signal }) => getBillingJob(id, signal),
    refetchInterval: (query) => (isJobActive(query.state.data) || !query.state.data ? 1000 : false),
    staleTime: 0,
  });

export function useBillingJob(id: string | null) {
  return useQuery({ ...billingJobQueryOptions(id ?? ''), enabled: id !== null });
}
