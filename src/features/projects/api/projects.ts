import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  maxPageSize,
  projectListSchema,
  projectMemberListSchema,
  projectSchema,
  type AddProjectMemberInput,
  type CreateProjectInput,
  type Project,
  type ProjectMember,
  type UpdateProjectInput,
} from '../../../../shared/contracts';
import { fetchAllPages, pageSearch } from '../../../lib/all-pages';
import { apiRequest } from '../../../lib/api-client';

/** Keys form a tree, so invalidating ['projects'] refreshes the list, every project and their members. */
export const projectKeys = {
  all: ['projects'] as const,
  list: () => ['projects', 'list'] as const,
  detail: (projectId: string) => ['projects', projectId] as const,
  members: (projectId: string) => ['projects', projectId, 'members'] as const,
};

/** Pages the list is read in at most: the client shows up to this many × maxPageSize projects. */
const maxProjectListPages = 25;

/** Every project of the organisation, read page by page (the API pages its lists). */
async function fetchAllProjects(signal: AbortSignal): Promise<{ projects: Project[] }> {
  const projects: Project[] = [];
  for (let page = 1; page <= maxProjectListPages; page += 1) {
    const data = await apiRequest(`/api/projects?page=${page}&pageSize=${maxPageSize}`, { schema: projectListSchema, signal });
    projects.push(...data.projects);
    if (!data.paging.hasMore) break;
  }
  return { projects };
}

export const projectsQueryOptions = () =>
  queryOptions({
    queryKey: projectKeys.list(),
    queryFn: ({ signal }) => fetchAllProjects(signal),
    select: (data) => data.projects,
  });

export const projectQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: projectKeys.detail(projectId),
    queryFn: ({ signal }) => apiRequest(`/api/projects/${encodeURIComponent(projectId)}`, { schema: projectSchema, signal }),
  });

/** The project's members, all of them (the API pages them; every page is read). */
export const projectMembersQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: projectKeys.members(projectId),
    queryFn: async ({ signal }): Promise<ProjectMember[]> => {
      const pages = await fetchAllPages((query) =>
        apiRequest(`/api/projects/${encodeURIComponent(projectId)}/members${pageSearch(query)}`, { schema: projectMemberListSchema, signal }),
      );
      return pages.flatMap((page) => page.members);
    },
  });

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateProjectInput) =>
      apiRequest('/api/projects', { method: 'POST', body: input, schema: projectSchema }),
    onSuccess: (project) => {
      queryClient.setQueryData(projectKeys.detail(project.id), project);
      return queryClient.invalidateQueries({ queryKey: projectKeys.list() });
    },
  });
}

export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateProjectInput) =>
      apiRequest(`/api/projects/${encodeURIComponent(projectId)}`, { method: 'PATCH', body: input, schema: projectSchema }),
    onSuccess: (project: Project) => {
      queryClient.setQueryData(projectKeys.detail(projectId), project);
      return queryClient.invalidateQueries({ queryKey: projectKeys.list() });
    },
  });
}

export function useDeleteProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(`/api/projects/${encodeURIComponent(projectId)}`, { method: 'DELETE' }),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: projectKeys.detail(projectId) });
      return queryClient.invalidateQueries({ queryKey: projectKeys.list() });
    },
  });
}

export function useAddProjectMember(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AddProjectMemberInput) =>
      apiRequest(`/api/projects/${encodeURIComponent(projectId)}/members`, { method: 'POST', body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.members(projectId) }),
  });
}

export function useRemoveProjectMember(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) =>
      apiRequest(`/api/projects/${encodeURIComponent(projectId)}/members/${encodeURIComponent(userId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.members(projectId) }),
  });
}
