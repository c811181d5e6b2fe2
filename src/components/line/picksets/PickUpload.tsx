import { useId, useRef, useState, type DragEvent } from 'react';
import { errorMessage, isApiError } from '../../../api/errors';
import { useUploadPickSet } from '../../../api/picksets';
import type { PickSetCreated } from '../../../api/types';
import { MAX_PICK_FILE_BYTES, MAX_PICK_ROWS } from '../../../../shared/limits';
import { Button } from '../../Button';
import { FileProblems, type FileIssue } from '../FileProblems';
import { formatBytes } from './formatBytes';

type Phase = { kind: 'idle' } | { kind: 'sending'; fraction: number } | { kind: 'checking' } | { kind: 'refused'; message: string };

/**
 * Drop a pick file (or choose one) and it is sent at once, with a progress bar. A file the
 * server refuses is listed problem by problem, each tied to its line in the file.
 */
export function PickUpload({ lineId, onUploaded }: { lineId: string; onUploaded: (created: PickSetCreated) => void }) {
  const upload = useUploadPickSet(lineId);
  const [file, setFile] = useState<File | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: 'idle' });
  const [dragging, setDragging] = useState(false);
  const abortRef = useRef<AbortController | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const id = useId();
  const busy = phase.kind === 'sending' || phase.kind === 'checking';

  function start(f: File) {
    setFile(f);
    upload.reset();
    if (f.size > MAX_PICK_FILE_BYTES) {
      setPhase({ kind: 'refused', message: `${f.name} is ${formatBytes(f.size)}; a pick file may be at most ${formatBytes(MAX_PICK_FILE_BYTES)}. Split it by shot and upload the parts.` });
      return;
    }
    const controller = new AbortController();
    abortRef.current = controller;
    setPhase({ kind: 'sending', fraction: 0 });
    upload.mutate(
      {
        file: f,
        signal: controller.signal,
        // Once every byte is sent the server still parses and checks the file.
        onProgress: (fraction) => setPhase(fraction >= 1 ? { kind: 'checking' } : { kind: 'sending', fraction }),
      },
      {
        onSuccess: (created) => {
          setPhase({ kind: 'idle' });
          setFile(null);
          onUploaded(created);
        },
        onError: (err) => setPhase(err instanceof DOMException && err.name === 'AbortError' ? { kind: 'idle' } : { kind: 'refused', message: errorMessage(err) }),
        onSettled: () => {
          abortRef.current = null;
          if (inputRef.current) inputRef.current.value = '';
        },
      },
    );
  }

  function onDrop(e: DragEvent) {
    e.preventDefault();
    setDragging(false);
    if (busy) return;
    const f = e.dataTransfer.files[0];
    if (f) start(f);
  }

  const issues: FileIssue[] = isApiError(upload.error, 422) ? upload.error.issues.map((i) => ({ line: i.line, column: i.column === undefined ? null : String(i.column), message: i.message })) : [];

  return (
    <div className="flex flex-col gap-4">
      <div
        data-testid="pick-dropzone"
        onDragEnter={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragOver={(e) => e.preventDefault()}
        onDragLeave={(e) => {
          if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setDragging(false);
        }}
        onDrop={onDrop}
        className={`rounded-lg border-2 border-dashed px-6 py-8 text-center transition-colors ${dragging ? 'border-accent-600 bg-accent-50' : 'border-stone-300 bg-white'}`}
      >
        <p className="text-lg font-semibold text-stone-900">Drop a pick file here</p>
        <p id={`${id}-hint`} className="mt-1 text-sm text-stone-600">
          CSV with the columns shot_id, source_x, receiver_x and time_ms (source_z, receiver_z and sigma_ms optional). Up to {formatBytes(MAX_PICK_FILE_BYTES)} and{' '}
          {MAX_PICK_ROWS.toLocaleString('en-GB')} picks. Each upload is stored as a new pick set.
        </p>
        <div className="mt-4">
          {/* The input stays out of the tab order; the button below is the one keyboard stop. */}
          <input
            id={id}
            ref={inputRef}
            type="file"
            accept=".csv,.txt,text/csv,text/plain"
            className="hidden"
            tabIndex={-1}
            disabled={busy}
            data-testid="pick-file-input"
            onChange={(e) => {
              const f = e.target.files?.[0];
              if (f) start(f);
            }}
          />
          <Button onClick={() => inputRef.current?.click()} disabled={busy} aria-describedby={`${id}-hint`} data-testid="pick-choose">
            Choose a file…
          </Button>
        </div>
      </div>

      {busy && file && (
        <div data-testid="pick-upload-progress" className="rounded-lg border border-stone-200 bg-white px-5 py-4">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <p className="font-semibold text-stone-900">
              {phase.kind === 'sending' ? `Sending ${file.name}` : `Checking ${file.name}`}
              <span className="ml-2 font-normal text-stone-600">{formatBytes(file.size)}</span>
            </p>
            {phase.kind === 'sending' && (
              <Button variant="quiet" size="sm" onClick={() => abortRef.current?.abort()}>
                Cancel
              </Button>
            )}
          </div>
          <progress
            className="mt-2 h-2 w-full overflow-hidden rounded-full accent-accent-700 [&::-webkit-progress-bar]:bg-stone-200 [&::-webkit-progress-value]:bg-accent-700"
            max={1}
            value={phase.kind === 'sending' ? phase.fraction : undefined}
            aria-label={phase.kind === 'sending' ? 'Upload progress' : 'Checking the file'}
          />
          <p className="mt-1 text-sm text-stone-600" aria-live="polite">
            {phase.kind === 'sending' ? `${Math.round(phase.fraction * 100)} % sent` : 'All sent; the server is reading the picks and running the checks…'}
          </p>
        </div>
      )}

      {phase.kind === 'refused' && <FileProblems file={file} summary={phase.message} issues={issues} testId="pick-problems" />}
    </div>
  );
}
