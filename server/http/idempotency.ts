import type { RequestHandler, Response } from 'express';
import { dataSource } from '../db/dataSource';
import { HttpError } from './errors';

/**
 * `Idempotency-Key` on a creating request: the first request with a key does the work; a repeat
 * with the same key (same user, same route) gets the first answer again, with the header
 * `Idempotent-Replayed: true`, and creates nothing. A repeat that arrives while the first is still
 * working waits for its answer. Keys are kept a day. Requests without the header behave as before.
 * Pattern of the IETF HTTPAPI working group's Idempotency-Key header draft (2023).
 */
const KEY = /^[\x21-\x7e]{8,200}$/;
const KEEP_HOURS = 24;
const WAIT_MS = 20_000;

export function idempotent(): RequestHandler {
  return async (req, res, next) => {
    try {
      const key = req.get('idempotency-key');
      if (key === undefined) return next();
      if (!KEY.test(key)) throw new HttpError(400, 'bad_idempotency_key', 'The Idempotency-Key header must be 8 to 200 visible characters (a random id per submission).');
      const userId = req.user!.id;
      const route = `${req.method} ${req.originalUrl.split('?')[0]}`;
      await dataSource.query(`DELETE FROM idempotency_keys WHERE created_at < now() - make_interval(hours => $1)`, [KEEP_HOURS]);
      const claimed = await dataSource.query(
        `INSERT INTO idempotency_keys (user_id, route, key) VALUES ($1, $2, $3) ON CONFLICT DO NOTHING RETURNING key`,
        [userId, route, key],
      );
      if (claimed.length === 0) return replay(res, await firstAnswer(userId, route, key));
      remember(res, userId, route, key);
      next();
    } catch (err) {
      next(err);
    }
  };
}

/** Stores the answer when it is a final one; a 5xx frees the key, so the same submission may be tried again. */
function remember(res: Response, userId: string, route: string, key: string) {
  const json = res.json.bind(res);
  res.json = (body: unknown) => {
    const where = [userId, route, key];
    const write = res.statusCode >= 500
      ? dataSource.query('DELETE FROM idempotency_keys WHERE user_id = $1 AND route = $2 AND key = $3', where)
      : dataSource.query('UPDATE idempotency_keys SET status = $4, body = $5 WHERE user_id = $1 AND route = $2 AND key = $3', [...where, res.statusCode, JSON.stringify(body ?? null)]);
    write.catch((err: Error) => console.error(`[idempotency] could not record the answer for a key: ${err.message}`));
    return json(body);
  };
}

async function firstAnswer(userId: string, route: string, key: string): Promise<{ status: number; body: unknown }> {
  const end = Date.now() + WAIT_MS;
  for (;;) {
    const [row] = await dataSource.query('SELECT status, body FROM idempotency_keys WHERE user_id = $1 AND route = $2 AND key = $3', [userId, route, key]);
    if (row?.status) return { status: row.status, body: row.body };
    if (!row) throw new HttpError(409, 'idempotency_retry', 'The first request with this Idempotency-Key failed; send the submission again with a new key.');
    if (Date.now() > end) throw new HttpError(409, 'idempotency_in_progress', 'A request with this Idempotency-Key is still being processed. Look for its result before trying again.');
    await new Promise((r) => setTimeout(r, 100));
  }
}

function replay(res: Response, answer: { status: number; body: unknown }) {
  res.status(answer.status).set('Idempotent-Replayed', 'true').json(answer.body);
}
