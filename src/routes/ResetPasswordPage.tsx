import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { useFinishPasswordReset } from '../api/users';
import { Button } from '../components/Button';
import { SignedOutShell } from '../components/SignedOutShell';
import { TextField } from '../components/Field';
import { FormAlert } from '../components/FormAlert';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../lib/formErrors';

/** The token of a one-time link, from the address's fragment (kept out of server logs on purpose). */
const tokenFromHash = (): string => new URLSearchParams(window.location.hash.slice(1)).get('token') ?? '';

/** Where the one-time link an administrator sent lands: choose a new password, then sign in with it. */
export function ResetPasswordPage() {
  const [token] = useState(tokenFromHash);
  const finish = useFinishPasswordReset();
  const [password, setPassword] = useState('');
  const [again, setAgain] = useState('');
  const [checks, setChecks] = useState<FieldErrors>({});
  const problems = formProblems(finish.error, ['newPassword']);
  const fieldErrors = mergeFieldErrors({ newPassword: problems.fields.newPassword }, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const found: FieldErrors = {
      newPassword: password.length >= 10 ? undefined : 'At least 10 characters.',
      again: again === password ? undefined : 'The two entries differ.',
    };
    setChecks(found);
    if (hasErrors(found)) return finish.reset();
    finish.mutate({ token, newPassword: password });
  }

  return (
    <SignedOutShell title="Set a new password">
      {finish.isSuccess ? (
        <div role="status" data-testid="reset-done" className="mt-8 rounded-lg border border-stone-200 bg-white p-6">
          <h1 className="text-xl font-semibold text-stone-900">Your password is set</h1>
          <p className="mt-2 text-stone-700">You have been signed out everywhere. Sign in with the new password.</p>
          <Link to="/signin" className="mt-4 inline-block font-semibold">
            Sign in
          </Link>
        </div>
      ) : !token ? (
        <p role="alert" className="mt-8 rounded-lg border border-red-300 bg-red-50 p-4 text-red-900">
          This address holds no reset link. Open the link from the e-mail in full, or ask your administrator for a new one.
        </p>
      ) : (
        <form noValidate onSubmit={onSubmit} aria-labelledby="reset-title" className="mt-8 flex flex-col gap-5 rounded-lg border border-stone-200 bg-white p-6 shadow-xs">
          <h1 id="reset-title" className="text-xl font-semibold text-stone-900">
            Set a new password
          </h1>
          <FormAlert problems={problems} testId="reset-error" />
          <TextField label="New password" name="newPassword" type="password" autoComplete="new-password" hint="At least 10 characters; not your name or e-mail." value={password} onChange={(e) => setPassword(e.target.value)} error={fieldErrors.newPassword} autoFocus />
          <TextField label="New password again" name="again" type="password" autoComplete="new-password" value={again} onChange={(e) => setAgain(e.target.value)} error={fieldErrors.again} />
          <Button type="submit" busy={finish.isPending} busyLabel="Saving…" data-testid="reset-submit">
            Set password
          </Button>
        </form>
      )}
    </SignedOutShell>
  );
}
