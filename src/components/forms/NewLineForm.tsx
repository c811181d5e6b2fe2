import { useRef, useState, type FormEvent } from 'react';
import { useCreateLine } from '../../api/lines';
import type { Line } from '../../api/types';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextAreaField, TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const FIELDS = ['name', 'notes'] as const;

export function NewLineForm({ projectId, onCreated }: { projectId: string; onCreated: (line: Line) => void }) {
  const create = useCreateLine(projectId);
  const [name, setName] = useState('');
  const [notes, setNotes] = useState('');
  const [checks, setChecks] = useState<FieldErrors>({});
  const nameRef = useRef<HTMLInputElement>(null);

  const problems = formProblems(create.error, FIELDS);
  const errors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const found: FieldErrors = { name: name.trim() ? undefined : 'Give the line a name, for example “L1” or “North spread”.' };
    setChecks(found);
    if (hasErrors(found)) {
      create.reset();
      nameRef.current?.focus();
      return;
    }
    const body = notes.trim() ? { name: name.trim(), notes: notes.trim() } : { name: name.trim() };
    create.mutate(body, { onSuccess: onCreated });
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="new-line-form" className="flex flex-col gap-4">
      <FormAlert problems={problems} />
      <TextField label="Line name" name="name" required value={name} onChange={(e) => setName(e.target.value)} error={errors.name} inputRef={nameRef} autoFocus />
      <TextAreaField
        label="Notes"
        name="notes"
        hint="Optional: bearing, ground conditions, anything the modeller should know."
        value={notes}
        onChange={(e) => setNotes(e.target.value)}
        error={errors.notes}
      />
      <div>
        <Button type="submit" busy={create.isPending} busyLabel="Creating…">
          Create line
        </Button>
      </div>
    </form>
  );
}
