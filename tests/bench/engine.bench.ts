/**
 * The engine's speed, as ratios measured in this run on the same 1 000 000 points over a
 * continent (Europe, equal-area samples): engine factors in-process and in a two-worker pool
 * against PROJ's proj_factors() in-process (tests/proj-harness/factors.c, timing mode);
 * `warpmeter factors` end to end against `proj -S`; a 12-candidate audit of a large multipart
 * region; and the CLI's peak memory on 10 million lines.
 */
import { execFileSync, spawn } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { feature } from 'topojson-client';
import { resolveDefinition } from '../../shared/engine/definition';
import { allocFactorArrays, createFactorEvaluator } from '../../shared/engine/evaluator';
import type { RegionFeature } from '../../shared/engine/region/geojson';
import { sampleRegion } from '../../shared/engine/sampling';
import { runAudit } from '../../server/cli/audit-command';
import { FactorPool } from '../../server/engine-pool/pool';
import { ensureProjHarness, repoRoot } from '../proj-harness/tools';
import type { BenchRow, BenchSection } from './run';

const FAMILIES = [
  '+proj=merc +ellps=WGS84',
  '+proj=tmerc +lon_0=10 +k_0=0.9996 +ellps=WGS84',
  '+proj=lcc +lat_1=40 +lat_2=62 +lat_0=52 +lon_0=10 +ellps=GRS80',
  '+proj=aea +lat_1=40 +lat_2=62 +lat_0=52 +lon_0=10 +ellps=GRS80',
  '+proj=laea +lat_0=52 +lon_0=10 +x_0=4321000 +y_0=3210000 +ellps=GRS80',
  '+proj=stere +lat_0=52 +lon_0=10 +k_0=0.9999 +ellps=WGS84',
  '+proj=eqearth +ellps=WGS84',
  '+proj=moll +R=6371000',
];
const N = 1_000_000;
const tmp = `${repoRoot}tests/.tmp`;
const pointsFile = `${tmp}/bench-europe-1m.txt`;

function europePoints() {
  const europe = { type: 'Polygon', coordinates: [[[-10, 36], [40, 36], [40, 71], [-10, 71], [-10, 36]]] } as const;
  const s = sampleRegion(europe as never, { count: N, seed: 1, pairs: 0 });
  let text = '';
  for (let i = 0; i < N; i++) text += `${s.lonDeg[i].toFixed(6)} ${s.latDeg[i].toFixed(6)}\n`;
  writeFileSync(pointsFile, text);
  return { lon: s.lonDeg, lat: s.latDeg };
}

const seconds = (t0: number) => (performance.now() - t0) / 1000;
const cpuSeconds = (c0: NodeJS.CpuUsage) => {
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1e6;
};
const ratio = (x: number) => `${x.toFixed(2)}×`;

function wall(cmd: string, args: string[], inputFile: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    const child = spawn('sh', ['-c', `"$0" "$@" < '${inputFile}' > /dev/null`, cmd, ...args], { stdio: ['ignore', 'ignore', 'inherit'] });
    child.on('error', reject);
    child.on('close', () => resolve(seconds(t0)));
  });
}

const factorsSection: BenchSection = {
  name: 'factors on 1 000 000 points over Europe (speed ratios, higher is faster)',
  async run() {
    const harness = ensureProjHarness();
    const { lon, lat } = europePoints();
    const pool = await FactorPool.start(2);
    const rows: BenchRow[] = [];
    try {
      for (const def of FAMILIES) {
        const resolved = resolveDefinition(def);
        const ev = createFactorEvaluator(resolved);
        const out = allocFactorArrays(N);
        ev.factorsBatchDeg(lon, lat, out, 0, 50_000); // warm-up
        let t0 = performance.now();
        const c0 = process.cpuUsage();
        ev.factorsBatchDeg(lon, lat, out);
        const engine = seconds(t0);
        const engineCpu = cpuSeconds(c0);
        await pool.factors(resolved, lon.subarray(0, 50_000), lat.subarray(0, 50_000)); // warm-up
        t0 = performance.now();
        await pool.factors(resolved, lon, lat);
        const pooled = seconds(t0);
        const timing = execFileSync(harness, ['--time', '1', def], { input: readFileSync(pointsFile) }).toString().split('\t');
        const proj = Number(timing[1]);
        const projCpu = Number(timing[3]);
        const cli = await wall(process.execPath, [`${repoRoot}server/cli/bin.mjs`, 'factors', '--proj', def], pointsFile);
        const projS = await wall('proj', ['-S', ...def.split(' ')], pointsFile);
        rows.push({
          family: def.split(' ')[0].slice(6),
          method: ev.method,
          'proj_factors() s': proj.toFixed(3),
          'engine 1 thread s': engine.toFixed(3),
          'engine vs PROJ': ratio(proj / engine),
          'engine vs PROJ (CPU time)': ratio(projCpu / engineCpu),
          'pool (2 workers) s': pooled.toFixed(3),
          'pool vs PROJ': ratio(proj / pooled),
          'proj -S s': projS.toFixed(2),
          'warpmeter factors s': cli.toFixed(2),
          'CLI vs proj -S': ratio(projS / cli),
        });
      }
    } finally {
      await pool.close();
    }
    rows.push({ family: `load average at the end: ${loadavg().map((x) => x.toFixed(1)).join(' ')}` });
    return rows;
  },
};

