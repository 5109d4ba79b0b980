import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  lumpedModelListSchema,
  lumpedModelSchema,
  modeListSchema,
  savedModeSchema,
  structureListSchema,
  structureSchema,
  type CreateLumpedModelInput,
  type CreateModeInput,
  type CreateStructureInput,
  type ModeList,
  type UpdateLumpedModelInput,
  type UpdateModeInput,
  type UpdateStructureInput,
} from '../../../../shared/contracts';
import { apiRequest, isApiError } from '../../../lib/api-client';

/**
 * Keys form a tree under the project's (['projects', projectId]): invalidating a structure's key refreshes its
 * modes and models too, and invalidating ['projects', projectId, 'structures'] refreshes everything below.
 */
export const structureKeys = {
  all: (projectId: string) => ['projects', projectId, 'structures'] as const,
  detail: (projectId: string, structureId: string) => ['projects', projectId, 'structures', structureId] as const,
  modes: (projectId: string, structureId: string) => ['projects', projectId, 'structures', structureId, 'modes'] as const,
  models: (projectId: string, structureId: string) => ['projects', projectId, 'structures', structureId, 'models'] as const,
};

const e = encodeURIComponent;
const structuresPath = (projectId: string) => `/api/projects/${e(projectId)}/structures`;
const structurePath = (projectId: string, structureId: string) => `${structuresPath(projectId)}/${e(structureId)}`;
const modesPath = (projectId: string, structureId: string) => `${structurePath(projectId, structureId)}/modes`;
const modelsPath = (projectId: string, structureId: string) => `${structurePath(projectId, structureId)}/models`;

export const structuresQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: structureKeys.all(projectId),
    queryFn: ({ signal }) => apiRequest(structuresPath(projectId), { schema: structureListSchema, signal }),
    select: (data) => data.structures,
  });

export const structureQueryOptions = (projectId: string, structureId: string) =>
  queryOptions({
    queryKey: structureKeys.detail(projectId, structureId),
    queryFn: ({ signal }) => apiRequest(structurePath(projectId, structureId), { schema: structureSchema, signal }),
  });

export const modesQueryOptions = (projectId: string, structureId: string) =>
  queryOptions({
    queryKey: structureKeys.modes(projectId, structureId),
    queryFn: ({ signal }) => apiRequest(modesPath(projectId, structureId), { schema: modeListSchema, signal }),
    select: (data) => data.modes,
  });

export const lumpedModelsQueryOptions = (projectId: string, structureId: string) =>
  queryOptions({
    queryKey: structureKeys.models(projectId, structureId),
    queryFn: ({ signal }) => apiRequest(modelsPath(projectId, structureId), { schema: lumpedModelListSchema, signal }),
    select: (data) => data.models,
  });

export function useCreateStructure(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateStructureInput) => apiRequest(structuresPath(projectId), { method: 'POST', body: input, schema: structureSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: structureKeys.all(projectId) }),
  });
}

export function useUpdateStructure(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateStructureInput) =>
      apiRequest(structurePath(projectId, structureId), { method: 'PATCH', body: input, schema: structureSchema }),
    onSuccess: (structure) => {
      queryClient.setQueryData(structureKeys.detail(projectId, structureId), structure);
      return queryClient.invalidateQueries({ queryKey: structureKeys.all(projectId) });
    },
    // Someone else changed it: fetch theirs, so that the page shows the stored structure after the refusal.
    onError: (error) => (isApiError(error) && error.isConflict ? queryClient.invalidateQueries({ queryKey: structureKeys.detail(projectId, structureId) }) : undefined),
  });
}

export function useDeleteStructure(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(structurePath(projectId, structureId), { method: 'DELETE' }),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: structureKeys.detail(projectId, structureId) });
      return queryClient.invalidateQueries({ queryKey: structureKeys.all(projectId) });
    },
  });
}

export function useCreateMode(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateModeInput) => apiRequest(modesPath(projectId, structureId), { method: 'POST', body: input, schema: savedModeSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: structureKeys.modes(projectId, structureId) }),
  });
}

/** The tuning variants' key (their results are recomputed when a mode they use changes). */
const variantsKey = (projectId: string) => ['projects', projectId, 'variants'] as const;
/** The sign-offs' key: they tell which modes an approved design rests on. */
const signOffsKey = (projectId: string) => ['projects', projectId, 'sign-offs'] as const;
const isFrozenRefusal = (error: unknown) => isApiError(error) && error.code === 'approved_design_frozen';

/**
 * A saved change puts the stored mode in the cached list at once, then refreshes the list and the project's tuning
 * variants, whose results follow their mode. A refused one changes nothing here: the form offers the reload.
 */
export function useUpdateMode(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ modeId, input }: { modeId: string; input: UpdateModeInput }) =>
      apiRequest(`${modesPath(projectId, structureId)}/${e(modeId)}`, { method: 'PATCH', body: input, schema: savedModeSchema }),
    onSuccess: (mode) => {
      queryClient.setQueryData<ModeList>(structureKeys.modes(projectId, structureId), (list) =>
        list ? { ...list, modes: list.modes.map((entry) => (entry.id === mode.id ? mode : entry)) } : list,
      );
      void queryClient.invalidateQueries({ queryKey: variantsKey(projectId) });
      return queryClient.invalidateQueries({ queryKey: structureKeys.modes(projectId, structureId) });
    },
    // Approved meanwhile: learn it, so that once the form is closed the mode shows as fixed.
    onError: (error) => (isFrozenRefusal(error) ? queryClient.invalidateQueries({ queryKey: signOffsKey(projectId) }) : undefined),
  });
}

/** Fetches the structure's modes again (after a refused stale save, say). */
export function useReloadModes(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: structureKeys.modes(projectId, structureId) });
}

export function useDeleteMode(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (modeId: string) => apiRequest(`${modesPath(projectId, structureId)}/${e(modeId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: structureKeys.modes(projectId, structureId) }),
  });
}

export function useCreateLumpedModel(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateLumpedModelInput) =>
      apiRequest(modelsPath(projectId, structureId), { method: 'POST', body: input, schema: lumpedModelSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: structureKeys.models(projectId, structureId) }),
  });
}

/** A changed model re-derives the modes taken from it, so the structure's modes are refreshed too. */
export function useUpdateLumpedModel(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ modelId, input }: { modelId: string; input: UpdateLumpedModelInput }) =>
      apiRequest(`${modelsPath(projectId, structureId)}/${e(modelId)}`, { method: 'PATCH', body: input, schema: lumpedModelSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: structureKeys.detail(projectId, structureId) }),
  });
}

/** Fetches the structure's models again (after a refused stale save, say). */
export function useReloadLumpedModels(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: structureKeys.models(projectId, structureId) });
}

export function useDeleteLumpedModel(projectId: string, structureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (modelId: string) => apiRequest(`${modelsPath(projectId, structureId)}/${e(modelId)}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: structureKeys.detail(projectId, structureId) }),
  });
}
