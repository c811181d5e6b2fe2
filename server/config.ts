/** Settings from the environment; scripts/start.sh and scripts/test.sh set them. */
const env = process.env;

/**
 * TRUST_PROXY for Express's `trust proxy`: unset or 0 = no proxy; a whole number = that many
 * proxy hops in front; anything else = Express's list of trusted addresses or subnets
 * (e.g. "loopback" or "10.0.0.0/8, 127.0.0.1").
 */
export function parseTrustProxy(value: string | undefined): false | number | string {
  const v = (value ?? '').trim();
  if (v === '' || v === '0' || v.toLowerCase() === 'false') return false;
  return /^\d+$/.test(v) ? Number(v) : v;
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', '::1', 'localhost']);

/**
 * Local demo mode: only here may the demo scenario (with its published password) be seeded or
 * signed into. It is the API listening on loopback with no proxy in front, or TF_DEMO=1 said
 * explicitly (a demo on a private network, at the operator's own risk). TF_DEMO=0 turns it off.
 */
export function isLocalDemoMode(e: NodeJS.ProcessEnv): boolean {
  if (e.TF_DEMO === '1') return true;
  if (e.TF_DEMO === '0') return false;
  return LOOPBACK_HOSTS.has((e.HOST ?? '127.0.0.1').trim()) && parseTrustProxy(e.TRUST_PROXY) === false;
}

const trustProxy = parseTrustProxy(env.TRUST_PROXY);

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
  /** Express `trust proxy`: set TRUST_PROXY behind a TLS-terminating proxy so req.secure and req.ip are right. */
  trustProxy,
  /** Secure cookies and HSTS: on behind a proxy (TRUST_PROXY) unless COOKIE_SECURE=0; COOKIE_SECURE=1 forces them on. */
  cookieSecure: env.COOKIE_SECURE ? env.COOKIE_SECURE === '1' : trustProxy !== false,
  demoMode: isLocalDemoMode(env),
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
