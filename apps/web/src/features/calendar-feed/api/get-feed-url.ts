import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calendarFeedKeys } from '../../../lib/query-keys';

export const getFeedUrl = (signal?: AbortSignal) =>
  apiClient.get<{ url: string }>('/api/calendar/feed', signal).then((body) => body.url);

export const feedUrlQueryOptions = () => queryOptions({ queryKey: calendarFeedKeys.url(), queryFn: ({ signal }) => getFeedUrl(signal) });

export function useFeedUrl() {
  return useQuery(feedUrlQueryOptions());
}
