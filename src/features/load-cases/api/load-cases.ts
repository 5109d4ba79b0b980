import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { loadCaseListSchema, savedLoadCaseSchema, type CreateLoadCaseInput, type UpdateLoadCaseInput } from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';

/** Under the project's key, so invalidating the project refreshes its load cases too. */
export const loadCaseKeys = {
  all: (projectId: string) => ['projects', projectId, 'load-cases'] as const,
};

const path = (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/load-cases`;

export const loadCasesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: loadCaseKeys.all(projectId),
    queryFn: ({ signal }) => apiRequest(path(projectId), { schema: loadCaseListSchema, signal }),
    select: (data) => data.loadCases,
  });

export function useCreateLoadCase(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateLoadCaseInput) => apiRequest(path(projectId), { method: 'POST', body: input, schema: savedLoadCaseSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: loadCaseKeys.all(projectId) }),
  });
}

export function useUpdateLoadCase(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ loadCaseId, input }: { loadCaseId: string; input: UpdateLoadCaseInput }) =>
      apiRequest(`${path(projectId)}/${encodeURIComponent(loadCaseId)}`, { method: 'PATCH', body: input, schema: savedLoadCaseSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: loadCaseKeys.all(projectId) }),
  });
}

export function useDeleteLoadCase(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (loadCaseId: string) => apiRequest(`${path(projectId)}/${encodeURIComponent(loadCaseId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: loadCaseKeys.all(projectId) }),
  });
}
