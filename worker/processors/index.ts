import type { Job } from 'bullmq';
import { ensembleMemberJob } from './ensemble-member';
import { invertJob } from './invert';
import { reportJob } from './report';
import { solveJob } from './solve';

/** One processor per job kind (job name → function). */
export type Processor = (job: Job) => Promise<unknown>;

export const processors: Record<string, Processor> = {
  solve: solveJob,
  report: reportJob,
  invert: invertJob,
  'ensemble-member': ensembleMemberJob,
};

export async function dispatch(job: Job): Promise<unknown> {
  const processor = processors[job.name];
  if (!processor) throw new Error(`This worker does not know jobs of kind "${job.name}".`);
  return processor(job);
}
