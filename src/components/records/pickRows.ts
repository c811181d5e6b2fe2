import type { PickRow } from '../../../shared/schemas/picks';
import type { RecordSummaryView, RecordTraceView } from '../../../shared/schemas/records';
import type { RecordPickMarks } from './pickingState';

export interface PickedRecord {
  summary: RecordSummaryView;
  traces: RecordTraceView[];
  marks: RecordPickMarks;
}

export interface PickRowsResult {
  rows: PickRow[];
  recordIds: string[];
  /** What stops the save (a record without a shot position, two records with one shot id). */
  problems: string[];
  /** Picks left out because their trace has no receiver position. */
  unplaced: number;
}

/** The picks of every record that has some, as pick rows (FORMATS.md §2) ready for POST …/picksets/from-records. */
export function pickRows(records: PickedRecord[]): PickRowsResult {
  const rows: PickRow[] = [];
  const recordIds: string[] = [];
  const problems: string[] = [];
  const shotOwner = new Map<string, string>();
  let unplaced = 0;
  for (const { summary, traces, marks } of records) {
    if (!marks.some((m) => m !== null)) continue;
    const other = shotOwner.get(summary.shotId);
    if (other) problems.push(`${other} and ${summary.fileName} both carry shot id ${summary.shotId}; give one of them another shot id.`);
    shotOwner.set(summary.shotId, summary.fileName);
    if (!summary.source) {
      problems.push(`${summary.fileName} (shot ${summary.shotId}) has no shot position; set it in the records list.`);
      continue;
    }
    recordIds.push(summary.id);
    marks.forEach((mark, i) => {
      if (!mark || mark.timeMs <= 0) return;
      const receiver = traces[i]?.receiver;
      if (!receiver) {
        unplaced++;
        return;
      }
      rows.push({
        shot_id: summary.shotId,
        source_x: summary.source!.x,
        source_z: summary.source!.z,
        receiver_x: receiver.x,
        receiver_z: receiver.z,
        time_ms: mark.timeMs,
        sigma_ms: mark.sigmaMs,
      });
    });
  }
  return { rows, recordIds, problems, unplaced };
}
