import { useState, type FormEvent, type KeyboardEvent } from 'react';
import type { ReportStep } from '../../api/types';
import { formProblems } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextAreaField } from '../Field';
import { FormAlert } from '../FormAlert';
import { STEP_WORDING } from './wording';

interface StepFormProps {
  step: ReportStep;
  busy: boolean;
  error: unknown;
  /** A sentence shown above the buttons when the step deserves a second thought (e.g. no PDF yet). */
  warning?: string | null;
  onConfirm: (comment: string) => void;
  onCancel: () => void;
}

/**
 * The confirmation of one workflow step, with its comment. Returning a report needs a comment;
 * that is checked here first so the reviewer is not sent round the server for it.
 */
export function StepForm({ step, busy, error, warning, onConfirm, onCancel }: StepFormProps) {
  const words = STEP_WORDING[step];
  const [comment, setComment] = useState('');
  const [missing, setMissing] = useState(false);
  const problems = formProblems(error, ['comment']);
  const commentError = missing ? 'Say what needs changing, so the author knows what to do.' : problems.fields.comment;

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (step === 'return' && !comment.trim()) {
      setMissing(true);
      e.currentTarget.querySelector('textarea')?.focus();
      return;
    }
    onConfirm(comment.trim());
  }

  // Escape backs out of the step without sending anything.
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Escape' && !busy) onCancel();
  };

  return (
    <form noValidate onSubmit={submit} onKeyDown={onKeyDown} data-testid={`step-form-${step}`} className="mt-4 flex flex-col gap-4 rounded-lg border border-stone-300 bg-white p-5 shadow-xs">
      <p className="font-semibold text-stone-900">{words.confirm}</p>
      <FormAlert problems={missing ? { summary: null, fields: {}, other: [] } : problems} testId="step-error" />
      <TextAreaField
        label={step === 'return' ? 'What needs changing' : 'Comment'}
        name="comment"
        hint={words.commentHint}
        value={comment}
        required={step === 'return'}
        maxLength={4000}
        autoFocus
        error={commentError}
        onChange={(e) => {
          setComment(e.target.value);
          if (e.target.value.trim()) setMissing(false);
        }}
      />
      {warning && <p className="rounded-md bg-amber-50 px-3 py-2 text-amber-950">{warning}</p>}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant={step === 'return' ? 'danger' : 'primary'} busy={busy} busyLabel="Sending…" data-testid={`confirm-${step}`}>
          {`Yes, ${words.button.toLowerCase()}`}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
