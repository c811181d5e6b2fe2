/**
 * The model file (FORMATS.md §1, *.model.json) and the plain x,z,v CSV grid, out and in. An
 * import becomes one undoable step; a bad file is refused with its problems (JSON: a path or a
 * line and column; CSV: line and column).
 */
import { useRef, useState, type ChangeEvent } from 'react';
import { parseModelFile, type ModelFile, type RasterModel } from '../../../shared/model';
import { formatGridCsv, formatModelFile, parseGridCsv } from '../../../shared/model/edit';
import { Button } from '../Button';
import { downloadText, safeFileName } from './download';
import { notTextMessage } from '../../../shared/files/not-text';

export interface ImportExportProps {
  model: ModelFile;
  raster: RasterModel | null;
  baseName: string;
  exportBlocked: string | null;
  readOnly: boolean;
  onImport: (model: ModelFile, fileName: string) => void;
}

/** Largest file the editor reads (a 2-million-node CSV is about 40 MB). */
const MAX_IMPORT_BYTES = 64 * 1024 * 1024;

export function ImportExport(p: ImportExportProps) {
  const fileRef = useRef<HTMLInputElement>(null);
  const [problems, setProblems] = useState<{ file: string; lines: string[] } | null>(null);
  const [note, setNote] = useState<string | null>(null);

  async function onFile(e: ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    setProblems(null);
    setNote(null);
    if (file.size > MAX_IMPORT_BYTES) {
      setProblems({ file: file.name, lines: [`The file is ${(file.size / 1048576).toFixed(1)} MB; the editor reads files up to ${MAX_IMPORT_BYTES / 1048576} MB.`] });
      return;
    }
    const text = await file.text();
    const result = /\.csv$/i.test(file.name) ? readCsv(text) : readModelJson(text);
    if (!result.ok) {
      setProblems({ file: file.name, lines: result.lines });
      return;
    }
    p.onImport(result.model, file.name);
    setNote(`Imported ${file.name}. Undo brings back the model as it was before.`);
  }

  const disabled = Boolean(p.exportBlocked);
  return (
    <div data-testid="import-export" className="space-y-3">
      <div className="flex flex-wrap gap-2">
        <Button
          size="sm"
          variant="secondary"
          disabled={disabled}
          title={p.exportBlocked ?? undefined}
          data-testid="export-model"
          onClick={() => downloadText(`${safeFileName(p.baseName)}.model.json`, formatModelFile(p.model), 'application/json')}
        >
          Model file (.model.json)
        </Button>
        <Button
          size="sm"
          variant="secondary"
          disabled={disabled || !p.raster}
          title={p.exportBlocked ?? undefined}
          data-testid="export-csv"
          onClick={() => p.raster && downloadText(`${safeFileName(p.baseName)}.grid.csv`, formatGridCsv(p.raster.grid, p.raster.velocity, p.raster.active), 'text/csv')}
        >
          Grid as CSV (x, z, v)
        </Button>
      </div>
      {p.exportBlocked && <p className="text-sm text-stone-600">{p.exportBlocked}</p>}
      {!p.readOnly && (
        <div>
          <input ref={fileRef} type="file" accept=".json,.csv,application/json,text/csv" className="sr-only" data-testid="import-file" onChange={(e) => void onFile(e)} tabIndex={-1} />
          <Button size="sm" variant="secondary" onClick={() => fileRef.current?.click()}>
            Import a model file or CSV grid…
          </Button>
          <p className="mt-1 text-sm text-stone-600">A CSV grid becomes a raw velocity grid: it can be painted over, but it has no layers.</p>
        </div>
      )}
      {note && (
        <p role="status" className="text-sm text-accent-800">
          {note}
        </p>
      )}
      {problems && (
        <div role="alert" data-testid="import-problems" className="rounded-md border border-red-300 bg-red-50 px-3 py-2 text-sm text-red-900">
          <p className="font-semibold">{problems.file} was not imported:</p>
          <ul className="mt-1 list-disc pl-5">
            {problems.lines.map((l, i) => (
              <li key={i}>{l}</li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

type ReadResult = { ok: true; model: ModelFile } | { ok: false; lines: string[] };

function readCsv(text: string): ReadResult {
  const r = parseGridCsv(text);
  if (r.ok) return r;
  return { ok: false, lines: r.errors.map((e) => [e.line !== null ? `line ${e.line}` : null, e.column].filter(Boolean).join(', ') + (e.line !== null || e.column ? ': ' : '') + e.message) };
}

function readModelJson(text: string): ReadResult {
  const notText = notTextMessage(text, 'a model file (JSON text)');
  if (notText) return { ok: false, lines: [notText] };
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    return { ok: false, lines: [`not valid JSON: ${jsonWhere(text, (err as Error).message)}`] };
  }
  const parsed = parseModelFile(json);
  if (!parsed.ok) return { ok: false, lines: parsed.issues.slice(0, 30).map((i) => `${i.path}: ${i.message}`) };
  return { ok: true, model: parsed.model };
}

/** Turn the engine's "at position N" into a line and column, when the message has only the position. */
function jsonWhere(text: string, message: string): string {
  if (/line \d+ column \d+/.test(message)) return message;
  const m = /position (\d+)/.exec(message);
  if (!m) return message;
  const before = text.slice(0, Number(m[1]));
  const line = before.split('\n').length;
  const column = before.length - before.lastIndexOf('\n');
  return `${message} (line ${line}, column ${column})`;
}
