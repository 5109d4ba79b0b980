import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiErrorSchema } from '../../../../shared/contracts';
import {
  retuneResponseSchema,
  siteRecordListSchema,
  siteRecordSchema,
  siteRecordTimeHistorySchema,
  type AnalyseSiteRecordInput,
  type RetunedVariantRequest,
  type RetuneRequest,
  type SiteRecord,
} from '../../../../shared/contracts/site-records';
import { variantSchema } from '../../../../shared/contracts/variants';
import { ApiError, apiRequest, networkError } from '../../../lib/api-client';

/** Under the project's key, so invalidating the project refreshes its site records too. */
export const siteRecordKeys = {
  all: (projectId: string) => ['projects', projectId, 'site-records'] as const,
  timeHistory: (projectId: string, id: string) => ['projects', projectId, 'site-records', id, 'time-history'] as const,
};

const path = (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/site-records`;
const itemPath = (projectId: string, id: string) => `${path(projectId)}/${encodeURIComponent(id)}`;

export const siteRecordsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: siteRecordKeys.all(projectId),
    queryFn: ({ signal }) => apiRequest(path(projectId), { schema: siteRecordListSchema, signal }),
    select: (data) => data.siteRecords,
  });

export const siteRecordTimeHistoryQueryOptions = (projectId: string, id: string, version: number) =>
  queryOptions({
    queryKey: [...siteRecordKeys.timeHistory(projectId, id), version],
    queryFn: ({ signal }) => apiRequest(`${itemPath(projectId, id)}/time-history`, { schema: siteRecordTimeHistorySchema, signal }),
    staleTime: Infinity,
  });

/** The upload's text fields, as the multipart form carries them. */
export interface UploadFields {
  structureId: string;
  modeId?: string;
  condition: string;
  method?: string;
  bandHz?: [number, number];
  measuredAt?: string;
  notes?: string;
  channel?: string;
  sampleRateHz?: number;
}

export interface UploadProgress {
  /** 0..1 while the file is sent; null when the size is unknown. */
  sentRatio: number | null;
  /** True once the whole file is sent and the server is analysing it. */
  analysing: boolean;
}

/** Sends a record with XMLHttpRequest, which reports the upload's progress (fetch does not). */
export function uploadSiteRecord(projectId: string, file: File, fields: UploadFields, onProgress: (progress: UploadProgress) => void): Promise<SiteRecord> {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) {
    if (value === undefined || value === '') continue;
    form.append(key, Array.isArray(value) ? JSON.stringify(value) : String(value));
  }
  form.append('file', file, file.name);
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open('POST', path(projectId));
    request.setRequestHeader('Accept', 'application/json');
    request.withCredentials = true;
    request.upload.onprogress = (event) => onProgress({ sentRatio: event.lengthComputable ? event.loaded / event.total : null, analysing: false });
    request.upload.onload = () => onProgress({ sentRatio: 1, analysing: true });
    request.onerror = () => reject(networkError());
    request.onload = () => {
      let payload: unknown;
      try {
        payload = JSON.parse(request.responseText);
      } catch {
        payload = undefined;
      }
      if (request.status === 201) {
        const parsed = siteRecordSchema.safeParse(payload);
        if (parsed.success) resolve(parsed.data);
        else reject(new ApiError(request.status, 'unexpected_response', 'The server’s answer to the upload did not have the expected shape.'));
        return;
      }
      const error = apiErrorSchema.safeParse(payload);
      if (error.success) reject(new ApiError(request.status, error.data.error.code, error.data.error.message, error.data.error.issues));
      else reject(new ApiError(request.status, `http_${request.status}`, `The server answered ${request.status}.`));
    };
    request.send(form);
  });
}

export function useUploadSiteRecord(projectId: string, onProgress: (progress: UploadProgress) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, fields }: { file: File; fields: UploadFields }) => uploadSiteRecord(projectId, file, fields, onProgress),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteRecordKeys.all(projectId) }),
  });
}

export function useAnalyseSiteRecord(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: AnalyseSiteRecordInput }) =>
      apiRequest(`${itemPath(projectId, id)}/analyse`, { method: 'POST', body: input, schema: siteRecordSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteRecordKeys.all(projectId) }),
  });
}

export function useDeleteSiteRecord(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiRequest(itemPath(projectId, id), { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteRecordKeys.all(projectId) }),
  });
}

export function useRetune(projectId: string) {
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: RetuneRequest }) =>
      apiRequest(`${itemPath(projectId, id)}/retune`, { method: 'POST', body: input, schema: retuneResponseSchema }),
  });
}

/** A new tuning variant: the chosen variant with its damper re-tuned to the structure this record measured (the route refreshes the variants). */
export function useCreateRetunedVariant(projectId: string) {
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: RetunedVariantRequest }) =>
      apiRequest(`${itemPath(projectId, id)}/retuned-variant`, { method: 'POST', body: input, schema: variantSchema }),
  });
}
