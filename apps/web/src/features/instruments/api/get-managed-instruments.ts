import type { InstrumentAdminDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { instrumentAdminKeys } from '../../../lib/query-keys';

/** Every instrument, active or not, with all its configurations and changeover pairs (staff and admins). */
export const getManagedInstruments = (signal?: AbortSignal) =>
  apiClient.get<{ instruments: InstrumentAdminDto[] }>('/api/instruments/manage', signal).then((body) => body.instruments);

export const managedInstrumentsQueryOptions = () =>
  queryOptions({ queryKey: instrumentAdminKeys.list(), queryFn: ({ signal }) => getManagedInstruments(signal) });

export function useManagedInstruments() {
  return useQuery(managedInstrumentsQueryOptions());
}
