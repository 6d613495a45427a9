import type { CalendarDto } from '@femtoslot/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { type CalendarRange, bookingKeys } from '../../../lib/query-keys';

export const getCalendar = ({ from, to, instrumentId }: CalendarRange, signal?: AbortSignal) => {
  const params = new URLSearchParams({ from, to });
  if (instrumentId) params.set('instrumentId', instrumentId);
  return apiClient.get<CalendarDto>(`/api/bookings?${params.toString()}`, signal);
};

export const calendarQueryOptions = (range: CalendarRange) =>
  queryOptions({
    queryKey: bookingKeys.calendar(range),
    queryFn: ({ signal }) => getCalendar(range, signal),
    placeholderData: keepPreviousData,
  });

export function useCalendar(range: CalendarRange | null) {
  return useQuery({ ...calendarQueryOptions(range ?? { from: '', to: '' }), enabled: range !== null });
}
