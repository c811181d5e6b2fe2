import { Router } from 'express';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { dataSource } from '../db/dataSource';
import { authorize } from '../policies/authorize';
import { HEARTBEAT_TTL_SECONDS, WORKER_HEARTBEAT_KEY } from '../queue/connection';

const withTimeout = <T>(p: Promise<T>, ms: number) =>
  Promise.race([p, new Promise<never>((_, reject) => setTimeout(() => reject(new Error('timeout')), ms))]);

async function check(fn: () => Promise<string>): Promise<string> {
  try {
    return await withTimeout(fn(), 2000);
  } catch (err) {
    return (err as Error).message === 'timeout' ? 'timeout' : 'unreachable';
  }
}

export function healthRouter(redis: Redis, queue: Queue): Router {
  const r = Router();
  r.get('/health', authorize('health.read'), async (_req, res) => {
    const [db, redisState, worker] = await Promise.all([
      check(async () => (await dataSource.query('SELECT 1'), 'ok')),
      check(async () => ((await redis.ping()) === 'PONG' ? 'ok' : 'unexpected')),
      check(async () => {
        // A killed worker's connection closes at once, so the queue's list of connected workers
        // tells first; the heartbeat tells a connected worker that has stopped working.
        if ((await queue.getWorkersCount()) === 0) return 'absent';
        const beat = Number(await redis.get(WORKER_HEARTBEAT_KEY));
        if (!beat) return 'absent';
        return Date.now() - beat < HEARTBEAT_TTL_SECONDS * 1000 ? 'ok' : 'stale';
      }),
    ]);
    const worst = [db, redisState, worker].every((s) => s === 'ok') ? 200 : 503;
    res.status(worst).json({ db, redis: redisState, worker });
  });
  return r;
}
