import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  loadCaseListSchema,
  savedLoadCaseSchema,
  type CreateLoadCaseInput,
  type LoadCaseList,
  type UpdateLoadCaseInput,
} from '../../../../shared/contracts';
import { apiRequest, isApiError } from '../../../lib/api-client';

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

/**
 * A saved change puts the stored load case in the cached list at once, then refreshes the list and the project's
 * tuning variants, whose results follow their load cases. A refused one changes nothing here: the form offers the reload.
 */
export function useUpdateLoadCase(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ loadCaseId, input }: { loadCaseId: string; input: UpdateLoadCaseInput }) =>
      apiRequest(`${path(projectId)}/${encodeURIComponent(loadCaseId)}`, { method: 'PATCH', body: input, schema: savedLoadCaseSchema }),
    onSuccess: (loadCase) => {
      queryClient.setQueryData<LoadCaseList>(loadCaseKeys.all(projectId), (list) =>
        list ? { ...list, loadCases: list.loadCases.map((entry) => (entry.id === loadCase.id ? loadCase : entry)) } : list,
      );
      void queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'variants'] });
      return queryClient.invalidateQueries({ queryKey: loadCaseKeys.all(projectId) });
    },
    // Approved meanwhile: learn it from the sign-offs, so that once the form is closed the load case shows as fixed.
    onError: (error) =>
      isApiError(error) && error.code === 'approved_design_frozen' ? queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'sign-offs'] }) : undefined,
  });
}

/** Fetches the project's load cases again (after a refused stale save, say). */
export function useReloadLoadCases(projectId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: loadCaseKeys.all(projectId) });
}

export function useDeleteLoadCase(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (loadCaseId: string) => apiRequest(`${path(projectId)}/${encodeURIComponent(loadCaseId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: loadCaseKeys.all(projectId) }),
  });
}
