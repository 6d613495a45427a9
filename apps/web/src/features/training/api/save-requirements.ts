import type { ConfigurationRequirementsDto, ConfigurationRequirementsInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const saveRequirements = ({ configurationId, input }: { configurationId: string; input: ConfigurationRequirementsInput }) =>
  apiClient.put<{ requirements: ConfigurationRequirementsDto }>(`/api/training/requirements/${encodeURIComponent(configurationId)}`, input);

export function useSaveRequirements() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveRequirements, onSuccess: async () => { await queryClient.invalidateQueries({ queryKey: trainingKeys.all }); } });
}
