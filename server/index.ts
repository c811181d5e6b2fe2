import { config } from './config';
import { createApp } from './app';
import { createPgPool } from './auth/session';
import { initDataSource } from './db/dataSource';
import { createRedis } from './queue/connection';
import { createJobQueue } from './queue/queue';
import { createMailer } from './mail/mailer';
import { startMailSink } from './mail/sink';

const dataSource = await initDataSource();
const redis = createRedis();
const pgPool = createPgPool();
const queue = createJobQueue();
// The local mail sink runs inside the API process when MAIL_SINK_PORT is set (npm start does).
const sink = config.mailSinkPort ? await startMailSink(config.mailSinkPort) : null;
const mailer = createMailer();
const app = createApp({ redis, pgPool, queue, mailer });

const server = app.listen(config.port, config.host, () => {
  console.log(`[api] listening on http://${config.host}:${config.port}`);
});

async function stop() {
  server.close();
  mailer.close();
  await sink?.close();
  await Promise.allSettled([queue.close(), redis.quit(), pgPool.end(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
