import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, apiRequest, configureCsrf } from './api-client.js';

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });

function stubFetch(...answers: Array<Response | Error>) {
  const calls: Array<{ url: string; init: RequestInit }> = [];
  vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
    calls.push({ url, init });
    const next = answers.shift();
    if (!next) throw new Error('unexpected extra request');
    if (next instanceof Error) throw next;
    return next;
  });
  return calls;
}
const header = (init: RequestInit, name: string) => (init.headers as Record<string, string>)[name];

afterEach(() => vi.unstubAllGlobals());

describe('apiRequest', () => {
  it('sends JSON with the CSRF token on writes only, and validates the answer', async () => {
    configureCsrf({ get: async () => 'tok-1', refresh: async () => 'tok-2' });
    const calls = stubFetch(json(200, { ok: true }), json(201, { id: 4 }));
    await apiRequest('/things', { schema: z.object({ ok: z.boolean() }) });
    const made = await apiRequest('/things', { method: 'POST', body: { name: 'x' }, schema: z.object({ id: z.number() }) });
    expect(made).toEqual({ id: 4 });
    expect(calls[0].url).toBe('/api/things');
    expect(header(calls[0].init, 'x-csrf-token')).toBeUndefined();
    expect(header(calls[1].init, 'x-csrf-token')).toBe('tok-1');
    expect(calls[1].init.body).toBe('{"name":"x"}');
    expect(calls[1].init.credentials).toBe('same-origin');
  });

  it("turns the server's error body into an ApiError with its fields", async () => {
    stubFetch(json(422, { error: { code: 'validation_failed', message: 'Some fields need attention.', fields: { email: 'Enter a valid e-mail address.' } } }));
    const err = await apiRequest('/people/invitations', { method: 'POST', body: {} }).catch((e) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 422, code: 'validation_failed', fields: { email: 'Enter a valid e-mail address.' } });
  });

  it('explains a non-JSON failure and an unreachable server in plain words', async () => {
    stubFetch(new Response('<html>Bad gateway</html>', { status: 502 }), new TypeError('fetch failed'));
    await expect(apiRequest('/x')).rejects.toMatchObject({ status: 502, message: expect.stringContaining('try again') });
    await expect(apiRequest('/x')).rejects.toMatchObject({ status: 0, code: 'network' });
  });

  it('retries a write once with a fresh token after a CSRF refusal, and no more', async () => {
    configureCsrf({ get: async () => 'stale', refresh: async () => 'fresh' });
    const refusal = () => json(403, { error: { code: 'csrf_failed', message: 'Reload the page and try again.' } });
    const calls = stubFetch(refusal(), new Response(null, { status: 204 }), refusal(), refusal());
    await expect(apiRequest('/auth/sign-out', { method: 'POST' })).resolves.toBeUndefined();
    expect(calls.map((c) => header(c.init, 'x-csrf-token'))).toEqual(['stale', 'fresh']);
    await expect(apiRequest('/auth/sign-out', { method: 'POST' })).rejects.toMatchObject({ status: 403, code: 'csrf_failed' });
    expect(calls).toHaveLength(4);
  });

  it('does not retry other refusals', async () => {
    const calls = stubFetch(json(403, { error: { code: 'forbidden', message: 'Your role does not allow this.' } }));
    await expect(apiRequest('/people', { method: 'PATCH', body: {} })).rejects.toMatchObject({ code: 'forbidden' });
    expect(calls).toHaveLength(1);
  });

  it('fails loudly when the answer does not match the contract', async () => {
    stubFetch(json(200, { user: 'nobody' }));
    await expect(apiRequest('/auth/session', { schema: z.object({ csrfToken: z.string() }) })).rejects.toBeInstanceOf(z.ZodError);
  });
});
