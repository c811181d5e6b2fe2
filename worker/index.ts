import 'reflect-metadata';
import { Worker } from 'bullmq';
import { initDataSource } from '../server/db/dataSource';
import { createRedis, QUEUE_NAME } from '../server/queue/connection';
import { startHeartbeat } from './heartbeat';
import { dispatch } from './processors';

// The worker process: takes jobs from the queue, reports that it is alive.
const dataSource = await initDataSource();
const redis = createRedis({ forBullmq: true });
const stopHeartbeat = startHeartbeat(redis);
const worker = new Worker(QUEUE_NAME, dispatch, { connection: createRedis({ forBullmq: true }), concurrency: 1 });

worker.on('failed', (job, err) => console.error(`[worker] job ${job?.id} (${job?.name}) failed: ${err.message}`));
worker.on('error', (err) => console.error(`[worker] ${err.message}`));
console.log(`[worker] waiting for jobs on "${QUEUE_NAME}"`);

async function stop() {
  stopHeartbeat();
  await worker.close();
  await Promise.allSettled([redis.quit(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
