import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { accountKeys } from '../../../lib/query-keys';

export interface Account {
  id: string;
  name: string;
  kind: 'cost_centre' | 'external';
  status: string;
  usable: boolean;
  reason: string | null;
}

export const getAccounts = (signal?: AbortSignal) =>
  apiClient.get<{ accounts: Account[] }>('/api/accounts', signal).then((body) => body.accounts);

export const accountsQueryOptions = () =>
  queryOptions({ queryKey: accountKeys.list(), queryFn: ({ signal }) => getAccounts(signal) });

export function useAccounts() {
  return useQuery(accountsQueryOptions());
}
