import { useCallback, useEffect, useMemo, useState, type Dispatch, type KeyboardEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { errorMessage } from '../../api/errors';
import { recordDetailQuery, recordFileQuery, recordKeys, useRecordDetail, useRecordFile } from '../../api/records';
import type { SeismicRecord } from '../../../shared/records';
import type { RecordDetailView, RecordSummaryView } from '../../../shared/schemas/records';
import type { PickSetSummary } from '../../api/types';
import { prepareTraces } from '../../lib/traces/prepare';
import { snapToOnset } from '../../lib/traces/snap';
import { Button } from '../Button';
import { Loading, LoadError } from '../LoadState';
import { autoPickRecord, handSigmaMs } from './autoPick';
import { DisplayControls } from './DisplayControls';
import { DEFAULT_DISPLAY, type DisplaySettings } from './displaySettings';
import type { RecordDrawing } from './drawRecord';
import { PickCurves, type PickCurve } from './PickCurves';
import { pickCount, type PickingAction, type PickingState, type RecordPickMarks } from './pickingState';
import { RecordCanvas } from './RecordCanvas';
import { fullView, zoomView, type RecordView } from './recordGeometry';
import { SavePicksPanel } from './SavePicksPanel';

interface Props {
  lineId: string;
  records: RecordSummaryView[];
  record: RecordSummaryView;
  onRecord: (recordId: string) => void;
  canPick: boolean;
  /** The line's pick sets in use: the ones the picks can be saved as a new version of. */
  pickSets: PickSetSummary[];
  picking: PickingState;
  dispatch: Dispatch<PickingAction>;
}

/** Hand picks stay when the picker runs again; its picks fill the rest. */

/**
 * Picking first breaks on a line's records: the record in view with its display controls, the
 * keyboard and pointer picking, the automatic picker, the travel-time curves of all picks so far,
 * and saving them as a pick set.
 */
export function PickingWorkspace({ lineId, records, record, onRecord, canPick, pickSets, picking, dispatch }: Props) {
  const queryClient = useQueryClient();
  const file = useRecordFile(record.id, record.fileName);
  const detail = useRecordDetail(record.id);
  const [display, setDisplay] = useState<DisplaySettings>(DEFAULT_DISPLAY);
  const [autoAll, setAutoAll] = useState<{ done: number; error: string | null } | null>(null);
  const index = records.findIndex((r) => r.id === record.id);
  const step = (d: number) => {
    const next = records[index + d];
    if (next) onRecord(next.id);
  };

  const autoPickAll = async () => {
    setAutoAll({ done: 0, error: null });
    try {
      for (const [i, r] of records.entries()) {
        // The headers too: the curves beside the record need the receiver positions.
        const [read, headers] = await Promise.all([queryClient.fetchQuery(recordFileQuery(r.id, r.fileName)), queryClient.fetchQuery(recordDetailQuery(r.id))]);
        dispatch({ kind: 'auto', recordId: r.id, marks: await autoPickRecord(read, headers) });
        setAutoAll({ done: i + 1, error: null });
        // Let the page draw between records.
        await new Promise((resolve) => setTimeout(resolve, 0));
      }
    } catch (err) {
      setAutoAll((s) => ({ done: s?.done ?? 0, error: errorMessage(err) }));
    }
  };

  const curves = useMemo(() => pickCurves(records, record.id, picking, queryClient), [records, record.id, picking, queryClient, detail.data]);

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2" data-testid="record-nav">
        <Button size="sm" variant="secondary" onClick={() => step(-1)} disabled={index <= 0} aria-label="Previous record">
          ← Previous
        </Button>
        <label className="flex items-center gap-2 font-semibold text-stone-800">
          <span className="sr-only">Record</span>
          <select className="rounded-md border border-stone-300 bg-white px-2 py-1.5" value={record.id} onChange={(e) => onRecord(e.target.value)} data-testid="record-select">
            {records.map((r) => (
              <option key={r.id} value={r.id}>
                Shot {r.shotId} · {r.source ? `x ${r.source.x} m` : 'position not set'} · {pickCount(picking.byRecord[r.id])} picks
              </option>
            ))}
          </select>
        </label>
        <Button size="sm" variant="secondary" onClick={() => step(1)} disabled={index >= records.length - 1} aria-label="Next record">
          Next →
        </Button>
        {canPick && (
          <>
            <Button size="sm" variant="secondary" onClick={() => void autoPickAll()} busy={autoAll !== null && autoAll.done < records.length && !autoAll.error} busyLabel={`Auto-picking ${autoAll?.done ?? 0}/${records.length}…`} data-testid="autopick-all">
              Auto-pick all records
            </Button>
            <Button size="sm" variant="secondary" onClick={() => dispatch({ kind: 'undo' })} disabled={!picking.history.length} data-testid="undo">
              Undo
            </Button>
          </>
        )}
        {autoAll?.error && (
          <p role="alert" className="text-sm font-semibold text-red-800">
            {autoAll.error}
          </p>
        )}
      </div>
      <DisplayControls value={display} onChange={setDisplay} nyquistHz={500 / record.sampleIntervalMs} />
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div>
          {file.isPending || detail.isPending ? (
            <Loading what="record" />
          ) : file.isError || detail.isError ? (
            <LoadError error={file.error ?? detail.error} what="record" onRetry={() => void (file.isError ? file.refetch() : detail.refetch())} />
          ) : (
            <RecordPicker key={record.id} summary={record} read={file.data} detail={detail.data} display={display} canPick={canPick} marks={picking.byRecord[record.id]} dispatch={dispatch} onStepRecord={step} />
          )}
        </div>
        <div className="flex flex-col gap-4">
          <section aria-label="Travel-time curves of the picks">
            <h2 className="mb-2 font-semibold text-stone-900">Travel times picked so far</h2>
            <PickCurves curves={curves} />
          </section>
          {canPick && <SavePicksPanel lineId={lineId} records={records} pickSets={pickSets} picking={picking} onSaved={() => dispatch({ kind: 'saved' })} />}
        </div>
      </div>
    </div>
  );
}

