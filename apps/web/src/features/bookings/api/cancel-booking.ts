import type { BookingDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Cancels; the answer carries detail.cancellationFeePercent (0, 50 or 100). */
export const cancelBooking = ({ id, reason }: { id: string; reason?: string }) =>
  apiClient.post<{ booking: BookingDto }>(`/api/bookings/${encodeURIComponent(id)}/cancel`, reason ? { reason } : {});

export function useCancelBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelBooking,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
