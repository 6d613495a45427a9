import type { BookingDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingKeys } from '../../../lib/query-keys';

export interface AuditEntry {
  action: string;
  actorName: string;
  createdAt: string;
  before: unknown;
  after: unknown;
}

export const getBooking = (id: string, signal?: AbortSignal) =>
  apiClient.get<{ booking: BookingDto; audit?: AuditEntry[] }>(`/api/bookings/${encodeURIComponent(id)}`, signal);

export const bookingQueryOptions = (id: string) =>
  queryOptions({ queryKey: bookingKeys.detail(id), queryFn: ({ signal }) => getBooking(id, signal) });

export function useBooking(id: string | null) {
  return useQuery({ ...bookingQueryOptions(id ?? ''), enabled: id !== null });
}
