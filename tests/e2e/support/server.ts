import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import path from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { createApp } from '../../../server/app';
import { createPgPool } from '../../../server/auth/session';
import { dataSource, initDataSource } from '../../../server/db/dataSource';
import { createRedis } from '../../../server/queue/connection';
import { createJobQueue } from '../../../server/queue/queue';
import { createMailer } from '../../../server/mail/mailer';
import { startMailSink } from '../../../server/mail/sink';
import { seedDemo } from '../../../server/services/seedDemo';

export interface E2eServer {
  baseUrl: string;
  close(): Promise<void>;
}

/** Empties the test database, seeds the demo scenario, and serves the built client (dist/) with the real API. */
export async function startDemoServer(): Promise<E2eServer> {
  await initDataSource();
  const tables = await dataSource.query(`SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'migrations'`);
  await dataSource.query(`TRUNCATE ${tables.map((t: { tablename: string }) => `"${t.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`);
  await seedDemo(dataSource);
  const redis = createRedis();
  const pgPool = createPgPool();
  const queue = createJobQueue();
  const sink = await startMailSink(0);
  const mailer = createMailer(sink.port);
  const app = createApp({ redis, pgPool, queue, mailer, clientDir: path.resolve('dist') });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    async close() {
      await new Promise((r) => server.close(r));
      mailer.close();
      await sink.close();
      await Promise.allSettled([queue.close(), redis.quit(), pgPool.end()]);
      await dataSource.destroy();
    },
  };
}

/** Debian's Chromium, headless, with no network beyond loopback. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-background-networking', '--disable-gpu', '--disable-component-update', '--no-first-run'],
  });
}

export const SCREENSHOT_DIR = path.resolve('tests/e2e/screenshots');
