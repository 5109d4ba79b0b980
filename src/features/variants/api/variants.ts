import { queryOptions, useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import {
  comfortCriteriaListSchema,
  loadCaseListSchema,
  modeListSchema,
  structureListSchema,
  variantCurvesSchema,
  variantListSchema,
  variantSchema,
  variantSizeSchema,
  type CreateVariantInput,
  type SavedMode,
  type Structure,
  type UpdateVariantInput,
  type Variant,
} from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';

/**
 * Keys form a tree under the project's (['projects', projectId]): a variant's curves sit below the variant, so
 * invalidating ['projects', projectId, 'variants'] refreshes every variant, its result and its curves.
 */
export const variantKeys = {
  all: (projectId: string) => ['projects', projectId, 'variants'] as const,
  detail: (projectId: string, variantId: string) => ['projects', projectId, 'variants', variantId] as const,
  curves: (projectId: string, variantId: string, loadCaseId: string) => ['projects', projectId, 'variants', variantId, 'curves', loadCaseId] as const,
  /** The structural model a variant is built on (the same keys the model's own pages use). */
  structures: (projectId: string) => ['projects', projectId, 'structures'] as const,
  modes: (projectId: string, structureId: string) => ['projects', projectId, 'structures', structureId, 'modes'] as const,
  loadCases: (projectId: string) => ['projects', projectId, 'load-cases'] as const,
  comfortCriteria: (projectId: string) => ['projects', projectId, 'comfort-criteria'] as const,
};

const e = encodeURIComponent;
const projectPath = (projectId: string) => `/api/projects/${e(projectId)}`;
const variantsPath = (projectId: string) => `${projectPath(projectId)}/variants`;
const variantPath = (projectId: string, variantId: string) => `${variantsPath(projectId)}/${e(variantId)}`;

export const variantsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: variantKeys.all(projectId),
    queryFn: ({ signal }) => apiRequest(variantsPath(projectId), { schema: variantListSchema, signal }),
    select: (data) => data.variants,
  });

export const variantQueryOptions = (projectId: string, variantId: string) =>
  queryOptions({
    queryKey: variantKeys.detail(projectId, variantId),
    queryFn: ({ signal }) => apiRequest(variantPath(projectId, variantId), { schema: variantSchema, signal }),
  });

export const variantCurvesQueryOptions = (projectId: string, variantId: string, loadCaseId: string) =>
  queryOptions({
    queryKey: variantKeys.curves(projectId, variantId, loadCaseId),
    queryFn: ({ signal }) =>
      apiRequest(`${variantPath(projectId, variantId)}/curves?loadCaseId=${e(loadCaseId)}`, { schema: variantCurvesSchema, signal }),
    staleTime: 5 * 60_000,
  });

export const loadCasesQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: variantKeys.loadCases(projectId),
    queryFn: ({ signal }) => apiRequest(`${projectPath(projectId)}/load-cases`, { schema: loadCaseListSchema, signal }),
    select: (data) => data.loadCases,
  });

export const comfortCriteriaQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: variantKeys.comfortCriteria(projectId),
    queryFn: ({ signal }) => apiRequest(`${projectPath(projectId)}/comfort-criteria`, { schema: comfortCriteriaListSchema, signal }),
    select: (data) => data.comfortCriteria,
  });

export interface ModeChoice {
  structure: Structure;
  mode: SavedMode;
}

/** Every mode of every structure of the project, for the mode picker (one request per structure, cached under its key). */
export const projectModesQueryOptions = (projectId: string, queryClient: QueryClient) =>
  queryOptions({
    queryKey: [...variantKeys.structures(projectId), 'all-modes'] as const,
    queryFn: async ({ signal }): Promise<ModeChoice[]> => {
      const { structures } = await queryClient.fetchQuery({
        queryKey: variantKeys.structures(projectId),
        queryFn: () => apiRequest(`${projectPath(projectId)}/structures`, { schema: structureListSchema, signal }),
      });
      const lists = await Promise.all(
        structures.map((structure) =>
          queryClient.fetchQuery({
            queryKey: variantKeys.modes(projectId, structure.id),
            queryFn: () => apiRequest(`${projectPath(projectId)}/structures/${e(structure.id)}/modes`, { schema: modeListSchema, signal }),
          }),
        ),
      );
      return structures.flatMap((structure, i) => lists[i].modes.map((mode) => ({ structure, mode })));
    },
  });

/** Everything a variant page reads, fetched before it renders (route loaders call this). */
export async function prefetchVariantModel(queryClient: QueryClient, projectId: string): Promise<void> {
  await Promise.all([
    queryClient.ensureQueryData(variantsQueryOptions(projectId)),
    queryClient.ensureQueryData(loadCasesQueryOptions(projectId)),
    queryClient.ensureQueryData(comfortCriteriaQueryOptions(projectId)),
    queryClient.ensureQueryData(projectModesQueryOptions(projectId, queryClient)),
  ]);
}

export function useCreateVariant(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateVariantInput) => apiRequest(variantsPath(projectId), { method: 'POST', body: input, schema: variantSchema }),
    onSuccess: (variant) => {
      queryClient.setQueryData(variantKeys.detail(projectId, variant.id), variant);
      return queryClient.invalidateQueries({ queryKey: variantKeys.all(projectId), exact: true });
    },
  });
}

export function useUpdateVariant(projectId: string, variantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateVariantInput) => apiRequest(variantPath(projectId, variantId), { method: 'PATCH', body: input, schema: variantSchema }),
    onSuccess: async (variant) => {
      await queryClient.invalidateQueries({ queryKey: variantKeys.detail(projectId, variantId) });
      queryClient.setQueryData(variantKeys.detail(projectId, variantId), variant);
      return queryClient.invalidateQueries({ queryKey: variantKeys.all(projectId), exact: true });
    },
  });
}

export function useDeleteVariant(projectId: string, variantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(variantPath(projectId, variantId), { method: 'DELETE' }),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: variantKeys.detail(projectId, variantId) });
      return queryClient.invalidateQueries({ queryKey: variantKeys.all(projectId), exact: true });
    },
  });
}

/** The smallest mass ratio meeting the criteria over the detuning band; with `apply`, stored on the variant. */
export function useSizeVariant(projectId: string, variant: Pick<Variant, 'id' | 'version'>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (apply: boolean) =>
      apiRequest(`${variantPath(projectId, variant.id)}/size`, {
        method: 'POST',
        body: apply ? { apply: true, version: variant.version } : {},
        schema: variantSizeSchema,
      }),
    onSuccess: async (answer) => {
      if (!answer.applied) return;
      await queryClient.invalidateQueries({ queryKey: variantKeys.detail(projectId, variant.id) });
      if (answer.variant) queryClient.setQueryData(variantKeys.detail(projectId, variant.id), answer.variant);
      return queryClient.invalidateQueries({ queryKey: variantKeys.all(projectId), exact: true });
    },
  });
}
