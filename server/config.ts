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
};
