import { useEffect, useState } from 'react';
import { useBlocker } from 'react-router';
import { errorMessage, isApiError } from '../../../api/errors';
import { useSaveStations } from '../../../api/lines';
import type { LineDetail, Station } from '../../../api/types';
import { Button } from '../../Button';
import { EmptyState } from '../../EmptyState';
import { LeavePrompt } from '../../LeavePrompt';
import { Section } from '../../Section';
import { ElevationProfile } from './ElevationProfile';
import { StationCsvUpload } from './StationCsvUpload';
import { StationRevisions } from './StationRevisions';
import { StationEditor } from './StationEditor';
import { StationTable } from './StationTable';
import { checkRows, COLUMN_LABELS, nextRow, sameStations, toDraft, type DraftRow, type RowErrors, type StationColumn } from './stationRows';

const DESCRIPTION = 'Station number, distance along the line and ground elevation of each geophone position. The elevations define the ground surface offered to new velocity models.';

/** Server issues for the JSON body name a 1-based row; tie them to the rows that were sent. */
function serverRowErrors(error: unknown, sent: readonly DraftRow[]): { byRow: RowErrors; other: string[] } {
  const byRow: RowErrors = new Map();
  const other: string[] = [];
  if (!isApiError(error)) return { byRow, other };
  for (const issue of error.issues as { row?: number; column?: string; message: string }[]) {
    const row = issue.row ? sent[issue.row - 1] : undefined;
    const label = issue.column && issue.column in COLUMN_LABELS ? COLUMN_LABELS[issue.column as StationColumn].replace(/ \(m\)$/, '') : issue.column;
    const text = label ? `${label}: ${issue.message}` : issue.message;
    if (row) byRow.set(row.key, [...(byRow.get(row.key) ?? []), text]);
    else other.push(issue.row ? `row ${issue.row}, ${text}` : text);
  }
  return { byRow, other };
}

function mergeErrors(a: RowErrors, b: RowErrors): RowErrors {
  const out = new Map(a);
  for (const [k, v] of b) out.set(k, [...(out.get(k) ?? []), ...v]);
  return out;
}

export function StationsTab({ line, canEdit }: { line: LineDetail; canEdit: boolean }) {
  if (!canEdit) {
    return (
      <Section title="Stations" description={DESCRIPTION}>
        {line.stations.length === 0 ? (
          <EmptyState title="No station table yet" testId="stations-empty">
            A field technician or geophysicist enters or uploads the stations.
          </EmptyState>
        ) : (
          <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
            <StationTable stations={line.stations} />
            <ElevationProfile stations={line.stations} />
          </div>
        )}
      </Section>
    );
  }
  return <StationWorkbench line={line} />;
}

function StationWorkbench({ line }: { line: LineDetail }) {
  const save = useSaveStations(line.id);
  const [rows, setRows] = useState<DraftRow[]>(() => toDraft(line.stations));
  const [seen, setSeen] = useState(line.stations);
  const [checked, setChecked] = useState(false); // show rule checks after the first save attempt
  const [sent, setSent] = useState<DraftRow[]>([]);
  const [saved, setSaved] = useState(false);

  const dirty = !sameStations(rows, line.stations);
  // The table on the server changed (another upload, a refetch): follow it unless the user has edits.
  if (seen !== line.stations) {
    setSeen(line.stations);
    if (!dirty || rows.length === 0) setRows(toDraft(line.stations));
  }

  // Leaving with unsaved edits asks first: reload or closing the tab (the browser's question), or a
  // link to another page (held below). Other tabs of the line keep this one mounted, so they may.
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);

  const local = checkRows(rows);
  const server = serverRowErrors(save.error, sent);
  const errors = mergeErrors(checked ? local.errors : new Map(), save.isError ? server.byRow : new Map());

  function change(next: DraftRow[]) {
    setRows(next);
    setSaved(false);
  }

  function onSave() {
    setChecked(true);
    setSaved(false);
    save.reset();
    if (!local.stations) {
      document.querySelector<HTMLElement>('[data-testid="station-row-errors"]')?.closest('tr')?.querySelector('input')?.focus();
      return;
    }
    setSent(rows);
    save.mutate({ kind: 'rows', rows: local.stations }, { onSuccess: () => setSaved(true) });
  }

  function onStoredFromFile(stations: Station[]) {
    setRows(toDraft(stations));
    setChecked(false);
    save.reset();
  }

  const preview = local.stations && local.stations.length > 1 ? local.stations : line.stations;
  const problemCount = errors.size;

  return (
    <Section title="Stations" description={DESCRIPTION}>
      <LeavePrompt blocker={blocker} what="Leave without saving the station table? The edits since the last save will be lost." testId="stations-leave-guard" />
      <div className="flex flex-col gap-6">
        {preview.length > 1 && <ElevationProfile stations={preview} />}
        <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
          <div className="flex min-w-0 flex-col gap-4">
            <div className="flex flex-wrap items-center gap-3">
              <Button onClick={onSave} busy={save.isPending} busyLabel="Saving…" disabled={!dirty} data-testid="stations-save">
                Save stations
              </Button>
              <Button variant="secondary" onClick={() => change([...rows, nextRow(rows)])} data-testid="stations-add">
                Add row
              </Button>
              {dirty && (
                <Button variant="quiet" onClick={() => (setRows(toDraft(line.stations)), setChecked(false), save.reset())}>
                  Discard changes
                </Button>
              )}
              <p role="status" data-testid="stations-status" className="text-sm text-stone-600">
                {saved && !dirty ? (
                  <span className="font-semibold text-accent-800">Saved {line.stations.length} stations.</span>
                ) : dirty ? (
                  'Unsaved changes.'
                ) : (
                  `${line.stations.length} stations on record.`
                )}
              </p>
            </div>
            {(problemCount > 0 || (save.isError && !isApiError(save.error, 422)) || server.other.length > 0) && (
              <div role="alert" data-testid="stations-alert" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
                <p className="font-semibold">
                  {problemCount > 0
                    ? `${problemCount === 1 ? 'One row needs' : `${problemCount} rows need`} attention before the table can be saved; see the rows marked below.`
                    : errorMessage(save.error)}
                </p>
                {server.other.length > 0 && (
                  <ul className="mt-1 list-disc pl-5 text-sm">
                    {server.other.map((m, i) => (
                      <li key={i}>{m}</li>
                    ))}
                  </ul>
                )}
              </div>
            )}
            {rows.length === 0 ? (
              <EmptyState title="No stations yet" testId="stations-empty">
                Add a first row and type, or paste cells from a spreadsheet into it, or upload a CSV file.
              </EmptyState>
            ) : (
              <StationEditor rows={rows} errors={errors} onChange={change} />
            )}
          </div>
          <div className="flex flex-col gap-4">
            <StationCsvUpload lineId={line.id} current={line.stations.length} onStored={onStoredFromFile} />
            <StationRevisions lineId={line.id} current={line.stations.length} canRestore onRestored={onStoredFromFile} />
            <div className="rounded-lg border border-stone-200 bg-white p-4 text-sm text-stone-700">
              <p className="font-semibold text-stone-800">Working in the table</p>
              <ul className="mt-1 list-disc space-y-1 pl-5">
                <li>Copy three columns (station, x, elevation) from a spreadsheet and paste them into any cell; rows are added as needed.</li>
                <li>Enter moves down a column, Shift+Enter up.</li>
                <li>x must grow down the table, and each station number may appear once.</li>
              </ul>
            </div>
          </div>
        </div>
      </div>
    </Section>
  );
}
