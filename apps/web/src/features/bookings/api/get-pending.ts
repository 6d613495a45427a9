import type { BookingDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Requests awaiting staff approval. */
export const getPendingBookings = (signal?: AbortSignal) =>
  apiClient.get<{ bookings: BookingDto[] }>('/api/bookings/pending', signal).then((body) => body.bookings);

export const pendingBookingsQueryOptions = () =>
  queryOptions({ queryKey: bookingKeys.pending(), queryFn: ({ signal }) => getPendingBookings(signal) });

export function usePendingBookings(enabled = true) {
  return useQuery({ ...pendingBookingsQueryOptions(), enabled });
}
