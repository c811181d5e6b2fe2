import { spawn, type ChildProcess } from 'node:child_process';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { WORKER_HEARTBEAT_KEY } from '../../server/queue/connection';
import { startTestApp, type TestApp } from './support/app';

/** Health against the real services, with a real worker process started beside the test. */
describe('GET /api/health', () => {
  let t: TestApp;
  let worker: ChildProcess | undefined;
  beforeAll(async () => {
    t = await startTestApp();
    await t.redis.del(WORKER_HEARTBEAT_KEY);
  });
  afterAll(async () => {
    worker?.kill('SIGTERM');
    await t?.close();
  });

  it('reports the worker absent until a worker process beats, then all ok', async () => {
    const before = await request(t.app).get('/api/health');
    expect(before.status).toBe(503);
    expect(before.body).toEqual({ db: 'ok', redis: 'ok', worker: 'absent' });

    worker = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], { env: process.env, stdio: 'ignore' });
    let body: unknown;
    for (let i = 0; i < 100; i++) {
      const res = await request(t.app).get('/api/health');
      body = res.body;
      if (res.status === 200) break;
      await new Promise((r) => setTimeout(r, 200));
    }
    expect(body).toEqual({ db: 'ok', redis: 'ok', worker: 'ok' });
  });

  // Issue 16 item 4: health shows the worker not ok as soon as it is gone, not when its beat goes stale (15 s).
  it('reports a killed worker absent within a few seconds', async () => {
    const exited = new Promise((r) => worker!.once('exit', r));
    worker!.kill('SIGKILL');
    await exited;
    let body: { worker?: string } = {};
    for (let i = 0; i < 25 && body.worker !== 'absent'; i++) {
      await new Promise((r) => setTimeout(r, 200));
      body = (await request(t.app).get('/api/health')).body;
    }
    expect(body.worker).toBe('absent');
  });
});
