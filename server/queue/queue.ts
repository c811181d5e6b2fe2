import { once } from 'node:events';
import { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { HttpError } from '../http/errors';
import { createRedis, QUEUE_NAME } from './connection';
import { logOutages } from './outage-log';

/** Job kinds on the one queue; the worker dispatches by name (worker/processors). */
export type JobName = 'solve' | 'report' | 'invert' | 'ensemble-member';

/**
 * Producer side of the queue (the API). The job id is the database row's id, so a retry never
 * duplicates. Its connection has no offline queue: while Redis is away an add fails at once
 * (BullMQ's advice for queues used inside HTTP handlers) instead of waiting and running later.
 */
export function createJobQueue(): Queue {
  const connection = createRedis({ name: 'queue' });
  const queue = new Queue(QUEUE_NAME, {
    connection,
    defaultJobOptions: { attempts: 1, removeOnComplete: { age: 24 * 3600 }, removeOnFail: { age: 7 * 24 * 3600 } },
  });
  logOutages(queue, 'queue');
  connections.set(queue, connection);
  return queue;
}

const connections = new WeakMap<Queue, Redis>();

/** Closes the queue and the connection it was given (BullMQ leaves a connection it did not open alone), so a script can exit. */
export async function closeJobQueue(queue: Queue): Promise<void> {
  await queue.close();
  await connections.get(queue)?.quit().catch(() => undefined);
}

/** Resolves once the queue's connection is ready (at once when it is). */
function ready(queue: Queue): Promise<unknown> {
  const client = connections.get(queue);
  return !client || client.status === 'ready' ? Promise.resolve() : once(client, 'ready');
}

/** How long a request waits for the queue before answering 503. */
const QUEUE_TIMEOUT_MS = 3000;

export const queueUnavailable = () =>
  new HttpError(503, 'queue_unavailable', 'The job queue cannot be reached just now, so nothing was started. Try again in a minute; if it persists, tell your administrator.');

/** Adds a job, or throws the 503 above within a few seconds when Redis cannot take it. */
export async function addJob(queue: Queue, name: JobName, data: object, jobId: string): Promise<void> {
  await withinTimeout(queue, () => queue.add(name, data, { jobId }));
}

/** Adds several jobs in one round trip, or throws the 503 above. */
export async function addJobs(queue: Queue, jobs: readonly { name: JobName; data: object; jobId: string }[]): Promise<void> {
  await withinTimeout(queue, () => queue.addBulk(jobs.map((j) => ({ name: j.name, data: j.data, opts: { jobId: j.jobId } }))));
}

async function withinTimeout(queue: Queue, add: () => Promise<unknown>): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      // A connection that is reconnecting (Redis just restarted) gets the same few seconds to come back.
      ready(queue).then(add),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), QUEUE_TIMEOUT_MS);
      }),
    ]);
  } catch {
    throw queueUnavailable();
  } finally {
    clearTimeout(timer);
  }
}
