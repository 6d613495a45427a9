import type { BookingDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

export interface ApplyDayPlanInput {
  instrumentId: string;
  date: string;
  order: { bookingId: string; startsAt: string; endsAt: string }[];
}

export const applyDayPlan = (input: ApplyDayPlanInput) =>
  apiClient.post<{ bookings: BookingDto[] }>('/api/planner/day/apply', input).then((body) => body.bookings);

export function useApplyDayPlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: applyDayPlan,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
