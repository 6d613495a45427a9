import type { BookingDto, UsageLogDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { type UsageScope, usageKeys } from '../../../lib/query-keys';

export interface SessionRow {
  booking: BookingDto;
  log: UsageLogDto | null;
}

/** Started approved/completed bookings of the last 60 days; `to_confirm` gives staff the logs awaiting them. */
export const getSessions = (scope: UsageScope, signal?: AbortSignal) =>
  apiClient
    .get<{ sessions: SessionRow[] }>(`/api/usage/sessions?scope=${scope}`, signal)
    .then((body) => body.sessions);

export const sessionsQueryOptions = (scope: UsageScope) =>
  queryOptions({ queryKey: usageKeys.sessions(scope), queryFn: ({ signal }) => getSessions(scope, signal) });

export function useSessions(scope: UsageScope, enabled = true) {
  return useQuery({ ...sessionsQueryOptions(scope), enabled });
}
