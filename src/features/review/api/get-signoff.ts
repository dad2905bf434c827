import { queryOptions } from '@tanstack/react-query';
import { signOffSchema, type SignOffView } from '@shared/api/review.schema.js';
import { apiRequest, isApiError } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/signoff`: the sealed record, or null while the project has none. */
export async function getProjectSignOff(projectId: number, signal?: AbortSignal): Promise<SignOffView | null> {
  try {
    return await apiRequest(`/projects/${projectId}/signoff`, { schema: signOffSchema, signal });
  } catch (err) {
    if (isApiError(err) && err.status === 404) return null;
    throw err;
  }
}

export const signOffQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'signoff'] as const, queryFn: ({ signal }) => getProjectSignOff(projectId, signal) });

/** Where the PDF sign-off sheet of a record is served. */
export const signOffSheetUrl = (signOffId: number) => `/api/signoffs/${signOffId}/sheet.pdf`;
