import request from 'supertest';
import type { Express } from 'express';
import type { Redis } from 'ioredis';
import type pg from 'pg';
import { createApp } from '../../../server/app';
import { clearLoginLimits } from '../../../server/auth/loginLimits';
import { createPgPool } from '../../../server/auth/session';
import { initDataSource, dataSource } from '../../../server/db/dataSource';
import { createRedis } from '../../../server/queue/connection';
import { createJobQueue } from '../../../server/queue/queue';
import { createMailer, type Mailer } from '../../../server/mail/mailer';
import { startMailSink } from '../../../server/mail/sink';
import type { Queue } from 'bullmq';

export interface TestApp {
  app: Express;
  redis: Redis;
  pgPool: pg.Pool;
  queue: Queue;
  mailer: Mailer;
  close(): Promise<void>;
}

/** The real app against the test PostgreSQL and Redis that scripts/test.sh started. */
export async function startTestApp(): Promise<TestApp> {
  await initDataSource();
  const redis = createRedis();
  if (redis.status !== 'ready') await new Promise((resolve) => redis.once('ready', resolve));
  await clearLoginLimits(redis); // sign-in counters live in Redis, which outlives one test file's world
  const pgPool = createPgPool();
  const queue = createJobQueue();
  // A mail sink of this test's own, on a free port, writing to the test database.
  const sink = await startMailSink(0);
  const mailer = createMailer(sink.port);
  const app = createApp({ redis, pgPool, queue, mailer, clientDir: '/nonexistent' });
  return {
    app,
    redis,
    pgPool,
    queue,
    mailer,
    async close() {
      mailer.close();
      await sink.close();
      await Promise.allSettled([queue.close(), redis.quit(), pgPool.end()]);
      await dataSource.destroy();
    },
  };
}

export type Agent = ReturnType<typeof request.agent> & { csrf: string };

/** A cookie-keeping client with a CSRF token for its current session. */
export async function anonymousAgent(app: Express): Promise<Agent> {
  const agent = request.agent(app) as Agent;
  agent.csrf = (await agent.get('/api/auth/csrf').expect(200)).body.token;
  return agent;
}

/** Signs in and fetches the renewed session's CSRF token. */
export async function signedInAgent(app: Express, email: string, password: string): Promise<Agent> {
  const agent = await anonymousAgent(app);
  await agent.post('/api/auth/login').set('X-CSRF-Token', agent.csrf).send({ email, password }).expect(200);
  agent.csrf = (await agent.get('/api/auth/csrf').expect(200)).body.token;
  return agent;
}

/** A supertest body parser that keeps binary responses (fields, grids, files) as one Buffer. */
export function binaryBody(res: request.Response, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}
