import { useMutation, useQueryClient } from '@tanstack/react-query';
import { projectSchema, type UpdateProjectInput } from '@shared/api/projects.schema.js';
import { proposalsQueryOptions } from '@/features/candidates/api/get-proposals.js';
import { apiRequest } from '@/lib/api-client.js';
import { projectQueryOptions } from './get-project.js';
import { projectListsKey } from './get-projects.js';

/** `PATCH /api/projects/:projectId` (cartographer, admin): any of title, client, purpose, scale band, notes. */
export const updateProject = (projectId: number, input: UpdateProjectInput) =>
  apiRequest(`/projects/${projectId}`, { method: 'PATCH', body: input, schema: projectSchema });

export function useUpdateProject(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateProjectInput) => updateProject(projectId, input),
    onSuccess: (project) => {
      queryClient.setQueryData(projectQueryOptions(projectId).queryKey, project);
      // The purpose changes which candidates are proposed.
      void queryClient.invalidateQueries({ queryKey: proposalsQueryOptions(projectId).queryKey });
      return queryClient.invalidateQueries({ queryKey: projectListsKey });
    },
  });
}
