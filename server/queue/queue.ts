import { Queue } from 'bullmq';
import { createRedis, QUEUE_NAME } from './connection';

/** Job kinds on the one queue; the worker dispatches by name (worker/processors). */
export type JobName = 'solve' | 'report';

/** Producer side of the queue (the API). The job id is the database row's id, so a retry never duplicates. */
export function createJobQueue(): Queue {
  return new Queue(QUEUE_NAME, {
    connection: createRedis({ forBullmq: true }),
    defaultJobOptions: { attempts: 1, removeOnComplete: { age: 24 * 3600 }, removeOnFail: { age: 7 * 24 * 3600 } },
  });
}
