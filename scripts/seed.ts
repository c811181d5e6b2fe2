// Seeds the invented demo scenario; running it again changes nothing.
// Its accounts share a published password, so it runs only in local demo mode (server/config.ts):
// elsewhere it refuses (exit 2), or with --only-in-demo-mode (npm start) skips with a note (exit 0).
import { isLocalDemoMode } from '../server/config';

if (!isLocalDemoMode(process.env)) {
  const skip = process.argv.includes('--only-in-demo-mode');
  console.error(
    `[seed] ${skip ? 'skipped' : 'refused'}: the demo accounts share a published password and are seeded only in local demo mode ` +
      '(HOST on loopback and no TRUST_PROXY, or TF_DEMO=1). Create the first administrator with `npm run create-admin`.',
  );
  process.exit(skip ? 0 : 2);
}

const { initDataSource } = await import('../server/db/dataSource');
const { seedDemo, seedDemoInversion } = await import('../server/services/seedDemo');
const { closeJobQueue, createJobQueue } = await import('../server/queue/queue');
const { closeReadPool } = await import('../server/threads/read-pool');
const ds = await initDataSource();
const { created } = await seedDemo(ds);
console.log(`[seed] demo scenario ${created ? `seeded (${created} rows)` : 'already present'}`);
// The demo line's inversion is made by the worker; without the queue the demo still starts, without it.
const queue = createJobQueue();
try {
  if (await seedDemoInversion(ds, queue)) console.log('[seed] demo inversion queued (the worker makes it in a few seconds)');
} catch (err) {
  console.error(`[seed] demo inversion not queued: ${(err as Error).message}`);
}
await closeJobQueue(queue);
await closeReadPool();
await ds.destroy();
