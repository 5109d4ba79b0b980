import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { asBuiltRecordListSchema, asBuiltRecordSchema, type AsBuiltInput } from '../../../../shared/contracts/as-built';
import { apiRequest } from '../../../lib/api-client';

/** Under the sign-off's key, so refreshing the project's sign-offs refreshes these too. */
export const asBuiltKeys = {
  all: (projectId: string, signOffId: string) => ['projects', projectId, 'sign-offs', signOffId, 'as-built'] as const,
};

const path = (projectId: string, signOffId: string) => `/api/projects/${encodeURIComponent(projectId)}/sign-offs/${encodeURIComponent(signOffId)}/as-built`;

/** Every as-built record of an approved sign-off with its comparison, newest first (sorted here too). */
export const asBuiltQueryOptions = (projectId: string, signOffId: string) =>
  queryOptions({
    queryKey: asBuiltKeys.all(projectId, signOffId),
    queryFn: ({ signal }) => apiRequest(path(projectId, signOffId), { schema: asBuiltRecordListSchema, signal }),
    select: (data) => [...data.records].sort((a, b) => b.recordedAt.localeCompare(a.recordedAt)),
  });

/** Appends a record; the list is fetched again so the new one shows first and the earlier ones stay below. */
export function useRecordAsBuilt(projectId: string, signOffId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AsBuiltInput) => apiRequest(path(projectId, signOffId), { method: 'POST', body: input, schema: asBuiltRecordSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: asBuiltKeys.all(projectId, signOffId) }),
  });
}
