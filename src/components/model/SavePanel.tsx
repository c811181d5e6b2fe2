/** Saving makes a new immutable version; the comment says what changed and why. */
import { useState, type FormEvent } from 'react';
import { Button } from '../Button';

export interface SavePanelProps {
  defaultName: string;
  basedOnLabel: string | null;
  blocked: string | null;
  busy: boolean;
  saved: { name: string; version: number; warnings: string[] } | null;
  dirty: boolean;
  onSave: (name: string, comment: string) => void;
}

export function SavePanel(p: SavePanelProps) {
  const [name, setName] = useState(p.defaultName);
  const [comment, setComment] = useState('');
  const nameProblem = name.trim() === '' ? 'Give the model a name.' : name.trim().length > 80 ? 'At most 80 characters.' : null;
  function submit(e: FormEvent) {
    e.preventDefault();
    if (nameProblem || p.blocked) return;
    p.onSave(name.trim(), comment.trim());
  }
  return (
    <form onSubmit={submit} noValidate data-testid="save-form" className="space-y-3">
      <label className="flex flex-col gap-1 text-sm font-semibold text-stone-800">
        Model name
        <input
          value={name}
          onChange={(e) => setName(e.target.value)}
          maxLength={80}
          aria-invalid={nameProblem ? true : undefined}
          className="rounded-md border border-stone-300 bg-white px-2 py-1 font-normal text-stone-900"
        />
        {nameProblem && <span className="text-red-800">{nameProblem}</span>}
      </label>
      <label className="flex flex-col gap-1 text-sm font-semibold text-stone-800">
        Comment (optional)
        <textarea
          data-testid="save-comment"
          value={comment}
          onChange={(e) => setComment(e.target.value)}
          maxLength={1000}
          rows={2}
          placeholder="What changed, and why"
          className="rounded-md border border-stone-300 bg-white px-2 py-1 font-normal text-stone-900"
        />
      </label>
      {p.basedOnLabel && <p className="text-sm text-stone-600">Will be recorded as based on {p.basedOnLabel}.</p>}
      {p.blocked && <p className="text-sm font-semibold text-red-800">{p.blocked}</p>}
      <Button type="submit" data-testid="save-model" disabled={Boolean(p.blocked) || Boolean(nameProblem)} busy={p.busy} busyLabel="Saving…">
        Save as a new version
      </Button>
      {p.saved && !p.dirty && (
        <p role="status" data-testid="save-result" className="rounded-md border border-accent-200 bg-accent-50 px-3 py-2 text-sm text-accent-900">
          Saved as “{p.saved.name}” version {p.saved.version}.{p.saved.warnings.length > 0 && ` The server noted: ${p.saved.warnings.join(' ')}`}
        </p>
      )}
    </form>
  );
}
