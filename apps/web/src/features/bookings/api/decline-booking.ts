import type { BookingDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Declines a request with a reason for the requester (staff). */
export const declineBooking = ({ id, reason }: { id: string; reason: string }) =>
  apiClient.post<{ booking: BookingDto }>(`/api/bookings/${encodeURIComponent(id)}/decline`, { reason });

export function useDeclineBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: declineBooking,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
