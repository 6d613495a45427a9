import type { BookingDto, UsageLogDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { usageKeys } from '../../../lib/query-keys';

export interface BookingUsage {
  booking: BookingDto;
  log: UsageLogDto | null;
  /** how far the logged times may leave the booking before staff are asked to look */
  graceMinutes: number;
  /** actual times must lie in this window (the booking widened by the facility's setting); others are refused */
  window: UsageWindow;
}

export interface UsageWindow {
  windowMinutes: number;
  earliestStartsAt: string;
  latestEndsAt: string;
}

export const getUsage = (bookingId: string, signal?: AbortSignal) =>
  apiClient.get<BookingUsage>(`/api/bookings/${encodeURIComponent(bookingId)}/usage`, signal);

export const usageQueryOptions = (bookingId: string) =>
  queryOptions({ queryKey: usageKeys.booking(bookingId), queryFn: ({ signal }) => getUsage(bookingId, signal) });

export function useUsage(bookingId: string) {
  return useQuery(usageQueryOptions(bookingId));
}
