import type { EyewearBand } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { eyewearKeys } from '../../../lib/query-keys';

export interface EyewearItem {
  id: string;
  label: string;
  description: string;
  bands: EyewearBand[];
  active: boolean;
}

export const getEyewear = (signal?: AbortSignal) =>
  apiClient.get<{ eyewear: EyewearItem[] }>('/api/eyewear', signal).then((body) => body.eyewear);

export const eyewearQueryOptions = () => queryOptions({ queryKey: eyewearKeys.list(), queryFn: ({ signal }) => getEyewear(signal) });

export function useEyewear() {
  return useQuery(eyewearQueryOptions());
}
