import type { AddressInfo } from 'node:net';
import pino from 'pino';
import Stripe from 'stripe';
import type { Express } from 'express';
import { createApp } from '../../server/app.js';
import { bootstrap } from '../../server/bootstrap.js';
import { loadConfig } from '../../server/config.js';
import type { AppDeps } from '../../server/deps.js';
import { startFakePay, type FakePay } from '../../server/fakes/pay.js';
import { createHttpServer } from '../../server/http/http-server.js';

/**
 * An app listening on a free loopback port with its own local payment provider, whose signed
 * webhooks go to that app — so a test file's events never reach another file's app. `sdk` is
 * an SDK client on the same provider, for looking at (or changing) things as the provider's own
 * dashboard would. `logs()` returns what the app logged, parsed.
 */
export interface BillingHarness {
  app: Express;
  deps: AppDeps;
  fake: FakePay;
  sdk: Stripe;
  webhookUrl: string;
  logs(): Array<Record<string, unknown>>;
  /** Waits until every queued webhook delivery was answered. */
  drain(): Promise<void>;
  close(): Promise<void>;
}

export async function startBillingHarness(): Promise<BillingHarness> {
  const base = loadConfig();
  const fake = await startFakePay({ webhookSecret: base.pay.webhookSecret });
  const config = { ...base, pay: { ...base.pay, host: '127.0.0.1', port: fake.port, protocol: 'http' as const } };
  const lines: string[] = [];
  const logger = pino({ level: 'info' }, { write: (line: string) => void lines.push(line) });
  const deps = await bootstrap(config, logger);
  const app = createApp(deps);
  const server = createHttpServer(app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const webhookUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/billing/webhook`;
  fake.webhooks.url = webhookUrl;
  const sdk = new Stripe(config.pay.apiKey, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
  return {
    app,
    deps,
    fake,
    sdk,
    webhookUrl,
    logs: () => lines.map((l) => JSON.parse(l) as Record<string, unknown>),
    drain: () => fake.webhooks.drain(),
    close: async () => {
      await fake.close();
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
      const store = deps.services.sessionStore as { close?: () => Promise<void> } | undefined;
      await store?.close?.();
      await deps.dataSource.destroy();
    },
  };
}

/** Calls the fake provider's control surface (`/_fake/…`): GET without a body, POST with one. */
export async function control<T = Record<string, unknown>>(fake: FakePay, path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${fake.url}/_fake/${path}`, {
    method: body === undefined ? 'GET' : 'POST',
    headers: { 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`fake control ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}
