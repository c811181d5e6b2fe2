import { pickTrace } from '../../../shared/picking';
import type { SeismicRecord } from '../../../shared/records';
import type { RecordPickMarks, TracePickMark } from './pickingState';

/** A hand pick's uncertainty: two samples, at least 0.25 ms (common practice, no source). */
export function handSigmaMs(sampleIntervalMs: number): number {
  return +Math.max(0.25, 2 * sampleIntervalMs).toFixed(3);
}

/** The automatic picker (shared/picking) on every trace; dead traces and traces with no clear arrival stay unpicked. */
export function autoPickRecord(record: SeismicRecord): RecordPickMarks {
  return record.traces.map((t): TracePickMark | null => {
    if (t.markedDead) return null;
    const outcome = pickTrace(t.samples, t.sampleInterval, t.delay);
    if (!outcome.ok || outcome.pick.time <= 0) return null;
    return { timeMs: +(outcome.pick.time * 1000).toFixed(4), sigmaMs: +(outcome.pick.sigma * 1000).toFixed(3), how: 'auto' };
  });
}
