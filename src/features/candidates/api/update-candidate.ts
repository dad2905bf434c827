import { useMutation, useQueryClient } from '@tanstack/react-query';
import { candidateSchema, type UpdateCandidateInput } from '@shared/api/candidates.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { candidatesQueryOptions } from './get-candidates.js';

/** `PATCH /api/projects/:projectId/candidates/:candidateId`: a new label. */
export const updateCandidate = (projectId: number, candidateId: number, input: UpdateCandidateInput) =>
  apiRequest(`/projects/${projectId}/candidates/${candidateId}`, { method: 'PATCH', body: input, schema: candidateSchema });

export function useUpdateCandidate(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ candidateId, label }: { candidateId: number; label: string }) => updateCandidate(projectId, candidateId, { label }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: candidatesQueryOptions(projectId).queryKey }),
  });
}
