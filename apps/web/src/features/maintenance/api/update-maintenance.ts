import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';
import type { MaintenanceResult } from './create-maintenance';

export interface UpdateMaintenanceVariables {
  id: string;
  startsAt: string;
  endsAt: string;
  reason?: string;
}

export const updateMaintenance = ({ id, ...changes }: UpdateMaintenanceVariables) =>
  apiClient.patch<MaintenanceResult>(`/api/maintenance/${encodeURIComponent(id)}`, changes);

export function useUpdateMaintenance() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMaintenance,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: bookingKeys.all });
    },
  });
}
