import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { instrumentKeys } from '../../../lib/query-keys';

export interface Instrument {
  id: string;
  name: string;
  kind: 'source' | 'bench';
  description: string;
  pumpNm: number | null;
}

export const getInstruments = (signal?: AbortSignal) =>
  apiClient.get<{ instruments: Instrument[] }>('/api/instruments', signal).then((body) => body.instruments);

export const instrumentsQueryOptions = () =>
  queryOptions({ queryKey: instrumentKeys.list(), queryFn: ({ signal }) => getInstruments(signal), staleTime: 10 * 60 * 1000 });

export function useInstruments() {
  return useQuery(instrumentsQueryOptions());
}
