import { useMutation, useQueryClient } from '@tanstack/react-query';
import { verifyResultSchema } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { activityQueryOptions } from './get-activity.js';

/** `POST /api/signoffs/:id/verify`: re-runs the audit from the record; may take a few seconds. */
export const verifySignOff = (signOffId: number) =>
  apiRequest(`/signoffs/${signOffId}/verify`, { method: 'POST', schema: verifyResultSchema });

export function useVerifySignOff(projectId: number, signOffId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => verifySignOff(signOffId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: activityQueryOptions(projectId).queryKey }),
  });
}
