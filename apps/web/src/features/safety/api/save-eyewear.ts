import type { EyewearBand } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys, eyewearKeys } from '../../../lib/query-keys';
import type { EyewearItem } from './get-eyewear';

export interface EyewearInput {
  label: string;
  description: string;
  bands: EyewearBand[];
}

export type SaveEyewearVariables = { id?: undefined; input: EyewearInput } | { id: string; input: Partial<EyewearInput> & { active?: boolean } };

/** POST /api/eyewear for a new item, PATCH /api/eyewear/:id for a change. */
export const saveEyewear = ({ id, input }: SaveEyewearVariables) =>
  id === undefined
    ? apiClient.post<{ eyewear: EyewearItem }>('/api/eyewear', input)
    : apiClient.patch<{ eyewear: EyewearItem }>(`/api/eyewear/${encodeURIComponent(id)}`, input);

export function useSaveEyewear() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveEyewear,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: eyewearKeys.all }),
        queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
      ]);
    },
  });
}
