import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Region } from '../../server/entities/index.js';
import { createHttpServer } from '../../server/http/http-server.js';
import { fixture } from '../fixtures/make-upload-fixtures.js';
import { sleep } from '../support/process.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

/**
 * Uploads cut off mid-stream — the client sends part of a multipart body and then its socket is
 * destroyed (or it stalls and gives up) — store nothing, write no file, and leave the server
 * serving. A raw HTTP request over a real socket, since supertest always finishes its bodies.
 */
const dataDirBefore = process.env.WARPMETER_DATA_DIR;
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'wm-faults-upload-'));
let t: Awaited<ReturnType<typeof createTestApp>>;
let s: StudioFixture;
let server: http.Server;
let port: number;
let projectId: number;
let cookie: string;
let csrf: string;

beforeAll(async () => {
  process.env.WARPMETER_DATA_DIR = dataDir;
  t = await createTestApp();
  s = await createStudioWithRoles(t);
  projectId = (await s.cartographer.post('/api/projects', { title: 'Cut uploads', clientName: 'C', purpose: 'reference', scaleBand: 'country' })).body.id;
  server = createHttpServer(t.app).listen(0, '127.0.0.1');
  await new Promise<void>((r) => server.once('listening', () => r()));
  port = (server.address() as AddressInfo).port;
  // A second session of the cartographer, over a real socket.
  const res = await fetch(`http://127.0.0.1:${port}/api/auth/csrf`);
  const anon = res.headers.getSetCookie()[0].split(';')[0];
  const token = ((await res.json()) as { csrfToken: string }).csrfToken;
  const signIn = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, {
    method: 'POST',
    headers: { cookie: anon, 'x-csrf-token': token, 'content-type': 'application/json' },
    body: JSON.stringify({ email: s.users.cartographer.email, password: s.users.cartographer.password }),
  });
  cookie = signIn.headers.getSetCookie()[0].split(';')[0];
  csrf = ((await signIn.json()) as { csrfToken: string }).csrfToken;
});

afterAll(async () => {
  server.closeAllConnections();
  await new Promise<void>((r) => server.close(() => r()));
  await t.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
  if (dataDirBefore === undefined) delete process.env.WARPMETER_DATA_DIR;
  else process.env.WARPMETER_DATA_DIR = dataDirBefore;
});

function multipart(file: Buffer, name: string) {
  const boundary = `----wm${Date.now()}`;
  const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="features"\r\n\r\nall\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: application/octet-stream\r\n\r\n`);
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  return { body: Buffer.concat([head, file, tail]), type: `multipart/form-data; boundary=${boundary}` };
}

/** Sends `fraction` of the body, then destroys the socket after `holdMs`. Resolves when the socket is gone. */
function cutUpload(route: string, body: Buffer, type: string, fraction: number, holdMs: number, chunked = false): Promise<string> {
  return new Promise((resolve) => {
    const req = http.request({
      host: '127.0.0.1',
      port,
      method: 'POST',
      path: `/api/projects/${projectId}/${route}`,
      headers: {
        cookie,
        'x-csrf-token': csrf,
        'content-type': type,
        ...(chunked ? { 'transfer-encoding': 'chunked' } : { 'content-length': String(body.length) }),
      },
    });
    let outcome = 'no answer';
    req.on('response', (res) => (outcome = `answered ${res.statusCode}`));
    req.on('error', () => {});
    req.on('close', () => resolve(outcome));
    req.write(body.subarray(0, Math.floor(body.length * fraction)));
    setTimeout(() => req.destroy(), holdMs);
  });
}

const rows = () => t.deps.dataSource.getRepository(Region).countBy({ projectId });

describe('uploads interrupted mid-stream', () => {
  it('store nothing, write no file, and the server keeps serving', async () => {
    const files = [
      ['michigan-epsg5070.zip', fixture('michigan-epsg5070.zip')],
      ['great-lakes-states.geojson', fixture('great-lakes-states.geojson')],
      // Large enough to arrive in many chunks.
      ['padded.geojson', Buffer.concat([fixture('great-lakes-states.geojson').subarray(0, -1), Buffer.from(`,"pad":"${'x'.repeat(3_000_000)}"}`)])],
    ] as const;
    const before = await rows();
    const outcomes: string[] = [];
    for (const [name, data] of files) {
      const { body, type } = multipart(data, name);
      for (const route of ['regions', 'regions/inspect']) {
        for (const [fraction, holdMs, chunked] of [[0.5, 20, false], [0.97, 50, false], [0.3, 300, true], [0.999, 10, true]] as const) {
          outcomes.push(await cutUpload(route, body, type, fraction, holdMs, chunked));
        }
      }
    }
    // Several at once, cut together.
    const { body, type } = multipart(files[2][1], 'padded.geojson');
    outcomes.push(...(await Promise.all(Array.from({ length: 8 }, (_, i) => cutUpload('regions', body, type, 0.2 + i * 0.1, 30 + i * 10)))));
    await sleep(300);
    const tally = outcomes.reduce<Record<string, number>>((m, o) => ((m[o] = (m[o] ?? 0) + 1), m), {});
    console.info(`faults-upload: ${outcomes.length} cut uploads: ${JSON.stringify(tally)}; region rows before ${before}, after ${await rows()}`);
    expect(outcomes.every((o) => o === 'no answer' || /answered 4\d\d/.test(o)), outcomes.join(', ')).toBe(true);
    expect(await rows()).toBe(before);
    expect(fs.readdirSync(dataDir)).toEqual([]);

    // Still serving: the same upload sent whole is stored once.
    expect((await s.editor.get(`/api/projects/${projectId}`)).status).toBe(200);
    const whole = await s.cartographer.agent
      .post(`/api/projects/${projectId}/regions`)
      .set('x-csrf-token', s.cartographer.csrf)
      .attach('file', files[1][1], files[1][0]);
    expect(whole.status, JSON.stringify(whole.body)).toBe(201);
    expect(await rows()).toBe(before + 1);
  });
});
