import 'reflect-metadata';
import pino from 'pino';
import { loadConfig, type Config } from '../config.js';
import { createDataSource } from '../data-source.js';
import { lowerSessionPriority, parseWorkerNice } from './background-priority.js';
import { sharedAuditEngine, closeSharedAuditEngine } from './engine-instance.js';
import { createAuditWorker } from './worker.js';

// `npm run worker`: an extra audit worker process. It needs only MariaDB and Redis (the
// WARPMETER_DB_* and WARPMETER_REDIS_* variables), so it may run on another machine. It does not
// migrate the database: the app does that at start.
const logger = pino({ level: process.env.LOG_LEVEL ?? 'info' });
// Audits are background work: this process yields the CPU to the web server and the database
// (WARPMETER_WORKER_NICE=0 keeps the normal priority, e.g. on a machine of its own).
let workerNice: number;
let config: Config;
try {
  config = loadConfig();
  workerNice = parseWorkerNice(process.env.WARPMETER_WORKER_NICE);
} catch (err) {
  console.error(`warpmeter worker: ${(err as Error).message}`);
  process.exit(2);
}
const backgrounded = workerNice > 0 ? lowerSessionPriority(workerNice) : 'none';
const dataSource = createDataSource(config.db);
await dataSource.initialize();
const engine = await sharedAuditEngine();
const concurrency = Math.max(1, Math.min(2, Number(process.env.WARPMETER_WORKER_CONCURRENCY ?? 1) || 1));
const worker = createAuditWorker(config, { dataSource, logger, engine }, { concurrency });
worker.on('ready', () => logger.info({ prefix: config.redis.prefix, concurrency, backgrounded }, 'audit worker ready'));
worker.on('completed', (job) => logger.info({ auditId: job.data.auditId }, 'audit finished'));

let stopping = false;
const stop = async () => {
  if (stopping) return;
  stopping = true;
  // Do not wait for a running audit: its lock lapses and another worker (or this one after a
  // restart) picks it up again; the single-transaction write makes the rerun safe.
  setTimeout(() => process.exit(0), 5000).unref();
  await worker.close(true).catch(() => {});
  await closeSharedAuditEngine();
  await dataSource.destroy().catch(() => {});
  process.exit(0);
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
