import { useMutation, useQueryClient } from '@tanstack/react-query';
import { auditSummarySchema, type StartAuditInput } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { projectQueryOptions } from '@/features/projects/api/get-project.js';
import { auditsQueryOptions } from './get-audits.js';

/** `POST /api/projects/:projectId/audits` (cartographers, admins): queues an audit; 202 with its summary. */
export const startAudit = (projectId: number, input: StartAuditInput) =>
  apiRequest(`/projects/${projectId}/audits`, { method: 'POST', body: input, schema: auditSummarySchema });

export function useStartAudit(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StartAuditInput) => startAudit(projectId, input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: auditsQueryOptions(projectId).queryKey }),
        // The project's own counts (the tab label shows the number of audits).
        queryClient.invalidateQueries({ queryKey: projectQueryOptions(projectId).queryKey, exact: true }),
      ]),
  });
}
