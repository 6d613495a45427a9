import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { accountKeys } from '../../../lib/query-keys';

/** A PI of the account's organisation approves it; from then on bookings may be charged to it. */
export const approveAccount = (accountId: string) =>
  apiClient.post<{ account: { id: string; status: string } }>(`/api/accounts/${encodeURIComponent(accountId)}/approve`).then((body) => body.account);

export function useApproveAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: approveAccount,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: accountKeys.all });
    },
  });
}
