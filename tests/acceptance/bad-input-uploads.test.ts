import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import v8 from 'node:v8';
import vm from 'node:vm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Region } from '../../server/entities/index.js';
import { malformedUploads, type UploadCase } from '../support/malformed-uploads.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

/**
 * At least 1 000 generated malformed uploads (see tests/support/malformed-uploads.ts) against
 * both upload routes, a few at a time: no 5xx ever; every refusal a 4xx with a code and a
 * message in words, without internals; only accepted uploads store a row (a mutation can leave a
 * file valid — a flipped digit is still a coordinate — and then it is stored like any other);
 * nothing is written to disk; and the heap after garbage collection has not grown by more than
 * a bound. WARPMETER_UPLOAD_FUZZ_SEED replays or varies the run.
 */
const COUNT = Number(process.env.WARPMETER_UPLOAD_FUZZ_COUNT ?? 1000);
const SEED = Number(process.env.WARPMETER_UPLOAD_FUZZ_SEED ?? 20261202);
const CONCURRENCY = 4;
const HEAP_GROWTH_LIMIT_MB = 64;
/** Kinds that are never a valid region, whatever the generator did to them. */
const ALWAYS_REFUSED = /random bytes|hostile zip|deeply nested|not GeoJSON|raw|multipart|wrong field|two files|image|missing|truncated \.shp|unreadable|points only|no polygons|out of range|empty|huge vertex|size limit|absurd/;
const INTERNALS = /\n\s+at |node_modules|\/work\/|TypeError|RangeError|ReferenceError|undefined is not|Cannot read prop|QueryFailedError|ER_[A-Z]/;

v8.setFlagsFromString('--expose-gc');
const gc = vm.runInNewContext('gc') as () => void;
const heapMb = () => {
  gc();
  gc();
  return process.memoryUsage().heapUsed / 1024 / 1024;
};

const dataDirBefore = process.env.WARPMETER_DATA_DIR;
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'wm-bad-uploads-'));
let t: Awaited<ReturnType<typeof createTestApp>>;
let s: StudioFixture;
let projectId: number;
let cases: UploadCase[];

beforeAll(async () => {
  process.env.WARPMETER_DATA_DIR = dataDir;
  t = await createTestApp();
  s = await createStudioWithRoles(t);
  const res = await s.cartographer.post('/api/projects', { title: 'Upload fuzz', clientName: 'Fuzz', purpose: 'reference', scaleBand: 'country' });
  projectId = res.body.id;
  cases = await malformedUploads(SEED, COUNT);
}, 120_000);

afterAll(async () => {
  await t.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
  if (dataDirBefore === undefined) delete process.env.WARPMETER_DATA_DIR;
  else process.env.WARPMETER_DATA_DIR = dataDirBefore;
});

function send(c: UploadCase, route: 'regions/inspect' | 'regions') {
  const req = s.cartographer.agent.post(`/api/projects/${projectId}/${route}`).set('x-csrf-token', s.cartographer.csrf);
  if (c.raw) return req.set('content-type', c.raw.contentType).send(c.raw.data);
  const f = c.file!;
  const opts = { filename: f.name, contentType: f.contentType ?? 'application/octet-stream' };
  req.attach(c.field ?? 'file', f.data, opts);
  if (c.twice) req.attach('file', f.data, opts);
  for (const [name, value] of Object.entries(c.fields ?? {})) req.field(name, value);
  return req;
}

describe('malformed region uploads', () => {
  it(`${COUNT} generated cases: no 5xx, clear 4xx refusals, rows only for accepted files, no files, bounded memory`, async () => {
    const regions = t.deps.dataSource.getRepository(Region);
    const rowsBefore = await regions.countBy({ projectId });
    // Warm-up (first-use allocations are not a leak), then the baseline.
    await send(cases[0], 'regions/inspect');
    const heapBefore = heapMb();
    const problems: string[] = [];
    const statuses = new Map<number, number>();
    const acceptedKinds = new Map<string, number>();
    const kindMs = new Map<string, number>();
    let stored = 0;
    let next = 0;
    const t0 = Date.now();
    const worker = async () => {
      for (let i = next++; i < cases.length; i = next++) {
        const c = cases[i];
        const route = i % 3 === 0 ? 'regions' : 'regions/inspect';
        const tc = Date.now();
        const res = await send(c, route);
        kindMs.set(c.kind, (kindMs.get(c.kind) ?? 0) + Date.now() - tc);
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        const where = `#${i} ${c.kind} → ${route}`;
        if (res.status >= 500) problems.push(`${where}: ${res.status} ${res.text.slice(0, 200)}`);
        else if (res.status >= 400) {
          const msg = res.body?.error?.message;
          if (typeof res.body?.error?.code !== 'string' || typeof msg !== 'string' || msg.length < 10) problems.push(`${where}: ${res.status} without a message: ${res.text.slice(0, 200)}`);
          else if (INTERNALS.test(res.text)) problems.push(`${where}: internals in ${res.text.slice(0, 300)}`);
        } else {
          acceptedKinds.set(c.kind, (acceptedKinds.get(c.kind) ?? 0) + 1);
          if (ALWAYS_REFUSED.test(c.kind)) problems.push(`${where}: accepted (${res.status}) ${res.text.slice(0, 200)}`);
          if (route === 'regions' && res.status === 201) stored++;
        }
      }
    };
    await Promise.all(Array.from({ length: CONCURRENCY }, worker));
    const elapsedS = (Date.now() - t0) / 1000;
    const heapAfter = heapMb();
    const rowsAfter = await regions.countBy({ projectId });
    const refused = [...statuses].filter(([code]) => code >= 400 && code < 500).reduce((n, [, k]) => n + k, 0);
    console.info(
      `bad-input-uploads: seed ${SEED}, ${cases.length} uploads in ${elapsedS.toFixed(1)} s; statuses ${JSON.stringify(Object.fromEntries([...statuses].sort()))}; ` +
        `accepted after mutation ${JSON.stringify(Object.fromEntries(acceptedKinds))}; rows ${rowsBefore}→${rowsAfter} (${stored} stored); heap ${heapBefore.toFixed(1)}→${heapAfter.toFixed(1)} MB; slowest kinds (ms) ${JSON.stringify([...kindMs].sort((a, b) => b[1] - a[1]).slice(0, 6))}`,
    );
    expect(problems).toEqual([]);
    expect(cases.length).toBeGreaterThanOrEqual(1000);
    expect(refused).toBeGreaterThanOrEqual(cases.length * 0.9);
    expect(rowsAfter - rowsBefore).toBe(stored);
    expect(fs.readdirSync(dataDir)).toEqual([]);
    expect(heapAfter - heapBefore).toBeLessThan(HEAP_GROWTH_LIMIT_MB);
    // Still healthy, and a good file still goes through.
    expect((await s.editor.get(`/api/projects/${projectId}`)).status).toBe(200);
  }, 240_000);
});
