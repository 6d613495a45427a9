import type { User } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { userKeys } from '../../../lib/query-keys';

export const getUsers = (signal?: AbortSignal) =>
  apiClient.get<{ users: User[] }>('/api/users', signal).then((body) => body.users);

export const usersQueryOptions = () =>
  queryOptions({
    queryKey: userKeys.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
