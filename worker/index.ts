import 'reflect-metadata';
import { hostname } from 'node:os';
import { Worker } from 'bullmq';
import { initDataSource } from '../server/db/dataSource';
import { createRedis, QUEUE_NAME } from '../server/queue/connection';
import { startHeartbeat } from './heartbeat';
import { dispatch } from './processors';
import { closeSolvePool } from './processors/solve';

// The worker process: takes jobs from the queue, reports that it is alive.
const dataSource = await initDataSource();
const redis = createRedis({ forBullmq: true });
const stopHeartbeat = startHeartbeat(redis);
// One job at a time per process (each uses every core through its threads). A job whose worker
// dies is noticed within ~10 s (lock expiry) and handed to the next worker that asks.
const worker = new Worker(QUEUE_NAME, dispatch, {
  name: process.env.WORKER_NAME ?? `${hostname()}:${process.pid}`,
  connection: createRedis({ forBullmq: true }),
  concurrency: 1,
  lockDuration: 10_000,
  stalledInterval: 5_000,
  maxStalledCount: 2,
});

worker.on('failed', (job, err) => console.error(`[worker] job ${job?.id} (${job?.name}) failed: ${err.message}`));
worker.on('error', (err) => console.error(`[worker] ${err.message}`));
console.log(`[worker] waiting for jobs on "${QUEUE_NAME}"`);

async function stop() {
  stopHeartbeat();
  await worker.close();
  await closeSolvePool();
  await Promise.allSettled([redis.quit(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
