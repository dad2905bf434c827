import type { QueryClient } from '@tanstack/react-query';
import { projectListsKey } from '@/features/projects/api/get-projects.js';
import { projectQueryOptions } from '@/features/projects/api/get-project.js';

/**
 * After a shortlist is sent or decided the project's status changes: refresh the project and
 * everything under its key (rounds, record, comments, history) and the project lists.
 */
export async function refreshProject(queryClient: QueryClient, projectId: number) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: projectQueryOptions(projectId).queryKey }),
    queryClient.invalidateQueries({ queryKey: projectListsKey }),
  ]);
}
