import type { BookingCheckDto, CreateBookingInput } from '@femtoslot/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Dry run of a request: nothing is written. */
export const checkBooking = (body: CreateBookingInput) => apiClient.post<BookingCheckDto>('/api/bookings/check', body);

export const bookingCheckQueryOptions = (body: CreateBookingInput) =>
  queryOptions({
    queryKey: bookingKeys.check(body),
    queryFn: () => checkBooking(body),
    placeholderData: keepPreviousData,
    staleTime: 10_000,
  });

export function useBookingCheck(body: CreateBookingInput | null) {
  return useQuery({ ...bookingCheckQueryOptions(body ?? ({} as CreateBookingInput)), enabled: body !== null });
}
