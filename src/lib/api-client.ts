import type { z } from 'zod';
import { apiErrorSchema } from '@shared/api/error.schema.js';

/** An API refusal or failure, with what the server said (or a plain account of what went wrong). */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export const isApiError = (e: unknown): e is ApiError => e instanceof ApiError;

/**
 * Where the CSRF token comes from. The session query owns it (see features/auth/api/get-session.ts);
 * the app wires it in once at start-up so this module does not depend on any feature.
 */
interface CsrfSource {
  get: () => Promise<string>;
  /** Fetches a fresh token after the server refused a stale one. */
  refresh: () => Promise<string>;
}
let csrf: CsrfSource = {
  get: async () => '',
  refresh: async () => '',
};
export function configureCsrf(source: CsrfSource) {
  csrf = source;
}

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  /** Validates the JSON answer, so a contract drift fails loudly here rather than deep in a page. */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
}

/** Calls `/api<path>` with JSON, the session cookie and, for writes, the CSRF token. */
export async function apiRequest<T = void>(path: string, opts: RequestOptions<T> = {}): Promise<T> {
  const method = opts.method ?? 'GET';
  const send = async (token: string) => {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (opts.body !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers['x-csrf-token'] = token;
    try {
      return await fetch(`/api${path}`, {
        method,
        headers,
        credentials: 'same-origin',
        body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
        signal: opts.signal,
      });
    } catch (err) {
      if ((err as Error).name === 'AbortError') throw err;
      throw new ApiError(0, 'network', 'Warpmeter cannot be reached. Check your connection and try again.');
    }
  };

  let res = await send(method === 'GET' ? '' : await csrf.get());
  if (res.status === 403 && method !== 'GET' && (await peekCode(res)) === 'csrf_failed') {
    // The session was renewed elsewhere (another tab signed in or out): retry once with a fresh token.
    res = await send(await csrf.refresh());
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204 || res.headers.get('content-length') === '0') return undefined as T;
  const data: unknown = await res.json();
  return opts.schema ? opts.schema.parse(data) : (data as T);
}

async function peekCode(res: Response): Promise<string | undefined> {
  try {
    const body = apiErrorSchema.safeParse(await res.clone().json());
    return body.success ? body.data.error.code : undefined;
  } catch {
    return undefined;
  }
}

async function toApiError(res: Response): Promise<ApiError> {
  try {
    const parsed = apiErrorSchema.safeParse(await res.json());
    if (parsed.success) {
      const { code, message, fields } = parsed.data.error;
      return new ApiError(res.status, code, message, fields);
    }
  } catch {
    // Not JSON (a proxy page, an empty body): fall through to a plain message.
  }
  const message =
    res.status >= 500
      ? 'The server ran into a problem. Please try again in a moment.'
      : `The request was refused (HTTP ${res.status}).`;
  return new ApiError(res.status, 'http_' + res.status, message);
}
