import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from '../../../lib/query-keys';
import type { PeriodDetail } from '../types';

/** A period with its statement: live while open, frozen once a close has started; and its latest close job. */
export const getPeriod = (id: string, signal?: AbortSignal) =>
  apiClient.get<PeriodDetail>(`/api/billing/periods/${encodeURIComponent(id)}`, signal);

export const periodQueryOptions = (id: string) =>
  queryOptions({ queryKey: billingKeys.period(id), queryFn: ({ signal }) => getPeriod(id, signal) });

export function usePeriod(id: string | null) {
  return useQuery({ ...periodQueryOptions(id ?? ''), enabled: id !== null });
}
