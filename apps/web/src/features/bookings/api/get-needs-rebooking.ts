import type { BookingDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Displaced bookings not yet rebooked, each with three alternatives. */
export const getNeedsRebooking = (signal?: AbortSignal) =>
  apiClient.get<{ bookings: BookingDto[] }>('/api/bookings/needs-rebooking', signal).then((body) => body.bookings);

export const needsRebookingQueryOptions = () =>
  queryOptions({ queryKey: bookingKeys.needsRebooking(), queryFn: ({ signal }) => getNeedsRebooking(signal) });

export function useNeedsRebooking(enabled = true) {
  return useQuery({ ...needsRebookingQueryOptions(), enabled });
}
