import type { StationDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { stationKeys } from '../../../lib/query-keys';

/** The end stations (benches) and the configurations that can feed each. */
export const getStations = (signal?: AbortSignal) =>
  apiClient.get<{ stations: StationDto[] }>('/api/stations', signal).then((body) => body.stations);

export const stationsQueryOptions = () =>
  queryOptions({ queryKey: stationKeys.list(), queryFn: ({ signal }) => getStations(signal), staleTime: 10 * 60 * 1000 });

export function useStations() {
  return useQuery(stationsQueryOptions());
}
