import { useMutation, useQueryClient } from '@tanstack/react-query';
import { commentSchema, type CreateCommentInput } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { commentsQueryOptions } from './get-comments.js';

/** `POST /api/projects/:projectId/comments`. */
export const addComment = (projectId: number, input: CreateCommentInput) =>
  apiRequest(`/projects/${projectId}/comments`, { method: 'POST', body: input, schema: commentSchema });

export function useAddComment(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateCommentInput) => addComment(projectId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: commentsQueryOptions(projectId).queryKey }),
  });
}
