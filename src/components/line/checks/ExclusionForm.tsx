import { useState, type FormEvent } from 'react';
import { errorMessage } from '../../../api/errors';
import { Button } from '../../Button';
import { TextField } from '../../Field';

/**
 * Exclusions are never edits of the upload: the whole list is saved as a new revision, and the
 * original and every earlier revision stay as they were.
 */
export function ExclusionForm({
  selectedCount,
  selectedExcluded,
  added,
  removed,
  nextRevision,
  saving,
  error,
  onExclude,
  onInclude,
  onClearSelection,
  onDiscard,
  onSave,
}: {
  selectedCount: number;
  /** How many of the selected picks are excluded now (and could be included again). */
  selectedExcluded: number;
  added: number;
  removed: number;
  nextRevision: number;
  saving: boolean;
  error: unknown;
  onExclude: (reason: string) => void;
  onInclude: () => void;
  onClearSelection: () => void;
  onDiscard: () => void;
  onSave: (comment: string) => void;
}) {
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const [comment, setComment] = useState('');
  const pending = added + removed > 0;

  function exclude(e: FormEvent) {
    e.preventDefault();
    if (!reason.trim()) return setReasonError('Say why, for example “noisy trace” or “picked the air wave”.');
    setReasonError(undefined);
    onExclude(reason.trim());
  }

  return (
    <div data-testid="exclusion-form" className="rounded-lg border border-stone-200 bg-white p-5">
      <form noValidate onSubmit={exclude} className="flex flex-wrap items-end gap-3">
        <div className="min-w-64 flex-1">
          <TextField
            label="Reason for excluding"
            hint={selectedCount === 0 ? 'Select picks in the table, on the chart or among the suspect picks first.' : `${selectedCount} pick${selectedCount === 1 ? '' : 's'} selected.`}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            error={reasonError}
            maxLength={500}
            data-testid="exclusion-reason"
          />
        </div>
        <div className="flex flex-wrap gap-2 pb-7">
          <Button type="submit" variant="secondary" disabled={selectedCount === 0} data-testid="exclude-selected">
            Exclude selected
          </Button>
          <Button variant="secondary" disabled={selectedExcluded === 0} onClick={onInclude}>
            Include again
          </Button>
          <Button variant="quiet" disabled={selectedCount === 0} onClick={onClearSelection}>
            Clear selection
          </Button>
        </div>
      </form>
      <form
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          onSave(comment.trim());
        }}
        className="mt-2 flex flex-wrap items-end gap-3 border-t border-stone-200 pt-4"
      >
        <div className="min-w-64 flex-1">
          <TextField label="Comment for the new revision" hint="Optional." value={comment} onChange={(e) => setComment(e.target.value)} maxLength={1000} data-testid="revision-comment" />
        </div>
        <div className="flex flex-wrap items-center gap-2 pb-7">
          <Button type="submit" disabled={!pending} busy={saving} busyLabel="Saving…" data-testid="save-revision">
            Save as revision {nextRevision}
          </Button>
          {pending && (
            <Button variant="quiet" onClick={onDiscard}>
              Discard
            </Button>
          )}
        </div>
      </form>
      <p role="status" className="text-sm text-stone-600">
        {pending ? `Not saved yet: ${added} newly excluded, ${removed} included again.` : 'No unsaved changes.'}
      </p>
      {error ? (
        <p role="alert" className="mt-2 rounded-md border border-red-300 bg-red-50 px-3 py-2 font-semibold text-red-900">
          {errorMessage(error)}
        </p>
      ) : null}
    </div>
  );
}
