import { queryOptions } from '@tanstack/react-query';
import { getAudit } from '@/features/audits/api/get-audit.js';
import { getAudits } from '@/features/audits/api/get-audits.js';

/**
 * The project's finished audits with their scorecards, for picking a shortlist: the audits
 * feature's own list and detail requests, the detail fetched for each finished audit.
 */
export async function getFinishedAudits(projectId: number, signal?: AbortSignal) {
  const { audits } = await getAudits(projectId, signal);
  return Promise.all(audits.filter((a) => a.status === 'done').map((a) => getAudit(a.id, signal)));
}

export const finishedAuditsQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'audits', 'finished'] as const, queryFn: ({ signal }) => getFinishedAudits(projectId, signal) });
