/** Settings from the environment; scripts/start.sh and scripts/test.sh set them. */
const env = process.env;

export const config = {
  port: Number(env.PORT ?? 8080),
  host: env.HOST ?? '127.0.0.1',
  pg: {
    host: env.PGHOST ?? '127.0.0.1',
    port: Number(env.PGPORT ?? 55432),
    user: env.PGUSER ?? 'postgres',
    password: env.PGPASSWORD,
    database: env.PGDATABASE ?? 'timefield',
  },
  redisUrl: env.REDIS_URL ?? 'redis://127.0.0.1:56379',
  sessionSecret: env.SESSION_SECRET ?? 'dev-only-session-secret',
  /** Set COOKIE_SECURE=1 behind HTTPS. */
  cookieSecure: env.COOKIE_SECURE === '1',
  isTest: env.NODE_ENV === 'test',
  smtp: {
    host: env.SMTP_HOST ?? '127.0.0.1',
    port: Number(env.SMTP_PORT ?? 2525),
    secure: env.SMTP_SECURE === '1',
    user: env.SMTP_USER,
    password: env.SMTP_PASSWORD,
    from: env.MAIL_FROM ?? 'Timefield <timefield@localhost>',
  },
  /** Port of the in-process mail sink; unset means no sink (a real SMTP service is configured). */
  mailSinkPort: env.MAIL_SINK_PORT ? Number(env.MAIL_SINK_PORT) : null,
  /** Links in e-mails point here. */
  publicUrl: env.PUBLIC_URL ?? `http://127.0.0.1:${env.PORT ?? 8080}`,
};
