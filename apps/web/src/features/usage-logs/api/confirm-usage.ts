import type { UsageLogDto } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { reportKeys, usageKeys } from '../../../lib/query-keys';

export interface ConfirmUsageVariables {
  logId: string;
  actualStartsAt?: string;
  actualEndsAt?: string;
  note?: string;
}

/** Staff confirm a log as submitted or with adjusted times (the API audits the change). */
export const confirmUsage = ({ logId, ...body }: ConfirmUsageVariables) =>
  apiClient.post<{ log: UsageLogDto }>(`/api/usage/${encodeURIComponent(logId)}/confirm`, body);

export function useConfirmUsage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmUsage,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: usageKeys.all }),
        queryClient.invalidateQueries({ queryKey: reportKeys.all }),
      ]);
    },
  });
}
