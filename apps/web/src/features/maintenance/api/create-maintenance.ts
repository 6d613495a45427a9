import type { BookingDto, MaintenanceDto, MaintenanceInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

export interface MaintenanceResult {
  maintenance: MaintenanceDto;
  displaced: BookingDto[];
  /** the booking after the window whose warm-up the window cuts short: kept, flagged to staff */
  warmupConflicts?: { bookingId: string; neededMinutes: number; availableMinutes: number }[];
}

export const createMaintenance = (input: MaintenanceInput) => apiClient.post<MaintenanceResult>('/api/maintenance', input);

export function useCreateMaintenance() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createMaintenance,
    // maintenance lives on the booking calendar and displaces bookings
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
