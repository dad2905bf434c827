import type { z } from 'zod';
import { apiErrorSchema } from '@shared/api/error.schema.js';
import { sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { ApiError } from '@/lib/api-client.js';
import { queryClient } from '@/lib/query-client.js';

export interface UploadProgress {
  loadedBytes: number;
  totalBytes: number;
}

/**
 * POSTs a multipart form with XMLHttpRequest, whose upload events give real progress (fetch has
 * none for request bodies). Same contract as apiRequest: the session's CSRF token (refreshed and
 * retried once if refused), the JSON answer checked by a schema, refusals as ApiError.
 */
export async function sendMultipart<T>(
  path: string,
  form: FormData,
  schema: z.ZodType<T>,
  onProgress?: (p: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<T> {
  const send = (token: string) =>
    new Promise<{ status: number; body: unknown }>((resolve, reject) => {
      const xhr = new XMLHttpRequest();
      xhr.open('POST', `/api${path}`);
      xhr.setRequestHeader('accept', 'application/json');
      xhr.setRequestHeader('x-csrf-token', token);
      xhr.withCredentials = true;
      xhr.upload.onprogress = (e) => onProgress?.({ loadedBytes: e.loaded, totalBytes: e.lengthComputable ? e.total : 0 });
      xhr.onload = () => {
        let body: unknown = null;
        try {
          body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
        } catch {
          body = null;
        }
        resolve({ status: xhr.status, body });
      };
      xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload did not reach Warpmeter. Check your connection and try again.'));
      xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
      signal?.addEventListener('abort', () => xhr.abort(), { once: true });
      xhr.send(form);
    });

  const session = await queryClient.ensureQueryData(sessionQueryOptions());
  let res = await send(session.csrfToken);
  if (res.status === 403 && codeOf(res.body) === 'csrf_failed') {
    const fresh = await queryClient.fetchQuery({ ...sessionQueryOptions(), staleTime: 0 });
    res = await send(fresh.csrfToken);
  }
  if (res.status >= 200 && res.status < 300) return schema.parse(res.body);
  const parsed = apiErrorSchema.safeParse(res.body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    throw new ApiError(res.status, code, message, fields);
  }
  throw new ApiError(res.status, `http_${res.status}`, res.status === 413 ? 'The file is too large to upload.' : `The upload was refused (HTTP ${res.status}).`);
}

function codeOf(body: unknown): string | undefined {
  const parsed = apiErrorSchema.safeParse(body);
  return parsed.success ? parsed.data.error.code : undefined;
}
