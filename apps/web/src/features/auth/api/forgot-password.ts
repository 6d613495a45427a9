import type { ForgotPasswordInput } from '@femtoslot/shared';
import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export const requestPasswordReset = (input: ForgotPasswordInput) =>
  apiClient.post<unknown>('/api/auth/forgot-password', input);

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
