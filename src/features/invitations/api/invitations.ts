import { queryOptions, useMutation } from '@tanstack/react-query';
import { invitationPreviewSchema, type AcceptInvitationInput } from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';
import { signInWithCredentials } from '../../../lib/auth';

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitations', token],
    queryFn: ({ signal }) =>
      apiRequest(`/api/invitations/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema, signal }),
    staleTime: Infinity,
  });

/** Accepts the invitation with a name and a password, then signs the new member in with them. */
export function useAcceptInvitation(token: string) {
  return useMutation({
    mutationFn: async ({ email, ...input }: AcceptInvitationInput & { email: string }) => {
      await apiRequest(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST', body: input });
      await signInWithCredentials(email, input.password);
    },
  });
}
