import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  hardwareSheetSchema,
  signOffListSchema,
  signOffSchema,
  type ApproveSignOffInput,
  type ReturnSignOffInput,
  type SubmitSignOffInput,
} from '../../../../shared/contracts/sign-offs';
import { apiRequest } from '../../../lib/api-client';

/** Under the project's key, so invalidating the project refreshes its sign-offs too. */
export const signOffKeys = {
  all: (projectId: string) => ['projects', projectId, 'sign-offs'] as const,
};

const path = (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/sign-offs`;
const itemPath = (projectId: string, id: string) => `${path(projectId)}/${encodeURIComponent(id)}`;

/** How soon to read the sign-offs again while a mail still waits for its first attempt (sent in the background). */
const firstAttemptPollMs = 2_000;

/**
 * The project's sign-offs, newest first (sorted here too, so the order never rests on the server alone). While a mail
 * has not had its first attempt yet, the list is read again every 2 s, so that its state moves from waiting to sent.
 */
export const signOffsQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: signOffKeys.all(projectId),
    queryFn: ({ signal }) => apiRequest(path(projectId), { schema: signOffListSchema, signal }),
    select: (data) => [...data.signOffs].sort((a, b) => b.submittedAt.localeCompare(a.submittedAt)),
    refetchInterval: (query) =>
      query.state.data?.signOffs.some((entry) => entry.mails.some((mail) => mail.state === 'pending' && mail.attempts === 0)) ? firstAttemptPollMs : false,
  });

/** Submitting freezes nothing yet but changes the criteria's status and the variant's page: refresh the whole project. */
export function useSubmitSignOff(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SubmitSignOffInput) => apiRequest(path(projectId), { method: 'POST', body: input, schema: signOffSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['projects', projectId] }),
  });
}

export function useDecideSignOff(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, decision, input }: { id: string; decision: 'approve' | 'return'; input: ApproveSignOffInput | ReturnSignOffInput }) =>
      apiRequest(`${itemPath(projectId, id)}/${decision}`, { method: 'POST', body: input, schema: signOffSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['projects', projectId] }),
  });
}

/** The hardware sheet of an approved sign-off: the rows of its CSV and PDF, read from the approved snapshot. */
export const hardwareSheetPath = (projectId: string, signOffId: string) => `${itemPath(projectId, signOffId)}/hardware-sheet`;

export const hardwareSheetQueryOptions = (projectId: string, signOffId: string) =>
  queryOptions({
    queryKey: [...signOffKeys.all(projectId), signOffId, 'hardware-sheet'] as const,
    queryFn: ({ signal }) => apiRequest(hardwareSheetPath(projectId, signOffId), { schema: hardwareSheetSchema, signal }),
    staleTime: Infinity,
  });
