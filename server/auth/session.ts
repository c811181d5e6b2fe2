import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';
import { config } from '../config';

const PgStore = connectPgSimple(session);

/** Sessions live in PostgreSQL (table `session`, made by the first migration). */
export function sessionMiddleware(pool: pg.Pool) {
  return session({
    name: 'tf.sid',
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: config.isTest ? false : 15 * 60 }),
    secret: config.sessionSecret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: 8 * 60 * 60 * 1000 },
  });
}

export function createPgPool(): pg.Pool {
  const pool = new pg.Pool({ ...config.pg, max: 5 });
  // An idle connection dropped by a database restart is discarded by the pool; log it, do not crash.
  pool.on('error', (err) => console.error(`[db] idle session-store connection lost: ${err.message}`));
  return pool;
}
