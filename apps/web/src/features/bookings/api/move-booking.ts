import type { BookingDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Moves a booking (staff); 409 when a neighbour or the changeover is in the way. */
export const moveBooking = ({ id, startsAt, endsAt }: { id: string; startsAt: string; endsAt: string }) =>
  apiClient.post<{ booking: BookingDto }>(`/api/bookings/${encodeURIComponent(id)}/move`, { startsAt, endsAt });

export function useMoveBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: moveBooking,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
