import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  memberListSchema,
  peopleListSchema,
  type CreateInvitationInput,
  type Member,
  type MemberList,
  type UpdateMemberRoleInput,
} from '../../../../shared/contracts';
import { fetchAllPages, pageSearch } from '../../../lib/all-pages';
import { apiRequest } from '../../../lib/api-client';

/** Keys form a tree: invalidating `all` refreshes both lists of the organisation. */
export const memberKeys = {
  all: ['organisation'] as const,
  membersAndInvitations: ['organisation', 'members'] as const,
  people: ['organisation', 'people'] as const,
};

/**
 * The organisation's people without invitations, all of them (the API pages them; every page is read): readable by
 * every member (used to add people to a project).
 */
export const organisationPeopleQueryOptions = () =>
  queryOptions({
    queryKey: memberKeys.people,
    queryFn: async ({ signal }): Promise<Member[]> => {
      const pages = await fetchAllPages((query) => apiRequest(`/api/organisation/people${pageSearch(query)}`, { schema: peopleListSchema, signal }));
      return pages.flatMap((page) => page.people);
    },
  });

/** Joins the pages of the members-and-invitations list; the API pages both lists together. */
export function joinMemberPages(pages: MemberList[]): Pick<MemberList, 'members' | 'invitations'> {
  return { members: pages.flatMap((page) => page.members), invitations: pages.flatMap((page) => page.invitations) };
}

/** The organisation's people and its invitations, all of them (administrators only). */
export const organisationMembersQueryOptions = () =>
  queryOptions({
    queryKey: memberKeys.membersAndInvitations,
    queryFn: async ({ signal }) =>
      joinMemberPages(await fetchAllPages((query) => apiRequest(`/api/organisation/members${pageSearch(query)}`, { schema: memberListSchema, signal }))),
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
