import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys, eyewearKeys } from '../../../lib/query-keys';

export const deleteEyewear = (id: string) => apiClient.delete<void>(`/api/eyewear/${encodeURIComponent(id)}`);

export function useDeleteEyewear() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteEyewear,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: eyewearKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      ]);
    },
  });
}
