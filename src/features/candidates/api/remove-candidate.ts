import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client.js';
import { refreshAfterCandidateChange } from './add-candidate.js';

/** `DELETE /api/projects/:projectId/candidates/:candidateId`: refused (409) once an audit used it. */
export const removeCandidate = (projectId: number, candidateId: number) =>
  apiRequest<void>(`/projects/${projectId}/candidates/${candidateId}`, { method: 'DELETE' });

export function useRemoveCandidate(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (candidateId: number) => removeCandidate(projectId, candidateId),
    onSuccess: () => refreshAfterCandidateChange(queryClient, projectId),
  });
}
