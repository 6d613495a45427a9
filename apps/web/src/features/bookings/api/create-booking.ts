import type { BookingDto, CreateBookingInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

export interface CreatedBooking {
  booking: BookingDto;
  changeover: { beforeMinutes: number; afterMinutes: number };
}

export const createBooking = (body: CreateBookingInput) => apiClient.post<CreatedBooking>('/api/bookings', body);

export function useCreateBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBooking,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
