import { pickGather } from '../../../shared/picking';
import type { SeismicRecord } from '../../../shared/records';
import type { RecordDetailView } from '../../../shared/schemas/records';
import type { RecordPickMarks, TracePickMark } from './pickingState';

/** A hand pick's uncertainty: two samples, at least 0.25 ms (common practice, no source). */
export function handSigmaMs(sampleIntervalMs: number): number {
  return +Math.max(0.25, 2 * sampleIntervalMs).toFixed(3);
}

/**
 * The automatic picker (shared/picking) on the whole record: each trace, then checked against its
 * neighbours along the spread where the shot and receiver positions are known. Dead traces and
 * traces with no clear arrival stay unpicked.
 */
export function autoPickRecord(record: SeismicRecord, detail: RecordDetailView): RecordPickMarks {
  const source = detail.source;
  const positions = detail.traces.map((t) => (source && t.receiver ? t.receiver.x - source.x : null));
  const outcomes = pickGather(record.traces, positions.length === record.traces.length ? positions : null);
  return record.traces.map((t, i): TracePickMark | null => {
    const outcome = outcomes[i];
    if (t.markedDead || !outcome.ok || outcome.pick.time <= 0) return null;
    return { timeMs: +(outcome.pick.time * 1000).toFixed(4), sigmaMs: +(outcome.pick.sigma * 1000).toFixed(3), how: 'auto' };
  });
}
