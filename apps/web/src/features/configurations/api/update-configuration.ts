import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys, configurationKeys } from '../../../lib/query-keys';
import type { Configuration } from './get-configurations';

export interface UpdateConfigurationVariables {
  id: string;
  requiredOd: number;
}

export const updateConfiguration = ({ id, requiredOd }: UpdateConfigurationVariables) =>
  apiClient.patch<{ configuration: Configuration }>(`/api/configurations/${encodeURIComponent(id)}`, { requiredOd });

export function useUpdateConfiguration() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateConfiguration,
    onSuccess: async () => {
      // the required OD feeds every booking check
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: configurationKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      ]);
    },
  });
}
