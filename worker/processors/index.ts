import type { Job } from 'bullmq';

/** One processor per job kind (job name → function). Later work registers solve and report jobs here. */
export type Processor = (job: Job) => Promise<unknown>;

export const processors: Record<string, Processor> = {};

export async function dispatch(job: Job): Promise<unknown> {
  const processor = processors[job.name];
  if (!processor) throw new Error(`This worker does not know jobs of kind "${job.name}".`);
  return processor(job);
}
