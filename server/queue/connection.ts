import { Redis } from 'ioredis';
import { config } from '../config';

/** BullMQ needs maxRetriesPerRequest: null on connections that block; other clients keep the default. */
export function createRedis(options: { forBullmq?: boolean } = {}): Redis {
  return new Redis(config.redisUrl, {
    maxRetriesPerRequest: options.forBullmq ? null : 1,
    enableOfflineQueue: options.forBullmq ?? false,
    lazyConnect: false,
  });
}

/** Key the worker refreshes; the API reads it for /api/health. */
export const WORKER_HEARTBEAT_KEY = 'timefield:worker:heartbeat';
/** Seconds after which a silent worker counts as gone. */
export const HEARTBEAT_TTL_SECONDS = 15;
export const QUEUE_NAME = 'timefield-jobs';
