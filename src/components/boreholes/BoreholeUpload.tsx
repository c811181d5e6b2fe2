import { useRef } from 'react';
import { errorMessage, isApiError } from '../../api/errors';
import { useUploadBoreholes } from '../../api/boreholes';
import { Button } from '../Button';
import { FileProblems, type FileIssue } from '../line/FileProblems';

/** A borehole CSV (docs/boreholes.md): every hole of it stored, or none, with the problems by line and column. */
export function BoreholeUpload({ lineId }: { lineId: string }) {
  const upload = useUploadBoreholes(lineId);
  const input = useRef<HTMLInputElement>(null);
  const file = upload.variables ?? null;
  const issues: FileIssue[] = isApiError(upload.error, 422) ? upload.error.issues.map((i) => ({ line: i.line, column: i.column === undefined ? null : String(i.column), message: i.message })) : [];
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-3">
        <input
          ref={input}
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          className="hidden"
          tabIndex={-1}
          data-testid="borehole-file-input"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) upload.mutate(f);
            e.target.value = '';
          }}
        />
        <Button variant="secondary" onClick={() => input.current?.click()} busy={upload.isPending} busyLabel="Reading…" data-testid="borehole-choose">
          Upload a borehole CSV…
        </Button>
        <span className="text-sm text-stone-600">Columns hole, kind, x, ground_z, water_depth, depth, material, rock_top; one row per contact.</span>
      </div>
      {upload.isSuccess && (
        <p role="status" className="text-sm text-accent-900" data-testid="borehole-upload-done">
          {upload.data.created} {upload.data.created === 1 ? 'hole' : 'holes'} added from {file?.name}.
        </p>
      )}
      {upload.isError && <FileProblems file={file} summary={errorMessage(upload.error)} issues={issues} testId="borehole-problems" />}
    </div>
  );
}
