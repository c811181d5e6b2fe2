/**
 * The solve job's shot scheduler: at most `limit` shots in flight, and the first shot that fails
 * for good stops the rest (issue 16 item 3: "once one shot fails for good, the rest of the run's
 * shots stop").
 */
import { describe, expect, it } from 'vitest';
import { runAll } from '../../worker/processors/solve';

describe('runAll', () => {
  it('keeps at most the limit in flight and does every item', async () => {
    let inFlight = 0;
    let most = 0;
    const done: number[] = [];
    await runAll([1, 2, 3, 4, 5, 6, 7], 2, async (n) => {
      most = Math.max(most, ++inFlight);
      await new Promise((r) => setTimeout(r, 5));
      inFlight--;
      done.push(n);
    }, new AbortController());
    expect(most).toBe(2);
    expect(done.sort()).toEqual([1, 2, 3, 4, 5, 6, 7]);
  });

  it('starts no further item after one fails, and throws that failure', async () => {
    const started: number[] = [];
    const stop = new AbortController();
    await expect(
      runAll([1, 2, 3, 4, 5, 6], 2, async (n) => {
        started.push(n);
        await new Promise((r) => setTimeout(r, 5));
        if (n === 2) throw new Error('shot 2: solver failed');
      }, stop),
    ).rejects.toThrow('shot 2: solver failed');
    expect(stop.signal.aborted).toBe(true);
    expect(started.length).toBeLessThanOrEqual(3); // 1 and 2 in flight; at most one more started before 2 failed
  });
});
