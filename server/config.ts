/** Configuration from the environment, with the defaults a local checkout uses. */
export interface Config {
  port: number;
  host: string;
  publicUrl: string;
  nodeEnv: string;
  sessionSecret: string;
  db: { host: string; port: number; user: string; password: string; database: string };
  redis: { host: string; port: number; prefix: string };
  smtp: { host: string; port: number; from: string; mailboxUrl: string };
  pay: { apiKey: string; host: string; port: number; protocol: 'http' | 'https'; webhookSecret: string };
  dataDir: string;
  secureCookies: boolean;
}

const num = (v: string | undefined, d: number) => (v && Number.isFinite(Number(v)) ? Number(v) : d);

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
