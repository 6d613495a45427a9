import type { BookingDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

/** Approves a requested booking (staff). */
export const approveBooking = ({ id }: { id: string }) =>
  apiClient.post<{ booking: BookingDto }>(`/api/bookings/${encodeURIComponent(id)}/approve`, {});

export function useApproveBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: approveBooking,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
