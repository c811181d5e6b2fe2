import 'reflect-metadata';
import { Queue, Worker } from 'bullmq';
import { initDataSource } from '../server/db/dataSource';
import { createRedis, QUEUE_NAME } from '../server/queue/connection';
import { logOutages } from '../server/queue/outage-log';
import { startHeartbeat } from './heartbeat';
import { WORKER_NAME } from './identity';
import { markRowOfFailedJob } from './lifecycle/on-failed';
import { reconcileOrphans } from './lifecycle/reconcile';
import { dispatch } from './processors';
import { closeSolvePool } from './processors/solve';
import { closeSharedModellers } from './processors/invert-modeller';

// The worker process: takes jobs from the queue, reports that it is alive, and keeps every job's
// row honest (a job that fails for good marks its row failed; rows whose job is gone are found).
const dataSource = await initDataSource();
const redis = createRedis({ forBullmq: true, name: 'worker' });
const heartbeat = startHeartbeat(redis);
// One job at a time per process (each uses every core through its threads). A job whose worker
// dies is noticed within ~10 s (lock expiry) and handed to the next worker that asks.
const worker = new Worker(QUEUE_NAME, dispatch, {
  name: WORKER_NAME,
  connection: createRedis({ forBullmq: true, name: 'worker' }),
  concurrency: 1,
  lockDuration: 10_000,
  stalledInterval: 5_000,
  maxStalledCount: 2,
});
const queue = new Queue(QUEUE_NAME, { connection: redis });
logOutages(worker, 'worker');
logOutages(queue, 'worker');

worker.on('failed', (job, err) => {
  console.error(`[worker] job ${job?.id} (${job?.name}) failed: ${err.message}`);
  void markRowOfFailedJob(job, err);
});

const reconcile = () =>
  reconcileOrphans(queue).catch((err: Error) => console.error(`[worker] could not look for orphaned jobs: ${err.message}`));
await reconcile();
const reconcileTimer = setInterval(reconcile, 60_000);
console.log(`[worker] waiting for jobs on "${QUEUE_NAME}"`);

async function stop() {
  clearInterval(reconcileTimer);
  heartbeat();
  await worker.close();
  await closeSolvePool();
  await closeSharedModellers();
  await Promise.allSettled([queue.close(), redis.quit(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
