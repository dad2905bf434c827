import { useMutation } from '@tanstack/react-query';
import { optimiseResultSchema, type OptimiseInput } from '@shared/api/candidates.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `POST /api/projects/:projectId/optimise`: tunes a family for the current region; nothing is stored. */
export const optimiseFamily = (projectId: number, input: OptimiseInput) =>
  apiRequest(`/projects/${projectId}/optimise`, { method: 'POST', body: input, schema: optimiseResultSchema });

export function useOptimiseFamily(projectId: number) {
  return useMutation({ mutationFn: (input: OptimiseInput) => optimiseFamily(projectId, input) });
}
