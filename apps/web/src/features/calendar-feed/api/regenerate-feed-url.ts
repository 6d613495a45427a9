import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calendarFeedKeys } from '../../../lib/query-keys';

export const regenerateFeedUrl = () => apiClient.post<{ url: string }>('/api/calendar/feed/regenerate');

export function useRegenerateFeedUrl() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: regenerateFeedUrl,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: calendarFeedKeys.all });
    },
  });
}
