import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  comfortCriteriaListSchema,
  comfortCriteriaSchema,
  type ComfortCriteriaList,
  type CreateComfortCriteriaInput,
  type UpdateComfortCriteriaInput,
} from '../../../../shared/contracts';
import { apiRequest, isApiError } from '../../../lib/api-client';

/** Under the project's key, so invalidating the project refreshes its comfort criteria too. */
export const comfortCriteriaKeys = {
  all: (projectId: string) => ['projects', projectId, 'comfort-criteria'] as const,
};

const path = (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/comfort-criteria`;

export const comfortCriteriaQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: comfortCriteriaKeys.all(projectId),
    queryFn: ({ signal }) => apiRequest(path(projectId), { schema: comfortCriteriaListSchema, signal }),
    select: (data) => data.comfortCriteria,
  });

export function useCreateComfortCriteria(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateComfortCriteriaInput) => apiRequest(path(projectId), { method: 'POST', body: input, schema: comfortCriteriaSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) }),
  });
}

/**
 * A saved change puts the stored criteria in the cached list at once, then refreshes the list and the project's
 * tuning variants, whose verdicts follow their criteria. A refused one changes nothing here: the form offers the reload.
 */
export function useUpdateComfortCriteria(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ criteriaId, input }: { criteriaId: string; input: UpdateComfortCriteriaInput }) =>
      apiRequest(`${path(projectId)}/${encodeURIComponent(criteriaId)}`, { method: 'PATCH', body: input, schema: comfortCriteriaSchema }),
    onSuccess: (criteria) => {
      queryClient.setQueryData<ComfortCriteriaList>(comfortCriteriaKeys.all(projectId), (list) =>
        list ? { ...list, comfortCriteria: list.comfortCriteria.map((entry) => (entry.id === criteria.id ? criteria : entry)) } : list,
      );
      void queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'variants'] });
      return queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) });
    },
    // Approved meanwhile: fetch the criteria's new status, so that once the form is closed they show as approved.
    onError: (error) =>
      isApiError(error) && error.code === 'approved_design_frozen' ? queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) }) : undefined,
  });
}

/** Fetches the project's comfort criteria again (after a refused stale save, say). */
export function useReloadComfortCriteria(projectId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) });
}

export function useDeleteComfortCriteria(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (criteriaId: string) => apiRequest(`${path(projectId)}/${encodeURIComponent(criteriaId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) }),
  });
}
