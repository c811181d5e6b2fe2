import type { Job } from 'bullmq';
import { failureReason, jobRows } from './job-rows';

/**
 * A job that failed for good (no attempts left) marks its row failed. When the database is down
 * too, the marking is tried a few more times; after that the reconciler finds the row later.
 */
export async function markRowOfFailedJob(job: Job | undefined, err: Error, retryDelaysMs = [1000, 3000, 10_000]): Promise<void> {
  if (!job) return;
  const attemptsLeft = (job.opts.attempts ?? 1) - job.attemptsMade;
  const kind = jobRows[job.name];
  const id = kind?.rowIdOf(job.data);
  if (!kind || !id || attemptsLeft > 0) return;
  const reason = failureReason(err.message);
  for (let i = 0; ; i++) {
    try {
      await kind.markFailed(id, reason);
      return;
    } catch (dbErr) {
      if (i >= retryDelaysMs.length) {
        console.error(`[worker] could not mark ${job.name} ${id} failed (${(dbErr as Error).message}); the reconciler will`);
        return;
      }
      await new Promise((r) => setTimeout(r, retryDelaysMs[i]));
    }
  }
}
