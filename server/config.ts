import { availableParallelism } from 'node:os';

/** Configuration from the environment, with the defaults a local checkout uses. */
export interface Config {
  port: number;
  host: string;
  publicUrl: string;
  nodeEnv: string;
  sessionSecret: string;
  /** poolSize: most MariaDB connections this process opens at once (WARPMETER_DB_POOL). */
  db: { host: string; port: number; user: string; password: string; database: string; poolSize: number };
  redis: { host: string; port: number; prefix: string };
  smtp: { host: string; port: number; from: string; mailboxUrl: string };
  pay: { apiKey: string; host: string; port: number; protocol: 'http' | 'https'; webhookSecret: string };
  dataDir: string;
  secureCookies: boolean;
}

const num = (v: string | undefined, d: number) => (v && Number.isFinite(Number(v)) ? Number(v) : d);

/**
 * WARPMETER_DB_POOL: a whole number from 1 to 200; by default twice the cores plus one. A pool
 * about the size of what the machine can run at once keeps a burst of requests queued in the
 * app, first come first served, instead of twenty queries at a time sharing the cores inside
 * MariaDB, each of them slowed by all the others. "Cores × 2 + spindles" is a sizing rule from
 * connection-pool documentation (common practice, recalled from memory); on the 2-core machine
 * of the load bench, pools of 3 and 5 gave lower p99 latencies than 20 while audits ran, with the
 * spread of those runs noted in the README. Refused with a message when out of range.
 */
export function parseDbPool(raw: string | undefined, cores = availableParallelism()): number {
  if (raw === undefined || raw.trim() === '') return Math.max(3, cores * 2 + 1);
  const n = Number(raw.trim());
  if (!/^\d{1,3}$/.test(raw.trim()) || n < 1 || n > 200) {
    throw new Error(`WARPMETER_DB_POOL must be a whole number of connections from 1 to 200, not "${raw}".`);
  }
  return n;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = num(env.PORT, 3000);
  const host = env.HOST ?? '127.0.0.1';
  return {
    port,
    host,
    publicUrl: env.WARPMETER_PUBLIC_URL ?? `http://127.0.0.1:${port}`,
    nodeEnv: env.NODE_ENV ?? 'development',
    sessionSecret: env.WARPMETER_SESSION_SECRET ?? 'warpmeter-local-session-secret-change-me',
    db: {
      host: env.WARPMETER_DB_HOST ?? '127.0.0.1',
      port: num(env.WARPMETER_DB_PORT, 3307),
      user: env.WARPMETER_DB_USER ?? 'warpmeter',
      password: env.WARPMETER_DB_PASSWORD ?? 'warpmeter-local',
      database: env.WARPMETER_DB_NAME ?? 'warpmeter',
      poolSize: parseDbPool(env.WARPMETER_DB_POOL),
    },
    redis: {
      host: env.WARPMETER_REDIS_HOST ?? '127.0.0.1',
      port: num(env.WARPMETER_REDIS_PORT, 6380),
      prefix: env.WARPMETER_QUEUE_PREFIX ?? 'warpmeter',
    },
    smtp: {
      host: env.WARPMETER_SMTP_HOST ?? '127.0.0.1',
      port: num(env.WARPMETER_SMTP_PORT, 3025),
      from: env.WARPMETER_MAIL_FROM ?? 'Warpmeter <no-reply@warpmeter.local>',
      mailboxUrl: env.WARPMETER_MAILBOX_URL ?? `http://127.0.0.1:${num(env.WARPMETER_MAILBOX_PORT, 3026)}`,
    },
    pay: {
      apiKey: env.WARPMETER_PAY_API_KEY ?? 'sk_test_warpmeter_local',
      host: env.WARPMETER_PAY_HOST ?? '127.0.0.1',
      port: num(env.WARPMETER_PAY_PORT, 3027),
      protocol: (env.WARPMETER_PAY_PROTOCOL as 'http' | 'https') ?? 'http',
      webhookSecret: env.WARPMETER_PAY_WEBHOOK_SECRET ?? 'whsec_warpmeter_local',
    },
    dataDir: env.WARPMETER_DATA_DIR ?? '.data/files',
    secureCookies: env.WARPMETER_SECURE_COOKIES === '1',
  };
}
