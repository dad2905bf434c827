import pino from 'pino';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app.js';
import { bootstrap } from '../../server/bootstrap.js';
import { loadConfig } from '../../server/config.js';
import { closeSharedEngineThread } from '../../server/engine-tasks/engine-thread.js';
import type { AppDeps } from '../../server/deps.js';
import type { CaughtMail } from '../../server/fakes/smtp.js';

/** An app on this run's fresh database (see global-setup.ts), for supertest. */
export async function createTestApp(): Promise<{
  app: Express;
  deps: AppDeps;
  dataSource: () => AppDeps['dataSource'];
  close: () => Promise<void>;
}> {
  const config = loadConfig();
  const deps = await bootstrap(config, pino({ level: process.env.LOG_LEVEL ?? 'silent' }));
  const app = createApp(deps);
  return {
    app,
    deps,
    dataSource: () => deps.dataSource,
    close: async () => {
      const store = deps.services.sessionStore as { close?: () => Promise<void> } | undefined;
      await store?.close?.();
      await closeSharedEngineThread(deps.services);
      await deps.dataSource.destroy();
    },
  };
}

/** Every message the run's fake SMTP server caught so far. */
export async function caughtMail(): Promise<CaughtMail[]> {
  const res = await fetch(`${loadConfig().smtp.mailboxUrl}/messages`);
  return (await res.json()) as CaughtMail[];
}

/** The newest message to an address, waiting briefly for delivery. */
export async function mailTo(address: string, timeoutMs = 5000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = (await caughtMail()).filter((m) => m.to.includes(address.toLowerCase()) || m.to.includes(address));
    if (found.length) return found[found.length - 1];
    if (Date.now() > until) throw new Error(`no mail to ${address} arrived`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A supertest agent that keeps cookies and sends the CSRF token on every state-changing call. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  csrf = '';
  constructor(app: Express) {
    this.agent = request.agent(app);
  }
  async refreshCsrf() {
    const res = await this.agent.get('/api/auth/csrf');
    this.csrf = res.body.csrfToken;
    return this.csrf;
  }
  get(url: string) {
    return this.agent.get(url);
  }
  post(url: string, body?: unknown) {
    return this.agent.post(url).set('x-csrf-token', this.csrf).send(body as object);
  }
  put(url: string, body?: unknown) {
    return this.agent.put(url).set('x-csrf-token', this.csrf).send(body as object);
  }
  patch(url: string, body?: unknown) {
    return this.agent.patch(url).set('x-csrf-token', this.csrf).send(body as object);
  }
  delete(url: string) {
    return this.agent.delete(url).set('x-csrf-token', this.csrf);
  }
}
