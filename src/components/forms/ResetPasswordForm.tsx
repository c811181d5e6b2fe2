import { useState, type FormEvent } from 'react';
import { errorMessage } from '../../api/errors';
import { useSendResetLink, useUpdateUser } from '../../api/users';
import type { User } from '../../api/types';
import { formProblems } from '../../lib/formErrors';
import { formatDate } from '../../lib/format';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

/**
 * An administrator gives an account a new password: best by e-mailing its owner a one-time link (the
 * administrator never knows the password), else by setting one to pass on. Either way the server
 * signs that person out everywhere once the new password is set.
 */
export function ResetPasswordForm({ user, onSaved, onCancel }: { user: User; onSaved: () => void; onCancel: () => void }) {
  const update = useUpdateUser();
  const link = useSendResetLink();
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
    <div className="flex flex-col gap-4">
    <div className="flex flex-wrap items-center gap-3" data-testid={`reset-link-${user.email}`}>
      <Button type="button" size="sm" busy={link.isPending} busyLabel="Sending…" onClick={() => link.mutate(user.id)}>
        E-mail {user.name} a link
      </Button>
      <span className="text-sm text-stone-700" role={link.isError ? 'alert' : 'status'}>
        {link.isSuccess
          ? `Sent to ${link.data.sentTo}. The link works once, until ${formatDate(link.data.expiresAt)} ${new Date(link.data.expiresAt).toTimeString().slice(0, 5)}; their current password works until they use it.`
          : link.isError
            ? errorMessage(link.error)
            : 'Recommended: they choose the new password themselves; you never see it.'}
      </span>
    </div>
    <form noValidate onSubmit={onSubmit} data-testid={`reset-password-${user.email}`} className="flex flex-wrap items-end gap-3">
      <div className="w-full">
        <FormAlert problems={problems} />
      </div>
      <TextField
        label={`Or set a password for ${user.name}`}
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
    </div>
  );
}
