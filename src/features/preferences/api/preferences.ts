import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { preferencesSchema, type Preferences, type UpdatePreferencesInput } from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';

/** Under the signed-in person's key (['me']), so signing out forgets them too. */
export const preferencesQueryKey = ['me', 'preferences'] as const;

export const preferencesQueryOptions = () =>
  queryOptions({
    queryKey: preferencesQueryKey,
    queryFn: ({ signal }) => apiRequest('/api/me/preferences', { schema: preferencesSchema, signal }),
    staleTime: 5 * 60_000,
  });

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdatePreferencesInput) => apiRequest('/api/me/preferences', { method: 'PATCH', body: input, schema: preferencesSchema }),
    onMutate: async (input) => {
      await queryClient.cancelQueries({ queryKey: preferencesQueryKey });
      const previous = queryClient.getQueryData<Preferences>(preferencesQueryKey);
      if (previous) queryClient.setQueryData<Preferences>(preferencesQueryKey, { ...previous, ...input });
      return { previous };
    },
    onError: (_error, _input, context) => {
      if (context?.previous) queryClient.setQueryData(preferencesQueryKey, context.previous);
    },
    onSuccess: (preferences) => queryClient.setQueryData(preferencesQueryKey, preferences),
  });
}
