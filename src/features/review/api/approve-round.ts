import { useMutation, useQueryClient } from '@tanstack/react-query';
import { signOffSchema, type ApproveRoundInput } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { refreshProject } from './invalidate-project.js';
import { signOffQueryOptions } from './get-signoff.js';

/** `POST /api/rounds/:roundId/approve` (the reviewer): approves one candidate; answers with the sealed record. */
export const approveRound = (roundId: number, input: ApproveRoundInput) =>
  apiRequest(`/rounds/${roundId}/approve`, { method: 'POST', body: input, schema: signOffSchema });

export function useApproveRound(projectId: number, roundId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ApproveRoundInput) => approveRound(roundId, input),
    onSuccess: async (signOff) => {
      queryClient.setQueryData(signOffQueryOptions(projectId).queryKey, signOff);
      await refreshProject(queryClient, projectId);
    },
  });
}
