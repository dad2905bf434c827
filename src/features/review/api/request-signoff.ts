import { useMutation, useQueryClient } from '@tanstack/react-query';
import { roundSchema, type RequestSignOffInput } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { refreshProject } from './invalidate-project.js';

/** `POST /api/projects/:projectId/rounds` (editor, admin): sends the shortlist and e-mails the reviewers. */
export const requestSignOff = (projectId: number, input: RequestSignOffInput) =>
  apiRequest(`/projects/${projectId}/rounds`, { method: 'POST', body: input, schema: roundSchema });

export function useRequestSignOff(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RequestSignOffInput) => requestSignOff(projectId, input),
    onSuccess: () => refreshProject(queryClient, projectId),
  });
}
