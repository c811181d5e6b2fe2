import { pickGather, type GatherTrace, type PickOutcome } from '../../../shared/picking';
import type { SeismicRecord } from '../../../shared/records';
import type { RecordDetailView } from '../../../shared/schemas/records';
import type { RecordPickMarks, TracePickMark } from './pickingState';

/** A hand pick's uncertainty: two samples, at least 0.25 ms (common practice, no source). */
export function handSigmaMs(sampleIntervalMs: number): number {
  return +Math.max(0.25, 2 * sampleIntervalMs).toFixed(3);
}

/** One picker worker for the page, started on first use; null where Web Workers are missing (the picks are then made in place). */
let worker: Worker | null | undefined;
let nextId = 1;
const waiting = new Map<number, { resolve: (o: PickOutcome[]) => void; reject: (e: Error) => void }>();

function pickerWorker(): Worker | null {
  if (worker !== undefined) return worker;
  try {
    worker = new Worker(new URL('../../workers/autopick.worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (event: MessageEvent<{ id: number; outcomes?: PickOutcome[]; error?: string }>) => {
      const job = waiting.get(event.data.id);
      waiting.delete(event.data.id);
      if (event.data.outcomes) job?.resolve(event.data.outcomes);
      else job?.reject(new Error(`The automatic picker failed: ${event.data.error}`));
    };
    worker.onerror = () => {
      for (const job of waiting.values()) job.reject(new Error('The automatic picker stopped unexpectedly; try again.'));
      waiting.clear();
      worker = undefined;
    };
  } catch {
    worker = null;
  }
  return worker;
}

/** pickGather in the picker worker (in place where there is none). */
function pickGatherOffPage(traces: GatherTrace[], positions: (number | null)[] | null): Promise<PickOutcome[]> {
  const w = pickerWorker();
  if (!w) return Promise.resolve(pickGather(traces, positions));
  const id = nextId++;
  return new Promise((resolve, reject) => {
    waiting.set(id, { resolve, reject });
    w.postMessage({ id, traces: traces.map((t) => ({ samples: t.samples, sampleInterval: t.sampleInterval, delay: t.delay })), positions });
  });
}

/**
 * The automatic picker (shared/picking) on the whole record, off the page's main thread: each trace,
 * then checked against its neighbours along the spread where the shot and receiver positions are
 * known. Dead traces and traces with no clear arrival stay unpicked.
 */
export async function autoPickRecord(record: SeismicRecord, detail: RecordDetailView): Promise<RecordPickMarks> {
  const source = detail.source;
  const positions = detail.traces.map((t) => (source && t.receiver ? t.receiver.x - source.x : null));
  const outcomes = await pickGatherOffPage(record.traces, positions.length === record.traces.length ? positions : null);
  return record.traces.map((t, i): TracePickMark | null => {
    const outcome = outcomes[i];
    if (t.markedDead || !outcome.ok || outcome.pick.time <= 0) return null;
    return { timeMs: +(outcome.pick.time * 1000).toFixed(4), sigmaMs: +(outcome.pick.sigma * 1000).toFixed(3), how: 'auto' };
  });
}
