import { useMutation, useQueryClient } from '@tanstack/react-query';
import { roundSchema, type ReturnRoundInput } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { refreshProject } from './invalidate-project.js';

/** `POST /api/rounds/:roundId/return` (the reviewer): sends the shortlist back with a comment. */
export const returnRound = (roundId: number, input: ReturnRoundInput) =>
  apiRequest(`/rounds/${roundId}/return`, { method: 'POST', body: input, schema: roundSchema });

export function useReturnRound(projectId: number, roundId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReturnRoundInput) => returnRound(roundId, input),
    onSuccess: () => refreshProject(queryClient, projectId),
  });
}
