import type { CreateAccountInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { accountKeys } from '../../../lib/query-keys';

export interface CreatedAccount {
  id: string;
  name: string;
  kind: 'cost_centre' | 'external';
  status: string;
  poFile: { name: string; sizeBytes: number } | null;
}

export interface CreateAccountVariables {
  input: CreateAccountInput;
  /** the purchase order as a PDF (external accounts); the server judges the type by content */
  poFile?: File | null;
}

/** JSON without a file; multipart/form-data (fields plus "poFile") with one. */
export const createAccount = ({ input, poFile }: CreateAccountVariables) => {
  if (!poFile) return apiClient.post<{ account: CreatedAccount }>('/api/accounts', input).then((body) => body.account);
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) if (value !== undefined && value !== null) form.append(key, String(value));
  form.append('poFile', poFile, poFile.name);
  return apiClient.postForm<{ account: CreatedAccount }>('/api/accounts', form).then((body) => body.account);
};

export function useCreateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAccount,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: accountKeys.all });
    },
  });
}
