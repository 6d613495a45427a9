import type { MyBeamTimeDto } from '@femtoslot/shared/billing/spend.schemas';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { beamTimeKeys } from '../../../lib/query-keys';

export type MyBooking = MyBeamTimeDto['bookings'][number];

/** The caller's own bookings that have not ended, soonest first, every status. */
export const getMyBeamTime = (signal?: AbortSignal) => apiClient.get<MyBeamTimeDto>('/api/me/beam-time', signal).then((body) => body.bookings);

export const myBeamTimeQueryOptions = () => queryOptions({ queryKey: beamTimeKeys.mine(), queryFn: ({ signal }) => getMyBeamTime(signal) });

export function useMyBeamTime() {
  return useQuery(myBeamTimeQueryOptions());
}
