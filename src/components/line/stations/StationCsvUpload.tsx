import { useId, useRef, useState } from 'react';
import { errorMessage, isApiError } from '../../../api/errors';
import { useSaveStations } from '../../../api/lines';
import type { Station } from '../../../api/types';
import { Button } from '../../Button';
import { ConfirmButton } from '../../ConfirmButton';
import { FileProblems, type FileIssue } from '../FileProblems';

/** Replace the station table from a CSV file (header `station,x,z`, any column order, `#` comments). */
export function StationCsvUpload({ lineId, current, onStored }: { lineId: string; current: number; onStored: (stations: Station[]) => void }) {
  const upload = useSaveStations(lineId);
  const [file, setFile] = useState<File | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const id = useId();

  function choose(f: File | null) {
    upload.reset();
    setFile(f);
  }

  function send() {
    if (!file) return;
    upload.mutate(
      { kind: 'file', file },
      {
        onSuccess: ({ stations }) => {
          onStored(stations);
          setFile(null);
          if (inputRef.current) inputRef.current.value = '';
        },
      },
    );
  }

  const issues: FileIssue[] = isApiError(upload.error) ? upload.error.issues.map((i) => ({ line: i.line, column: i.column === undefined ? null : String(i.column), message: i.message })) : [];

  return (
    <div data-testid="station-csv" className="rounded-lg border border-stone-200 bg-white p-4">
      <label htmlFor={id} className="font-semibold text-stone-800">
        Upload a station file (CSV)
      </label>
      <p id={`${id}-hint`} className="text-sm text-stone-600">
        Header <code>station,x,z</code> in any order; lines starting with <code>#</code> are comments. The file replaces the whole table. With
        coordinates, add <code>easting,northing</code> (in the project&rsquo;s coordinate system) or give <code>lon,lat</code> from a GNSS export
        instead; without <code>x</code>, the chainage is measured along the line through the stations in file order.
      </p>
      <div className="mt-2 flex flex-wrap items-center gap-3">
        <input
          id={id}
          ref={inputRef}
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          aria-describedby={`${id}-hint`}
          onChange={(e) => choose(e.target.files?.[0] ?? null)}
          className="text-sm file:mr-3 file:rounded-md file:border file:border-stone-300 file:bg-white file:px-3 file:py-1 file:font-semibold file:text-stone-800 hover:file:bg-stone-50"
        />
        {file && current > 0 && (
          <ConfirmButton
            label={`Replace ${current} stations`}
            confirmLabel="Confirm: replace"
            variant="primary"
            warning={`The ${current} stations on record are replaced by the file's; the current table is kept under "Earlier tables" and can be restored.`}
            busy={upload.isPending}
            busyLabel="Uploading…"
            testId="station-csv-send"
            onConfirm={(done) => (send(), done())}
          />
        )}
        {file && current === 0 && (
          <Button size="sm" onClick={send} busy={upload.isPending} busyLabel="Uploading…" data-testid="station-csv-send">
            Store stations
          </Button>
        )}
      </div>
      {upload.isSuccess && (
        <p role="status" className="mt-2 text-sm font-semibold text-accent-800">
          Stored {upload.data.stations.length} stations from the file.
        </p>
      )}
      {upload.isError && (
        <div className="mt-3">
          <FileProblems file={file} summary={errorMessage(upload.error)} issues={issues} testId="station-csv-problems" />
        </div>
      )}
    </div>
  );
}
