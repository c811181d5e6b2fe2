/**
 * From read records to pick rows (FORMATS.md §2) for `npm run pick`: positions from the record or
 * the station table (by channel), the automatic picker on every trace, and the reasons a trace
 * stays unpicked. Pure: no files.
 */
import { pickGather } from '../../shared/picking';
import type { RecordTrace, SeismicRecord } from '../../shared/records';

export interface PickRow {
  shotId: string;
  sourceX: number;
  receiverX: number;
  receiverZ: number | null;
  timeMs: number;
  sigmaMs: number;
}

export interface RecordPicks {
  rows: PickRow[];
  unpicked: number;
  /** Set when the record's traces could not be placed (no positions and no station for them). */
  unplaced: number;
}

export type StationMap = Map<number, { x: number; z: number }>;

const round = (v: number, digits: number) => +v.toFixed(digits);

/** One record's picks. `name` (the file name without its extension) is the shot id; a file of several source positions gets `name@x`. */
export function pickRecord(record: SeismicRecord, name: string, stations: StationMap | null): RecordPicks {
  const sources = new Set(record.traces.map((t) => t.source?.x).filter((x): x is number => x !== undefined));
  const rows: PickRow[] = [];
  let unpicked = 0, unplaced = 0;
  const receivers = record.traces.map((t) => receiverOf(t, stations));
  // The gather is picked as a whole: each pick is checked against its neighbours along the spread.
  const outcomes = pickGather(record.traces, record.traces.map((t, i) => (t.source && receivers[i] ? receivers[i]!.x - t.source.x : null)));
  record.traces.forEach((trace, i) => {
    const receiver = receivers[i];
    if (!trace.source || !receiver) {
      unplaced++;
      unpicked++;
      return;
    }
    const outcome = trace.markedDead ? null : outcomes[i];
    if (!outcome?.ok || outcome.pick.time <= 0) {
      unpicked++;
      return;
    }
    rows.push({
      shotId: sources.size > 1 ? `${name}@${trace.source.x}` : name,
      sourceX: trace.source.x,
      receiverX: receiver.x,
      receiverZ: receiver.z,
      timeMs: round(outcome.pick.time * 1000, 4),
      sigmaMs: round(outcome.pick.sigma * 1000, 3),
    });
  });
  return { rows, unpicked, unplaced };
}

/** The station table wins (by channel number); else the record's own receiver position, on the ground (z empty). */
function receiverOf(trace: RecordTrace, stations: StationMap | null): { x: number; z: number | null } | null {
  const station = stations?.get(trace.channel);
  if (station) return station;
  return trace.receiver ? { x: trace.receiver.x, z: null } : null;
}

/** A shot id from a file name may hold a comma or a quote: quote it then (FORMATS.md §2 allows quoted fields). */
const csvField = (text: string): string => (/[",]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);

export function formatPickRows(rows: PickRow[]): string {
  const lines = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
  for (const r of rows) lines.push(`${csvField(r.shotId)},${r.sourceX},,${r.receiverX},${r.receiverZ ?? ''},${r.timeMs},${r.sigmaMs}`);
  return `${lines.join('\n')}\n`;
}

/** The traces as read (FORMATS.md §3 `--traces`): time_ms from the shot, then one column per channel, stored × DESCALING_FACTOR. */
export function formatTraceTable(record: SeismicRecord): string {
  const first = record.traces[0];
  const n = Math.max(...record.traces.map((t) => t.samples.length));
  const lines = [['time_ms', ...record.traces.map((t) => t.channel)].join(',')];
  for (let i = 0; i < n; i++) {
    const cells = [String((first.delay + i * first.sampleInterval) * 1000)];
    for (const t of record.traces) cells.push(i < t.samples.length ? String(t.samples[i] * t.descale) : '');
    lines.push(cells.join(','));
  }
  return `${lines.join('\n')}\n`;
}
