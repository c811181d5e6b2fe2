import { spawn, type ChildProcess } from 'node:child_process';

/** A real worker process (worker/index.ts) on the test services; its output is kept for failure messages. */
export interface WorkerProcess {
  child: ChildProcess;
  output: string[];
  stop(signal?: NodeJS.Signals): Promise<void>;
}

export function startWorker(name = 'test-worker', env: Record<string, string> = {}): WorkerProcess {
  const output: string[] = [];
  const child = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], {
    env: { ...process.env, ...env, WORKER_NAME: name },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d) => output.push(String(d)));
  child.stderr!.on('data', (d) => output.push(String(d)));
  return {
    child,
    output,
    stop: (signal = 'SIGTERM') =>
      new Promise((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill(signal);
      }),
  };
}

/** Polls until `check` returns a value (not undefined) or the time runs out. */
export async function waitFor<T>(check: () => Promise<T | undefined>, timeoutMs: number, what: string): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
