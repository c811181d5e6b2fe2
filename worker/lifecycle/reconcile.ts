/**
 * Rows whose job is gone: a run left `running` by a worker that was killed for good, or `queued`
 * while its job failed (database down when the job ended, job removed from Redis). The worker
 * looks for them when it starts and then every minute, and marks them failed with the job's reason.
 * Rows are not queued again: a job that failed for good failed for a reason a person should see.
 */
import type { JobType, Queue } from 'bullmq';
import { failureReason, jobRows } from './job-rows';

/** States in which BullMQ will still run a job (or is running it). */
const LIVE_STATES: JobType[] = ['active', 'waiting', 'delayed', 'prioritized', 'waiting-children', 'wait'];

/** Seconds a row may wait for its job to appear (the API writes the row just before queuing). */
export const RECONCILE_GRACE_SECONDS = 30;

export async function reconcileOrphans(queue: Queue, graceSeconds = RECONCILE_GRACE_SECONDS): Promise<number> {
  const live = new Map<string, Set<string>>();
  const failed = new Map<string, string>();
  for (const job of await queue.getJobs(LIVE_STATES)) {
    const id = job && jobRows[job.name]?.rowIdOf(job.data);
    if (id) live.set(job.name, (live.get(job.name) ?? new Set()).add(id));
  }
  for (const job of await queue.getJobs(['failed'])) {
    const id = job && jobRows[job.name]?.rowIdOf(job.data);
    if (id) failed.set(`${job.name}:${id}`, job.failedReason);
  }
  let marked = 0;
  for (const [name, kind] of Object.entries(jobRows)) {
    for (const id of await kind.unfinishedRows(graceSeconds)) {
      if (live.get(name)?.has(id)) continue;
      const reason = failed.has(`${name}:${id}`)
        ? failureReason(failed.get(`${name}:${id}`))
        : 'The job was lost (the queue no longer holds it, e.g. after a restart of the queue service without its data). Start it again.';
      await kind.markFailed(id, reason);
      console.error(`[worker] ${name} ${id} had no job left; marked failed`);
      marked++;
    }
  }
  return marked;
}
