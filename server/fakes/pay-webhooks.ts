import { createHmac } from 'node:crypto';
import type { EventRec } from './pay-store.js';

/**
 * Signs and delivers events the way the hosted provider does: a JSON POST with the header
 * `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>" keyed by the endpoint
 * secret>`. Deliveries go out one at a time, in the order the events happened, unless automatic
 * delivery is switched off (tests then deliver chosen events in a chosen order).
 */
export function signPayload(payload: string, secret: string, timestampSec = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac('sha256', secret).update(`${timestampSec}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampSec},v1=${v1}`;
}

export interface Delivery {
  attempts: number;
  lastStatus: number | null;
  lastError: string | null;
  lastBody: string | null;
}

export const API_VERSION = '2026-10-28.endive';

export function eventBody(e: EventRec): string {
  return JSON.stringify({
    id: e.id,
    object: 'event',
    api_version: API_VERSION,
    created: e.created,
    type: e.type,
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: { object: e.object, ...(e.previousAttributes ? { previous_attributes: e.previousAttributes } : {}) },
  });
}

export class WebhookSender {
  url: string | null;
  auto = true;
  readonly deliveries = new Map<string, Delivery>();
  private chain: Promise<void> = Promise.resolve();
  private readonly retryDelaysMs = [200, 1000];

  constructor(
    private readonly secret: string,
    url?: string | null,
  ) {
    this.url = url ?? null;
  }

  /** Queues an event when automatic delivery is on. */
  enqueue(e: EventRec) {
    if (!this.auto || !this.url) return;
    this.chain = this.chain.then(() => this.deliverWithRetries(e));
  }

  private async deliverWithRetries(e: EventRec) {
    for (let attempt = 0; ; attempt++) {
      const res = await this.deliver(e);
      if (res.status >= 200 && res.status < 300) return;
      const delay = this.retryDelaysMs[attempt];
      if (delay === undefined) return;
      await new Promise((r) => setTimeout(r, delay));
    }
  }

  /** One delivery attempt now; answers what the endpoint said (status 0 when unreachable). */
  async deliver(e: EventRec): Promise<{ status: number; body: string }> {
    const d = this.deliveries.get(e.id) ?? { attempts: 0, lastStatus: null, lastError: null, lastBody: null };
    this.deliveries.set(e.id, d);
    d.attempts += 1;
    if (!this.url) {
      d.lastError = 'no webhook endpoint configured';
      return { status: 0, body: d.lastError };
    }
    const payload = eventBody(e);
    try {
      const res = await fetch(this.url, {
        method: 'POST',
        headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signPayload(payload, this.secret) },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      const body = await res.text();
      Object.assign(d, { lastStatus: res.status, lastError: null, lastBody: body.slice(0, 2000) });
      return { status: res.status, body };
    } catch (err) {
      Object.assign(d, { lastStatus: null, lastError: (err as Error).message });
      return { status: 0, body: (err as Error).message };
    }
  }

  /** Resolves when every queued delivery has been attempted. */
  async drain() {
    let current: Promise<void>;
    do {
      current = this.chain;
      await current;
    } while (current !== this.chain);
  }
}
