import { useId, useRef, useState, type DragEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { errorMessage } from '../../api/errors';
import { recordKeys, useUploadRecord } from '../../api/records';
import { MAX_RECORD_UPLOAD_BYTES } from '../../../shared/limits';
import { Button } from '../Button';
import { formatBytes } from '../line/picksets/formatBytes';

type Status = { kind: 'waiting' } | { kind: 'sending'; fraction: number } | { kind: 'checking' } | { kind: 'stored'; shotId: string } | { kind: 'refused'; message: string };
interface Item {
  key: number;
  file: File;
  status: Status;
}

/**
 * Drop a day's shot records at once: each file goes up on its own request, one after another, with
 * its own progress bar. A refused file says why (with the byte offset the reader stopped at) and the
 * rest go on.
 */
export function RecordUpload({ lineId }: { lineId: string }) {
  const upload = useUploadRecord(lineId);
  const queryClient = useQueryClient();
  const [items, setItems] = useState<Item[]>([]);
  const [dragging, setDragging] = useState(false);
  const inputRef = useRef<HTMLInputElement>(null);
  const running = useRef(false);
  const queue = useRef<Item[]>([]);
  const nextKey = useRef(1);
  const id = useId();

  const setStatus = (key: number, status: Status) => setItems((all) => all.map((it) => (it.key === key ? { ...it, status } : it)));

  async function drain() {
    if (running.current) return;
    running.current = true;
    while (queue.current.length) {
      const item = queue.current.shift()!;
      if (item.file.size > MAX_RECORD_UPLOAD_BYTES) {
        setStatus(item.key, { kind: 'refused', message: `${formatBytes(item.file.size)} is more than the ${formatBytes(MAX_RECORD_UPLOAD_BYTES)} a record may have; upload one shot per file.` });
        continue;
      }
      setStatus(item.key, { kind: 'sending', fraction: 0 });
      try {
        const stored = await upload.mutateAsync({
          file: item.file,
          onProgress: (fraction) => setStatus(item.key, fraction >= 1 ? { kind: 'checking' } : { kind: 'sending', fraction }),
        });
        setStatus(item.key, { kind: 'stored', shotId: stored.shotId });
      } catch (err) {
        setStatus(item.key, { kind: 'refused', message: errorMessage(err) });
      }
      await queryClient.invalidateQueries({ queryKey: recordKeys.list(lineId) });
    }
    running.current = false;
  }

  function add(files: FileList | File[]) {
    const added = [...files].map((file) => ({ key: nextKey.current++, file, status: { kind: 'waiting' } as Status }));
    if (!added.length) return;
    queue.current.push(...added);
    setItems((all) => [...all.filter((it) => it.status.kind !== 'stored'), ...added]);
    void drain();
  }

  function onDrop(e: DragEvent) {
    e.preventDefault();
    setDragging(false);
    add(e.dataTransfer.files);
  }

  return (
    <div className="flex flex-col gap-3">
      <div
        data-testid="record-dropzone"
        onDragEnter={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragOver={(e) => e.preventDefault()}
        onDragLeave={(e) => {
          if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setDragging(false);
        }}
        onDrop={onDrop}
        className={`rounded-lg border-2 border-dashed px-6 py-6 text-center transition-colors ${dragging ? 'border-accent-600 bg-accent-50' : 'border-stone-300 bg-white'}`}
      >
        <p className="text-lg font-semibold text-stone-900">Drop shot records here</p>
        <p id={`${id}-hint`} className="mt-1 text-sm text-stone-600">
          SEG-2 or SEG-Y, one shot per file, up to {formatBytes(MAX_RECORD_UPLOAD_BYTES)} each. Choose many at once; they are sent one by one.
        </p>
        <input
          ref={inputRef}
          type="file"
          multiple
          accept=".sg2,.seg2,.dat,.sgy,.segy,application/octet-stream"
          className="hidden"
          tabIndex={-1}
          data-testid="record-file-input"
          onChange={(e) => {
            if (e.target.files) add(e.target.files);
            e.target.value = '';
          }}
        />
        <Button className="mt-3" onClick={() => inputRef.current?.click()} aria-describedby={`${id}-hint`} data-testid="record-choose">
          Choose files…
        </Button>
      </div>
      {items.length > 0 && (
        <ul data-testid="record-upload-list" className="flex flex-col gap-2" aria-live="polite">
          {items.map((it) => (
            <UploadRow key={it.key} item={it} onDismiss={() => setItems((all) => all.filter((x) => x.key !== it.key))} />
          ))}
        </ul>
      )}
    </div>
  );
}

function UploadRow({ item, onDismiss }: { item: Item; onDismiss: () => void }) {
  const s = item.status;
  const text =
    s.kind === 'waiting' ? 'waiting' : s.kind === 'sending' ? `${Math.round(s.fraction * 100)} % sent` : s.kind === 'checking' ? 'reading the headers…' : s.kind === 'stored' ? `stored as shot ${s.shotId}` : s.message;
  const tone = s.kind === 'refused' ? 'border-red-300 bg-red-50' : s.kind === 'stored' ? 'border-accent-200 bg-accent-50' : 'border-stone-200 bg-white';
  return (
    <li data-testid="record-upload-row" data-state={s.kind} className={`rounded-lg border px-4 py-2 ${tone}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-semibold break-all text-stone-900">
          {item.file.name} <span className="font-normal text-stone-600">{formatBytes(item.file.size)}</span>
        </p>
        {(s.kind === 'refused' || s.kind === 'stored') && (
          <Button variant="quiet" size="sm" onClick={onDismiss}>
            Dismiss
          </Button>
        )}
      </div>
      {(s.kind === 'sending' || s.kind === 'checking') && (
        <progress
          className="mt-1 h-2 w-full overflow-hidden rounded-full accent-accent-700 [&::-webkit-progress-bar]:bg-stone-200 [&::-webkit-progress-value]:bg-accent-700"
          max={1}
          value={s.kind === 'sending' ? s.fraction : undefined}
          aria-label={`Upload of ${item.file.name}`}
        />
      )}
      <p className={`text-sm ${s.kind === 'refused' ? 'text-red-800' : 'text-stone-700'}`} data-testid="record-upload-status">
        {s.kind === 'refused' ? `Refused, nothing stored: ${text}` : text}
      </p>
    </li>
  );
}
