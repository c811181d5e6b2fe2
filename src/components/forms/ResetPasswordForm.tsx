import { useState, type FormEvent } from 'react';
import { useUpdateUser } from '../../api/users';
import type { User } from '../../api/types';
import { formProblems } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

/** An administrator gives an account a new password; the server signs that person out everywhere. */
export function ResetPasswordForm({ user, onSaved, onCancel }: { user: User; onSaved: () => void; onCancel: () => void }) {
  const update = useUpdateUser();
  const [password, setPassword] = useState('');
  const [tooShort, setTooShort] = useState(false);
  const problems = formProblems(update.error, ['password']);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    setTooShort(password.length < 10);
    if (password.length < 10) return update.reset();
    update.mutate({ userId: user.id, patch: { password } }, { onSuccess: onSaved });
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid={`reset-password-${user.email}`} className="flex flex-wrap items-end gap-3">
      <div className="w-full">
        <FormAlert problems={problems} />
      </div>
      <TextField
        label={`New password for ${user.name}`}
        name="password"
        type="password"
        autoComplete="new-password"
        hint="They are signed out everywhere. Pass it on securely."
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={tooShort ? 'At least 10 characters.' : problems.fields.password}
        autoFocus
      />
      <Button type="submit" size="sm" busy={update.isPending} busyLabel="Saving…">
        Set password
      </Button>
      <Button type="button" variant="secondary" size="sm" onClick={onCancel}>
        Cancel
      </Button>
    </form>
  );
}
