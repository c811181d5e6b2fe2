// The demo's finished run and shared report (server/services/demoWorkflow.ts), made by the running
// worker; `npm start` runs this in the background once the API answers, in local demo mode only.
import '../shared/schemas/messages';
import { isLocalDemoMode } from '../server/config';

if (!isLocalDemoMode(process.env)) process.exit(0);

const { initDataSource } = await import('../server/db/dataSource');
const { closeJobQueue, createJobQueue } = await import('../server/queue/queue');
const { createMailer } = await import('../server/mail/mailer');
const { closeReadPool } = await import('../server/threads/read-pool');
const { finishDemoWorkflow } = await import('../server/services/demoWorkflow');
const ds = await initDataSource();
const queue = createJobQueue();
const mailer = createMailer();
let code = 0;
try {
  await finishDemoWorkflow({ ds, queue, mailer, log: (line) => console.log(`[demo] ${line}`) });
  console.log('[demo] a finished run and a shared report are in place');
} catch (err) {
  console.error(`[demo] the finished run and report could not be made: ${(err as Error).message}`);
  code = 1;
}
mailer.close();
await closeJobQueue(queue);
await closeReadPool();
await ds.destroy();
process.exit(code);
