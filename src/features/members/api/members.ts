import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  memberListSchema,
  peopleListSchema,
  type CreateInvitationInput,
  type UpdateMemberRoleInput,
} from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';

/** Keys form a tree: invalidating `all` refreshes both lists of the organisation. */
export const memberKeys = {
  all: ['organisation'] as const,
  membersAndInvitations: ['organisation', 'members'] as const,
  people: ['organisation', 'people'] as const,
};

/** The organisation's people without invitations: readable by every member (used to add people to a project). */
export const organisationPeopleQueryOptions = () =>
  queryOptions({
    queryKey: memberKeys.people,
    queryFn: ({ signal }) => apiRequest('/api/organisation/people', { schema: peopleListSchema, signal }),
    select: (data) => data.people,
  });

/** The organisation's people and its invitations (administrators only). */
export const organisationMembersQueryOptions = () =>
  queryOptions({
    queryKey: memberKeys.membersAndInvitations,
    queryFn: ({ signal }) => apiRequest('/api/organisation/members', { schema: memberListSchema, signal }),
  });

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateInvitationInput) => apiRequest('/api/organisation/members', { method: 'POST', body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.all }),
  });
}

export function useChangeMemberRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, ...input }: UpdateMemberRoleInput & { userId: string }) =>
      apiRequest(`/api/organisation/members/${encodeURIComponent(userId)}`, { method: 'PATCH', body: input }),
    // A project member's role is their organisation role, so the projects' member lists (['projects', id, 'members'])
    // change with it too.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: memberKeys.all }),
        queryClient.invalidateQueries({ queryKey: ['projects'] }),
      ]),
  });
}