const auditSection: BenchSection = {
  name: '12-candidate audit of Indonesia (world-atlas 10m) at 100 000 samples per candidate',
  async run() {
    const topo = JSON.parse(readFileSync(`${repoRoot}node_modules/world-atlas/countries-10m.json`, 'utf8'));
    const fc = feature(topo, topo.objects.countries) as unknown as { features: RegionFeature[] };
    const indonesia = fc.features.find((f) => f.properties?.name === 'Indonesia')!;
    const defs = [
      '+proj=merc +lon_0=118', '+proj=tmerc +lon_0=118 +k_0=0.9996', '+proj=lcc +lat_1=-7 +lat_2=3 +lon_0=118',
      '+proj=aea +lat_1=-7 +lat_2=3 +lon_0=118', '+proj=laea +lat_0=-2 +lon_0=118', '+proj=stere +lat_0=-2 +lon_0=118',
      '+proj=aeqd +lat_0=-2 +lon_0=118 +R=6371000', '+proj=cea +lon_0=118', '+proj=eqc +lon_0=118', '+proj=sinu +lon_0=118',
      '+proj=moll +lon_0=118 +R=6371000', '+proj=eqearth +lon_0=118',
    ].map(resolveDefinition);
    const poolStart = performance.now();
    const pool = await FactorPool.start(2);
    const startup = seconds(poolStart);
    try {
      await runAudit(indonesia, defs.slice(0, 2), { count: 20_000, seed: 1, threads: 2, pool }); // warm-up
      const t0 = performance.now();
      const report = await runAudit(indonesia, defs, { count: 100_000, seed: 1, threads: 2, pool });
      const total = seconds(t0);
      return [
        {
          vertices: report.region.vertexCount,
          parts: report.region.parts,
          candidates: defs.length,
          'pool start-up s (once)': startup.toFixed(2),
          'sampling s': (report.timingsMs.sampling / 1000).toFixed(2),
          'scoring (factors + statistics, in the pool) s': (report.timingsMs.scoring / 1000).toFixed(2),
          'audit wall s': total.toFixed(2),
          'load average': loadavg().map((x) => x.toFixed(1)).join(' '),
        },
      ];
    } finally {
      await pool.close();
    }
  },
};

const memorySection: BenchSection = {
  name: '`warpmeter factors` peak memory on 1 and 10 million lines (streaming: it should not grow)',
  async run() {
    const rows: BenchRow[] = [];
    for (const lines of [1_000_000, 10_000_000]) {
      const gen = `${tmp}/bench-gen.mjs`;
      writeFileSync(gen, `const n=Number(process.argv[2]);let s='';for(let i=0;i<n;i++){s+=((i*0.6180339887)%1*50-10).toFixed(5)+' '+((i*0.7548776662)%1*35+36).toFixed(5)+'\\n';if(s.length>1<<16){if(!process.stdout.write(s))await new Promise(r=>process.stdout.once('drain',r));s='';}}process.stdout.write(s);`);
      const t0 = performance.now();
      const out = execFileSync('bash', ['-c', `node ${gen} ${lines} | /usr/bin/time -f '%M' node ${repoRoot}server/cli/bin.mjs factors --proj '+proj=laea +lat_0=52 +lon_0=10 +ellps=GRS80' 2>&1 >/dev/null | tail -1`]).toString().trim();
      rows.push({ lines: lines.toLocaleString('en'), 'peak RSS MB': (Number(out) / 1024).toFixed(0), 'wall s': seconds(t0).toFixed(1) });
    }
    return rows;
  },
};

export const sections: BenchSection[] = [factorsSection, auditSection, memorySection];
