import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  comfortCriteriaListSchema,
  comfortCriteriaSchema,
  type CreateComfortCriteriaInput,
  type UpdateComfortCriteriaInput,
} from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';

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

export function useUpdateComfortCriteria(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ criteriaId, input }: { criteriaId: string; input: UpdateComfortCriteriaInput }) =>
      apiRequest(`${path(projectId)}/${encodeURIComponent(criteriaId)}`, { method: 'PATCH', body: input, schema: comfortCriteriaSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) }),
  });
}

export function useDeleteComfortCriteria(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (criteriaId: string) => apiRequest(`${path(projectId)}/${encodeURIComponent(criteriaId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: comfortCriteriaKeys.all(projectId) }),
  });
}
