import type { Role } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from '../../../lib/query-keys';

export interface InvitationSummary {
  email: string;
  name: string;
  role: Role;
  organisation: { name: string };
}

export const getInvitation = (token: string, signal?: AbortSignal) =>
  apiClient
    .get<{ invitation: InvitationSummary }>(`/api/auth/invitations/${encodeURIComponent(token)}`, signal)
    .then((body) => body.invitation);

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invitation(token),
    queryFn: ({ signal }) => getInvitation(token, signal),
    retry: false,
    staleTime: Infinity,
  });

export function useInvitation(token: string) {
  return useQuery({ ...invitationQueryOptions(token), enabled: token.length > 0 });
}
