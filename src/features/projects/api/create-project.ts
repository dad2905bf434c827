import { useMutation, useQueryClient } from '@tanstack/react-query';
import { projectSchema, type CreateProjectInput } from '@shared/api/projects.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { projectListsKey } from './get-projects.js';

/** `POST /api/projects` (cartographer, admin). */
export const createProject = (input: CreateProjectInput) =>
  apiRequest('/projects', { method: 'POST', body: input, schema: projectSchema });

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectListsKey }),
  });
}
