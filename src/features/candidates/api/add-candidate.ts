import { useMutation, useQueryClient } from '@tanstack/react-query';
import { candidateSchema, type CreateCandidateInput } from '@shared/api/candidates.schema.js';
import { projectQueryOptions } from '@/features/projects/api/get-project.js';
import { projectListsKey } from '@/features/projects/api/get-projects.js';
import { apiRequest } from '@/lib/api-client.js';
import { candidatesQueryOptions } from './get-candidates.js';
import { proposalsQueryOptions } from './get-proposals.js';

/** `POST /api/projects/:projectId/candidates` (cartographer, admin). */
export const addCandidate = (projectId: number, input: CreateCandidateInput) =>
  apiRequest(`/projects/${projectId}/candidates`, { method: 'POST', body: input, schema: candidateSchema });

/** Invalidates what a change to the candidate list touches: the list, proposals (added marks) and counts. */
export function refreshAfterCandidateChange(queryClient: ReturnType<typeof useQueryClient>, projectId: number) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: candidatesQueryOptions(projectId).queryKey }),
    queryClient.invalidateQueries({ queryKey: proposalsQueryOptions(projectId).queryKey }),
    queryClient.invalidateQueries({ queryKey: projectQueryOptions(projectId).queryKey, exact: true }),
    queryClient.invalidateQueries({ queryKey: projectListsKey }),
  ]);
}

export function useAddCandidate(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateCandidateInput) => addCandidate(projectId, input),
    onSuccess: () => refreshAfterCandidateChange(queryClient, projectId),
  });
}
