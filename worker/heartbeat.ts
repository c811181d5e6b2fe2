import type { Redis } from 'ioredis';
import { HEARTBEAT_TTL_SECONDS, WORKER_HEARTBEAT_KEY } from '../server/queue/connection';

/** Writes "now" to Redis every few seconds so /api/health can tell a live worker from a gone one. */
export function startHeartbeat(redis: Redis, everyMs = 5000): () => void {
  let failing = false;
  const beat = () =>
    redis.set(WORKER_HEARTBEAT_KEY, String(Date.now()), 'EX', HEARTBEAT_TTL_SECONDS).then(
      () => (failing = false),
      (err: Error) => {
        if (!failing) console.error(`[worker] heartbeat failed: ${err.message}`);
        failing = true;
      },
    );
  void beat();
  const timer = setInterval(beat, everyMs);
  return () => clearInterval(timer);
}

