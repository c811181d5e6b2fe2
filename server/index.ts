import { config } from './config';
import { createApp } from './app';
import { createPgPool } from './auth/session';
import { initDataSource } from './db/dataSource';
import { createRedis } from './queue/connection';
import { createJobQueue } from './queue/queue';

const dataSource = await initDataSource();
const redis = createRedis();
const pgPool = createPgPool();
const queue = createJobQueue();
const app = createApp({ redis, pgPool, queue });

const server = app.listen(config.port, config.host, () => {
  console.log(`[api] listening on http://${config.host}:${config.port}`);
});

async function stop() {
  server.close();
  await Promise.allSettled([queue.close(), redis.quit(), pgPool.end(), dataSource.destroy()]);
  process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
