import fs from 'node:fs';
import fsp from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { processAudit } from '../../server/jobs/audit-processor.js';
import { sharedAuditEngine } from '../../server/jobs/engine-instance.js';
import { stopAuditJobs } from '../../server/jobs/runner.js';
import { createAuditProject, worldCountry } from '../support/audit-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

/**
 * A heatmap whose drawing or caching fails: sharp throws while encoding, the disk is full
 * (ENOSPC half-way through writing the file), or the cache directory cannot be created. Each
 * answer is clean — a JSON error without internals when drawing failed, the whole picture when
 * only the cache failed — no half-written file is ever left in the cache, and the next request after the fault
 * is served normally.
 */
const fault = vi.hoisted(() => ({ sharp: false }));
vi.mock('sharp', async (importOriginal) => {
  const real = ((await importOriginal()) as { default: (...a: unknown[]) => { png: (o?: unknown) => { toBuffer: () => Promise<Buffer> } } }).default;
  // A seam in front of the real sharp: when the flag is up, encoding fails as libvips would.
  const wrapped = (...args: unknown[]) => {
    const img = real(...args);
    if (!fault.sharp) return img;
    return { png: () => ({ toBuffer: () => Promise.reject(new Error('VipsForeignSave: out of memory in /srv/app/node_modules/sharp')) }) };
  };
  return { default: Object.assign(wrapped, real) };
});

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const dataDirBefore = process.env.WARPMETER_DATA_DIR;
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'wm-faults-heatmap-'));

let t: Awaited<ReturnType<typeof createTestApp>>;
let s: StudioFixture;
let auditId: number;
let candidateIds: number[];
let sizePx = 96;
const nextSize = () => (sizePx += 8); // each case its own picture (the cache key includes the size)

beforeAll(async () => {
  process.env.WARPMETER_DATA_DIR = dataDir;
  t = await createTestApp();
  s = await createStudioWithRoles(t);
  const p = await createAuditProject(t.deps, s, {
    geometry: worldCountry('Portugal', '110m'),
    definitions: ['+proj=laea +lat_0=39.5 +lon_0=-8 +x_0=0 +y_0=0 +ellps=WGS84'],
  });
  candidateIds = p.candidateIds;
  const res = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 2000, seed: 3 });
  expect(res.status).toBe(202);
  auditId = res.body.id;
  const engine = await sharedAuditEngine();
  expect(await processAudit({ dataSource: t.deps.dataSource, logger: t.deps.logger, engine }, auditId)).toBe('done');
}, 120_000);

afterEach(() => {
  fault.sharp = false;
  vi.restoreAllMocks();
});
afterAll(async () => {
  await stopAuditJobs(t.deps);
  await t.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
  if (dataDirBefore === undefined) delete process.env.WARPMETER_DATA_DIR;
  else process.env.WARPMETER_DATA_DIR = dataDirBefore;
});

const heatmap = (size: number) => s.editor.get(`/api/audits/${auditId}/candidates/${candidateIds[0]}/heatmap/areal-scale.png?size=${size}`).buffer(true);
/** Every file in the cache directory of this audit (renders, temporaries). */
const cacheFiles = () => {
  const dir = path.join(dataDir, 'heatmaps', String(auditId));
  return fs.existsSync(dir) && fs.statSync(dir).isDirectory() ? fs.readdirSync(dir) : [];
};
const expectCleanError = (res: { status: number; body: { error?: { code?: string; message?: string } }; text: string }) => {
  expect(res.status).toBeGreaterThanOrEqual(500);
  expect(res.body.error?.code).toEqual(expect.any(String));
  expect(res.body.error?.message).toEqual(expect.any(String));
  expect(res.text).not.toMatch(/Vips|node_modules|\/srv\/app\/|\n\s+at /);
};

describe('heatmap faults', () => {
  it('sharp failing while encoding: a clean error, nothing cached, and the next request draws it', async () => {
    const size = nextSize();
    fault.sharp = true;
    const res = await heatmap(size);
    expectCleanError(res);
    expect(cacheFiles().filter((f) => f.includes(`-${size}-`))).toEqual([]);
    fault.sharp = false;
    const again = await heatmap(size);
    expect(again.status).toBe(200);
    expect(again.headers['x-heatmap-cache']).toBe('miss');
    expect((again.body as Buffer).subarray(0, 8).equals(PNG_MAGIC)).toBe(true);
  });

  it('disk full half-way through writing the cache file: no corrupt file is left, and nothing corrupt is ever served', async () => {
    const size = nextSize();
    const realWrite = fsp.writeFile;
    vi.spyOn(fsp, 'writeFile').mockImplementation(async (file, data, opts) => {
      // Write half of it, then fail the way a full disk does.
      const bytes = Buffer.from(data as Buffer);
      await realWrite(file, bytes.subarray(0, bytes.length >> 1), opts as never);
      throw Object.assign(new Error(`ENOSPC: no space left on device, write '${String(file)}'`), { code: 'ENOSPC', errno: -28, syscall: 'write' });
    });
    const res = await heatmap(size);
    // Only the cache failed: the picture itself is served, whole (drawn, just not cached).
    expect(res.status).toBe(200);
    expect(res.headers['x-heatmap-cache']).toBe('miss');
    const png = res.body as Buffer;
    expect(png.subarray(0, 8).equals(PNG_MAGIC)).toBe(true);
    expect(png.readUInt32BE(16)).toBe(size);
    expect(png.subarray(-8, -4).toString('latin1')).toBe('IEND');
    expect(cacheFiles().filter((f) => f.includes(`-${size}-`))).toEqual([]);
    vi.restoreAllMocks();
    const again = await heatmap(size);
    expect(again.status).toBe(200);
    expect((again.body as Buffer).subarray(-8, -4).toString('latin1')).toBe('IEND');
    expect(cacheFiles().filter((f) => f.includes(`-${size}-`) && f.endsWith('.png'))).toHaveLength(1);
    expect(cacheFiles().filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('a cache directory that cannot be created: a clean answer, and the app keeps serving', async () => {
    const size = nextSize();
    const root = path.join(dataDir, 'heatmaps');
    const moved = `${root}.moved`;
    fs.renameSync(root, moved);
    fs.writeFileSync(root, 'not a directory'); // mkdir -p under it fails with ENOTDIR
    try {
      const res = await heatmap(size);
      expect(res.status).toBe(200);
      expect((res.body as Buffer).subarray(0, 8).equals(PNG_MAGIC)).toBe(true);
      expect((await s.editor.get(`/api/audits/${auditId}`)).status).toBe(200);
    } finally {
      fs.rmSync(root);
      fs.renameSync(moved, root);
    }
    expect((await heatmap(size)).status).toBe(200);
  });
});