/** Curves from the picks of every record whose headers are loaded (the others appear once opened or auto-picked). */
function pickCurves(records: RecordSummaryView[], currentId: string, picking: PickingState, queryClient: ReturnType<typeof useQueryClient>): PickCurve[] {
  const out: PickCurve[] = [];
  for (const r of records) {
    const marks = picking.byRecord[r.id];
    const d = queryClient.getQueryData<RecordDetailView>(recordKeys.detail(r.id));
    if (!marks || !d) continue;
    const points = marks.flatMap((m, i) => (m && d.traces[i]?.receiver ? [{ x: d.traces[i].receiver!.x, timeMs: m.timeMs }] : [])).sort((a, b) => a.x - b.x);
    if (points.length) out.push({ shotId: r.shotId, sourceX: r.source?.x ?? null, points, current: r.id === currentId });
  }
  return out;
}

interface PickerProps {
  summary: RecordSummaryView;
  read: SeismicRecord;
  detail: RecordDetailView;
  display: DisplaySettings;
  canPick: boolean;
  marks: RecordPickMarks | undefined;
  dispatch: Dispatch<PickingAction>;
  onStepRecord: (d: number) => void;
}

/** One record on the canvas, with its view (zoom) and selected trace; remounted per record. */
function RecordPicker({ summary, read, detail, display, canPick, marks, dispatch, onStepRecord }: PickerProps) {
  const traces = read.traces;
  const dtMs = useMemo(() => traces.map((t) => t.sampleInterval * 1000), [traces]);
  const delayMs = useMemo(() => traces.map((t) => t.delay * 1000), [traces]);
  const endMs = Math.max(...traces.map((t) => (t.delay + (t.samples.length - 1) * t.sampleInterval) * 1000));
  const [view, setView] = useState<RecordView>(() => fullView(traces.length, Math.min(...delayMs), endMs));
  const [selected, setSelected] = useState(0);
  const prepared = useMemo(
    () => prepareTraces(traces, { band: { lowHz: display.lowHz, highHz: display.highHz, order: 4 }, agcMs: display.agcMs, normalise: display.normalise }),
    [traces, display.lowHz, display.highHz, display.agcMs, display.normalise],
  );
  const source = summary.source;
  const shiftMs = useMemo(
    () =>
      detail.traces.map((t) => (display.reduceVelocity && source && t.receiver ? (Math.abs(t.receiver.x - source.x) / display.reduceVelocity) * 1000 : 0)),
    [detail.traces, display.reduceVelocity, source],
  );
  const picks = useMemo(() => marks ?? traces.map(() => null), [marks, traces]);
  const drawing: RecordDrawing = useMemo(
    () => ({
      traces: prepared,
      dtMs,
      delayMs,
      shiftMs,
      labels: traces.map((t) => String(t.channel)),
      view,
      wiggle: display.mode !== 'density',
      density: display.mode !== 'wiggle',
      gain: display.gain,
      clip: display.clip,
      picks,
      selected,
    }),
    [prepared, dtMs, delayMs, shiftMs, traces, view, display.mode, display.gain, display.clip, picks, selected],
  );

  // The picker runs in a worker; its picks arrive a moment later and never overwrite hand picks.
  const [autoState, setAutoState] = useState<string | null>(null);
  const autoPick = useCallback(() => {
    setAutoState('busy');
    autoPickRecord(read, detail).then(
      (result) => {
        dispatch({ kind: 'auto', recordId: summary.id, marks: result });
        setAutoState(null);
      },
      (err) => setAutoState(errorMessage(err)),
    );
  }, [read, detail, dispatch, summary.id]);

  const setPick = useCallback(
    (trace: number, timeMs: number | null) =>
      dispatch({
        kind: 'set',
        recordId: summary.id,
        traces: traces.length,
        trace,
        mark: timeMs === null ? null : { timeMs: +timeMs.toFixed(4), sigmaMs: handSigmaMs(dtMs[trace]), how: 'hand' },
      }),
    [dispatch, summary.id, traces.length, dtMs],
  );

  // Keep the selected trace in sight when the keyboard moves past the edge.
  useEffect(() => {
    setView((v) => (selected < v.a + 0.5 ? { ...v, a: selected - 0.8, b: selected - 0.8 + (v.b - v.a) } : selected > v.b - 0.5 ? { ...v, b: selected + 0.8, a: selected + 0.8 - (v.b - v.a) } : v));
  }, [selected]);

  const onClickAt = (trace: number, displayMs: number) => {
    setSelected(trace);
    if (!canPick) return;
    const t = displayMs + shiftMs[trace];
    setPick(trace, display.snapClicks ? snapToOnset(traces[trace], t) : t);
  };

  const onKeyDown = (e: KeyboardEvent) => {
    const mark = picks[selected];
    const centre = mark ? mark.timeMs - shiftMs[selected] : (view.t0 + view.t1) / 2;
    const handled = (() => {
      switch (e.key) {
        case 'ArrowLeft':
          setSelected((s) => Math.max(0, s - 1));
          return true;
        case 'ArrowRight':
          setSelected((s) => Math.min(traces.length - 1, s + 1));
          return true;
        case 'ArrowUp':
        case 'ArrowDown':
          if (!canPick || !mark) return true;
          setPick(selected, Math.max(0, mark.timeMs + (e.key === 'ArrowUp' ? -1 : 1) * (e.shiftKey ? 10 : 1) * dtMs[selected]));
          return true;
        case 'Delete':
        case 'Backspace':
          if (canPick) setPick(selected, null);
          return true;
        case 's':
        case 'S':
          if (canPick && mark) setPick(selected, snapToOnset(traces[selected], mark.timeMs));
          return true;
        case 'a':
        case 'A':
          if (canPick) autoPick();
          return true;
        case 'z':
        case 'Z':
          if (!(e.ctrlKey || e.metaKey)) return false;
          dispatch({ kind: 'undo' });
          return true;
        case '+':
        case '=':
          setView((v) => zoomView(v, 'time', 0.7, centre));
          return true;
        case '-':
          setView((v) => zoomView(v, 'time', 1 / 0.7, centre));
          return true;
        case '0':
          setView(fullView(traces.length, Math.min(...delayMs), endMs));
          return true;
        case 'PageUp':
          onStepRecord(-1);
          return true;
        case 'PageDown':
          onStepRecord(1);
          return true;
        default:
          return false;
      }
    })();
    if (handled) e.preventDefault();
  };

  const t = detail.traces[selected];
  const mark = picks[selected];
  const unplaced = detail.traces.filter((x) => !x.receiver).length;
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <Button size="sm" variant="secondary" onClick={() => setView((v) => zoomView(v, 'time', 0.7, (v.t0 + v.t1) / 2))} aria-label="Zoom in on time">
          Time +
        </Button>
        <Button size="sm" variant="secondary" onClick={() => setView((v) => zoomView(v, 'time', 1 / 0.7, (v.t0 + v.t1) / 2))} aria-label="Zoom out on time">
          Time −
        </Button>
        <Button size="sm" variant="secondary" onClick={() => setView((v) => zoomView(v, 'traces', 0.7, (v.a + v.b) / 2))} aria-label="Zoom in on traces">
          Traces +
        </Button>
        <Button size="sm" variant="secondary" onClick={() => setView((v) => zoomView(v, 'traces', 1 / 0.7, (v.a + v.b) / 2))} aria-label="Zoom out on traces">
          Traces −
        </Button>
        <Button size="sm" variant="quiet" onClick={() => setView(fullView(traces.length, Math.min(...delayMs), endMs))} data-testid="zoom-fit">
          Whole record
        </Button>
        {canPick && (
          <Button size="sm" variant="secondary" onClick={autoPick} busy={autoState === 'busy'} busyLabel="Auto-picking…" data-testid="autopick-record">
            Auto-pick this record
          </Button>
        )}
        {autoState && autoState !== 'busy' && (
          <span role="alert" className="text-sm font-semibold text-red-800">
            {autoState}
          </span>
        )}
      </div>
      <RecordCanvas
        drawing={drawing}
        height={560}
        onView={setView}
        onClickAt={onClickAt}
        onKeyDown={onKeyDown}
        label={`Shot ${summary.shotId}: ${traces.length} traces. ${canPick ? 'Click to pick; arrow keys move and nudge, S snaps, Delete removes, A auto-picks.' : ''}`}
      />
      <p className="text-sm text-stone-700" data-testid="trace-readout" aria-live="polite">
        Channel {traces[selected]?.channel}
        {t?.receiver ? ` · receiver x ${t.receiver.x} m` : ' · receiver not placed'}
        {source && t?.receiver ? ` · offset ${Math.abs(t.receiver.x - source.x).toFixed(1)} m` : ''}
        {mark ? ` · first break ${+mark.timeMs.toFixed(3)} ms (${mark.how === 'auto' ? 'automatic' : 'by hand'}, ± ${mark.sigmaMs} ms)` : ' · not picked'}
      </p>
      {display.reduceVelocity && !source && <p className="text-sm font-semibold text-amber-800">Reduced time needs the shot position; set it in the records list.</p>}
      {unplaced > 0 && (
        <p className="text-sm font-semibold text-amber-800">
          {unplaced} of {traces.length} traces have no receiver position (neither in the file nor a station numbered as the channel); their picks cannot be saved.
        </p>
      )}
      <details className="text-sm text-stone-700">
        <summary className="cursor-pointer font-semibold">Keys and pointer</summary>
        <ul className="mt-1 list-disc pl-5">
          <li>Click a trace to pick it (tick “Snap clicks” to land on the onset); drag to pan; wheel zooms time, Shift + wheel zooms traces.</li>
          <li>← → move between traces; ↑ ↓ move the pick by one sample (Shift: ten); S snaps it to the onset; Delete removes it.</li>
          <li>A auto-picks this record (hand picks are kept); Ctrl + Z undoes; + − zoom time; 0 shows the whole record; Page Up / Page Down change record.</li>
        </ul>
      </details>
    </div>
  );
}
