/**
 * The supervisor that npm start runs the worker under (scripts/lib/supervise.sh): a worker that
 * dies is started again with a growing wait, and stopping the supervisor stops the worker.
 * Requirement from issue 16 item 4 ("the worker is restarted with a back-off"); the 1, 2, 4 … s
 * doubling is common practice, no source.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function supervise(command: string) {
  const dir = mkdtempSync(path.join(tmpdir(), 'tf-supervise-'));
  const log: string[] = [];
  const child = spawn('bash', ['-c', `source scripts/lib/supervise.sh; supervise fake-worker bash -c '${command}'`], {
    cwd: process.cwd(),
    env: { ...process.env, DIR: dir },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stderr.on('data', (d) => log.push(String(d)));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { dir, log, child, exited };
}

describe('worker supervisor', () => {
  it('starts a crashing command again after 1 s, then 2 s, and says so each time', async () => {
    const s = supervise('echo start >> $DIR/starts; exit 3');
    await sleep(4000); // starts at about 0 s, 1 s and 3 s; the next would come at 7 s
    s.child.kill('SIGTERM');
    expect(await s.exited).toBe(0);
    const starts = readFileSync(path.join(s.dir, 'starts'), 'utf8').trim().split('\n');
    expect(starts).toHaveLength(3);
    const lines = s.log.join('');
    expect(lines).toContain('fake-worker stopped (exit code 3); starting it again in 1 s');
    expect(lines).toContain('fake-worker stopped (exit code 3); starting it again in 2 s');
  }, 15_000);

  it('stops the command it runs when it is stopped itself', async () => {
    const s = supervise('echo $$ > $DIR/pid; trap "echo stopped > $DIR/stopped; exit 0" TERM; while :; do sleep 0.1; done');
    for (let i = 0; i < 50 && !existsSync(path.join(s.dir, 'pid')); i++) await sleep(100);
    s.child.kill('SIGTERM');
    expect(await s.exited).toBe(0);
    await sleep(300);
    expect(existsSync(path.join(s.dir, 'stopped'))).toBe(true);
    const pid = Number(readFileSync(path.join(s.dir, 'pid'), 'utf8'));
    expect(() => process.kill(pid, 0)).toThrow(); // gone
  }, 15_000);
});
