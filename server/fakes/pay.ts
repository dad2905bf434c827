import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { apiRoutes, expand } from './pay-api.js';
import { PayBilling } from './pay-billing.js';
import { PayError } from './pay-errors.js';
import { asList, parseForm } from './pay-form.js';
import { controlRoutes } from './pay-control.js';
import { newId, PayStore, type EventRec } from './pay-store.js';
import { WebhookSender } from './pay-webhooks.js';

export interface FakePayOptions {
  port?: number;
  /** Where signed events are POSTed; settable later through `POST /_fake/config`. */
  webhookUrl?: string | null;
  webhookSecret: string;
}

export interface FakePay {
  port: number;
  /** `http://127.0.0.1:<port>` */
  url: string;
  store: PayStore;
  billing: PayBilling;
  webhooks: WebhookSender;
  close(): Promise<void>;
}

const readBody = (req: http.IncomingMessage) =>
  new Promise<string>((resolve, reject) => {
    let body = '';
    req.setEncoding('utf8');
    req.on('data', (c: string) => {
      body += c;
      if (body.length > 1_000_000) reject(new PayError(413, 'invalid_request_error', 'Request too large.'));
    });
    req.on('end', () => resolve(body));
    req.on('error', reject);
  });

/** The secret key from `Bearer <key>` (the SDK) or HTTP Basic with the key as user name (curl -u). */
function apiKeyOf(header: string | undefined): string {
  const [scheme, value = ''] = (header ?? '').split(' ');
  if (scheme === 'Bearer') return value;
  if (scheme === 'Basic') return Buffer.from(value, 'base64').toString('utf8').split(':')[0];
  return '';
}

const send = (res: http.ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}) =>
  res.writeHead(status, { 'content-type': 'application/json', 'request-id': newId('req'), ...headers }).end(JSON.stringify(body));

/**
 * A local stand-in for the payment provider's API, for development and tests, on 127.0.0.1.
 * `/v1/…` is the provider's REST surface (test-mode secret keys only); `/_fake/…` is a separate
 * control surface for tests and demos (see pay-control.ts). State lives in memory.
 */
export async function startFakePay(opts: FakePayOptions): Promise<FakePay> {
  const store = new PayStore();
  const webhooks = new WebhookSender(opts.webhookSecret, opts.webhookUrl);
  const emit = (type: string, object: Record<string, unknown>, previous?: Record<string, unknown>) => {
    const e: EventRec = { id: newId('evt'), type, created: store.now(), object, previousAttributes: previous };
    store.events.push(e);
    webhooks.enqueue(e);
  };
  const billing = new PayBilling(store, emit);
  const api = apiRoutes(billing);
  const control = controlRoutes(billing, webhooks);
  // Replays of a request with the same Idempotency-Key answer the first result, as the provider does.
  const idempotent = new Map<string, { status: number; body: unknown }>();

  const server = http.createServer(async (req, res) => {
    try {
      const url = new URL(req.url ?? '/', 'http://127.0.0.1');
      const method = req.method ?? 'GET';
      const raw = await readBody(req);
      if (url.pathname.startsWith('/_fake/')) {
        const route = control.find((r) => r.method === method && r.pattern.test(url.pathname));
        if (!route) return send(res, 404, { error: `no control route ${method} ${url.pathname}` });
        const id = url.pathname.match(route.pattern)?.[1] ?? '';
        try {
          return send(res, 200, await route.handler(raw ? JSON.parse(raw) : {}, id));
        } catch (err) {
          if (err instanceof PayError) throw err;
          return send(res, 400, { error: (err as Error).message });
        }
      }
      if (!/^sk_test_\w+$/.test(apiKeyOf(req.headers.authorization))) {
        throw new PayError(401, 'authentication_error', 'Invalid API Key provided. This local provider accepts test-mode secret keys (sk_test_…) only.');
      }
      const key = req.headers['idempotency-key'];
      const cacheKey = typeof key === 'string' && method === 'POST' ? `${url.pathname}|${key}` : null;
      const cached = cacheKey ? idempotent.get(cacheKey) : undefined;
      if (cached) return send(res, cached.status, cached.body, { 'idempotent-replayed': 'true' });
      const params = parseForm(method === 'GET' || method === 'DELETE' ? url.search.slice(1) : raw);
      const route = api.find((r) => r.method === method && r.pattern.test(url.pathname));
      if (!route) throw new PayError(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${url.pathname}).`);
      let status = 200;
      let body: unknown;
      try {
        body = route.handler(params, url.pathname.match(route.pattern)?.[1] ?? '');
        for (const path of asList(params.expand)) body = expand(billing, body, String(path).split('.'));
      } catch (err) {
        if (!(err instanceof PayError)) throw err;
        status = err.status;
        body = err.body();
      }
      if (cacheKey) idempotent.set(cacheKey, { status, body });
      send(res, status, body);
    } catch (err) {
      if (err instanceof PayError) return send(res, err.status, err.body());
      send(res, 500, { error: { type: 'api_error', message: (err as Error).message } });
    }
  });
  await new Promise<void>((resolve) => server.listen(opts.port ?? 0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  return {
    port,
    url: `http://127.0.0.1:${port}`,
    store,
    billing,
    webhooks,
    close: async () => {
      await webhooks.drain();
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}
