import type { RequiredOdBand } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys, configurationKeys } from '../../../lib/query-keys';
import type { Configuration } from './get-configurations';

export interface UpdateConfigurationVariables {
  id: string;
  requiredOdBands: RequiredOdBand[];
}

export const updateConfiguration = ({ id, requiredOdBands }: UpdateConfigurationVariables) =>
  apiClient.patch<{ configuration: Configuration }>(`/api/configurations/${encodeURIComponent(id)}`, { requiredOdBands });

export function useUpdateConfiguration() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateConfiguration,
    onSuccess: async () => {
      // the required ODs feed every booking check
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: configurationKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      ]);
    },
  });
}
