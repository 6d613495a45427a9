import type { BookingEstimateInput } from '@femtoslot/shared';
import type { BookingEstimateDto } from '@femtoslot/shared/billing/estimate.types';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { estimateKeys } from '../../../lib/query-keys';

/** What a booking request would cost, priced by the same engine as the invoice; nothing is written. */
export const getEstimate = (body: BookingEstimateInput) =>
  apiClient.post<{ estimate: BookingEstimateDto }>('/api/bookings/estimate', body).then((r) => r.estimate);

export const estimateQueryOptions = (body: BookingEstimateInput) =>
  queryOptions({
    queryKey: estimateKeys.forRequest(body),
    queryFn: () => getEstimate(body),
    placeholderData: keepPreviousData,
    staleTime: 30_000,
    retry: false,
  });

export function useEstimate(body: BookingEstimateInput | null) {
  return useQuery({ ...estimateQueryOptions(body ?? ({} as BookingEstimateInput)), enabled: body !== null });
}
