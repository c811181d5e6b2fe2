import { useState, type FormEvent } from 'react';
import { useChangePassword } from '../../api/auth';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const FIELDS = ['currentPassword', 'newPassword'] as const;
const MIN_PASSWORD = 10; // the API's length rule; it also refuses easily guessed passwords

/** One's own password: the current one, then the new one typed twice. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const [current, setCurrent] = useState('');
  const [next, setNext] = useState('');
  const [again, setAgain] = useState('');
  const [checks, setChecks] = useState<FieldErrors>({});
  const problems = formProblems(change.error, FIELDS);
  const errors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const found: FieldErrors = {
      currentPassword: current ? undefined : 'Enter your current password.',
      newPassword: next.length >= MIN_PASSWORD ? undefined : `The new password needs at least ${MIN_PASSWORD} characters.`,
      again: again === next ? undefined : 'The two new passwords differ.',
    };
    setChecks(found);
    if (hasErrors(found)) return change.reset();
    change.mutate(
      { currentPassword: current, newPassword: next },
      {
        onSuccess: () => {
          setCurrent('');
          setNext('');
          setAgain('');
        },
      },
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="change-password-form" className="grid max-w-md gap-4">
      <FormAlert problems={problems} />
      {change.isSuccess && (
        <p role="status" data-testid="password-changed" className="rounded-md bg-accent-50 px-4 py-2 text-accent-900">
          Password changed. You stay signed in here; everywhere else you will need the new password.
        </p>
      )}
      <TextField label="Current password" name="currentPassword" type="password" autoComplete="current-password" value={current} onChange={(e) => setCurrent(e.target.value)} error={errors.currentPassword} />
      <TextField
        label="New password"
        name="newPassword"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters and hard to guess: a phrase of unrelated words works well; your name or e-mail does not."
        value={next}
        onChange={(e) => setNext(e.target.value)}
        error={errors.newPassword}
      />
      <TextField label="New password again" name="again" type="password" autoComplete="new-password" value={again} onChange={(e) => setAgain(e.target.value)} error={errors.again} />
      <div>
        <Button type="submit" busy={change.isPending} busyLabel="Changing…">
          Change password
        </Button>
      </div>
    </form>
  );
}
