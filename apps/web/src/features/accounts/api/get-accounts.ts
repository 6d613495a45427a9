import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { accountKeys } from '../../../lib/query-keys';

export type AccountStatus = 'pending' | 'approved' | 'inactive';

/** GET /api/accounts: the caller's organisation's accounts, each saying whether a booking may be charged to it today. */
export interface Account {
  id: string;
  name: string;
  kind: 'cost_centre' | 'external';
  status: AccountStatus | (string & {});
  usable: boolean;
  reason: string | null;
  poNumber?: string | null;
  poExpiresOn?: string | null;
  costCentreCode?: string | null;
}

export const getAccounts = (signal?: AbortSignal) =>
  apiClient.get<{ accounts: Account[] }>('/api/accounts', signal).then((body) => body.accounts);

export const accountsQueryOptions = () =>
  queryOptions({ queryKey: accountKeys.list(), queryFn: ({ signal }) => getAccounts(signal) });

export function useAccounts() {
  return useQuery(accountsQueryOptions());
}
