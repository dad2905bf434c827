import { createApp } from './app.js';
import { bootstrap } from './bootstrap.js';
import { loadConfig, type Config } from './config.js';
import { createHttpServer } from './http/http-server.js';
import { startAuditJobs, stopAuditJobs } from './jobs/runner.js';

// A setting out of range stops the start with its message (exit code 2), not a stack trace.
let config: Config;
try {
  config = loadConfig();
} catch (err) {
  console.error(`warpmeter: ${(err as Error).message}`);
  process.exit(2);
}
// Starts listening; everything else lives in createApp and bootstrap.
const deps = await bootstrap(config);
const app = createApp(deps);
// The audit queue, this process's own audit worker and the re-enqueueing of interrupted audits.
await startAuditJobs(deps);
const server = createHttpServer(app).listen(deps.config.port, deps.config.host, () => {
  deps.logger.info(`Warpmeter is listening on http://${deps.config.host}:${deps.config.port}`);
});
const shutdown = () => {
  server.close(() => void stopAuditJobs(deps).finally(() => void deps.dataSource.destroy().finally(() => process.exit(0))));
  setTimeout(() => process.exit(0), 5000).unref();
};
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
