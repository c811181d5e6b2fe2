import { useState, type FormEvent } from 'react';
import { useUpdateRecord } from '../../api/records';
import { formProblems } from '../../lib/formErrors';
import type { RecordSummaryView } from '../../../shared/schemas/records';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const parseNumber = (text: string): number | null | 'bad' => (text.trim() === '' ? null : Number.isFinite(Number(text)) ? Number(text) : 'bad');

/** Set what a file lacks or has wrong: the shot id the picks will carry, and the shot position on the line. */
export function RecordShotForm({ lineId, record, onDone }: { lineId: string; record: RecordSummaryView; onDone: () => void }) {
  const update = useUpdateRecord(lineId);
  const [shotId, setShotId] = useState(record.shotId);
  const [x, setX] = useState(record.source ? String(record.source.x) : '');
  const [z, setZ] = useState(record.source?.z === null || !record.source ? '' : String(record.source.z));
  const [local, setLocal] = useState<Record<string, string>>({});

  function submit(e: FormEvent) {
    e.preventDefault();
    const px = parseNumber(x), pz = parseNumber(z);
    const problems: Record<string, string> = {};
    if (px === 'bad') problems.x = 'Give the position along the line in metres, e.g. 47.5.';
    if (px === null && pz !== null) problems.x = 'Give the position along the line too, or clear the elevation.';
    if (pz === 'bad') problems.z = 'Give the elevation in metres, or leave it empty for a shot on the ground surface.';
    setLocal(problems);
    if (Object.keys(problems).length) return;
    const source = px === null ? null : { x: px as number, z: pz as number | null };
    update.mutate({ recordId: record.id, body: { shotId, source } }, { onSuccess: onDone });
  }

  const server = formProblems(update.error, ['shotId', 'source']);
  return (
    <form onSubmit={submit} noValidate data-testid="record-shot-form" className="rounded-lg border border-stone-200 bg-white p-4">
      <h3 className="font-semibold text-stone-900">Shot of {record.fileName}</h3>
      <p className="mt-1 text-sm text-stone-600">
        The picks saved from this record carry this shot id and position. {record.sourceFrom === 'header' ? 'The file gives a position; a value here replaces it.' : ''}
      </p>
      <FormAlert problems={server} />
      <div className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-3">
        <TextField label="Shot id" value={shotId} onChange={(e) => setShotId(e.target.value)} error={server.fields.shotId} />
        <TextField label="Shot position x (m)" inputMode="decimal" value={x} onChange={(e) => setX(e.target.value)} error={local.x ?? server.fields.source} data-testid="record-shot-x" />
        <TextField label="Shot elevation z (m)" inputMode="decimal" value={z} onChange={(e) => setZ(e.target.value)} error={local.z} hint="Empty: on the ground surface." />
      </div>
      <div className="mt-3 flex gap-2">
        <Button type="submit" busy={update.isPending} busyLabel="Saving…" data-testid="record-shot-save">
          Save shot
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
