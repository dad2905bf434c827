import type { AddressInfo } from 'node:net';
import type http from 'node:http';
import express from 'express';
import { afterEach, describe, expect, it } from 'vitest';
import { createHttpServer } from './http-server.js';

let server: http.Server | undefined;
afterEach(async () => {
  server?.closeAllConnections();
  await new Promise((resolve) => server?.close(resolve));
  server = undefined;
});

async function listen(app: express.Express): Promise<string> {
  server = createHttpServer(app);
  await new Promise<void>((resolve) => server!.listen(0, '127.0.0.1', resolve));
  return `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
}

describe('createHttpServer', () => {
  it('builds each request and response with the app’s own prototypes before Express sees them', async () => {
    const app = express();
    app.get('/x', (_req, res) => void res.json({ ok: true }));
    const url = await listen(app);
    const seen: Array<[object, object]> = [];
    // Runs before the app's own listener, so it sees the objects as Node built them.
    server!.prependListener('request', (req, res) => seen.push([Object.getPrototypeOf(req), Object.getPrototypeOf(res)]));
    for (let i = 0; i < 2; i++) expect((await fetch(`${url}/x`)).status).toBe(200);
    expect(seen).toHaveLength(2);
    for (const [reqProto, resProto] of seen) {
      expect(reqProto).toBe(app.request);
      expect(resProto).toBe(app.response);
    }
  });

  it('leaves requests and responses working as Node and Express objects (body, query, ip, status, headers)', async () => {
    const app = express();
    app.set('trust proxy', 'loopback');
    app.post('/echo', express.json(), (req, res) => {
      res.status(201).set('x-seen', String(req.get('x-probe'))).json({ body: req.body, q: req.query.q, ip: req.ip, stream: typeof req.pipe });
    });
    const url = await listen(app);
    const res = await fetch(`${url}/echo?q=areal`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-probe': 'h-k' }, body: JSON.stringify({ omegaDeg: 1.5 }) });
    expect(res.status).toBe(201);
    expect(res.headers.get('x-seen')).toBe('h-k');
    expect(await res.json()).toEqual({ body: { omegaDeg: 1.5 }, q: 'areal', ip: '127.0.0.1', stream: 'function' });
  });
});
