import type { UsageLogDto, UsageLogInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { reportKeys, usageKeys } from '../../../lib/query-keys';

export interface SaveUsageVariables {
  bookingId: string;
  body: UsageLogInput;
}

/** Creates or replaces the booking's log while it is not billed. */
export const saveUsage = ({ bookingId, body }: SaveUsageVariables) =>
  apiClient.post<{ log: UsageLogDto }>(`/api/bookings/${encodeURIComponent(bookingId)}/usage`, body);

export function useSaveUsage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveUsage,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: usageKeys.all }),
        queryClient.invalidateQueries({ queryKey: reportKeys.all }),
      ]);
    },
  });
}
