import { Redis } from 'ioredis';
import { config } from '../config';
import { logOutages } from './outage-log';

/**
 * BullMQ needs maxRetriesPerRequest: null on connections that block (the worker). Other clients
 * fail fast while Redis is away (no offline queue), so a request answers 503 instead of hanging.
 */
export function createRedis(options: { forBullmq?: boolean; name?: string } = {}): Redis {
  const redis = new Redis(config.redisUrl, {
    maxRetriesPerRequest: options.forBullmq ? null : 1,
    enableOfflineQueue: options.forBullmq ?? false,
    lazyConnect: false,
  });
  logOutages(redis, options.name ?? 'redis');
  return redis;
}

/** Key the worker refreshes; the API reads it for /api/health. */
export const WORKER_HEARTBEAT_KEY = 'timefield:worker:heartbeat';
/** Seconds after which a silent worker counts as gone. */
export const HEARTBEAT_TTL_SECONDS = 15;
export const QUEUE_NAME = 'timefield-jobs';
