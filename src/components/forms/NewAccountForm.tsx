import { useRef, useState, type FormEvent } from 'react';
import { isApiError } from '../../api/errors';
import { useCreateUser } from '../../api/users';
import type { User } from '../../api/types';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const FIELDS = ['name', 'email', 'password', 'globalRole'] as const;
const MIN_PASSWORD = 10; // the API's rule for account passwords

export function NewAccountForm({ onCreated }: { onCreated: (user: User) => void }) {
  const create = useCreateUser();
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [admin, setAdmin] = useState(false);
  const [checks, setChecks] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);

  const problems = formProblems(create.error, FIELDS);
  // A conflict on this form can only be the e-mail address; point at that input too.
  if (isApiError(create.error, 409) && !problems.fields.email) problems.fields.email = 'Choose another e-mail address; this one is already in use.';
  const errors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const trimmed = email.trim();
    const found: FieldErrors = {
      name: name.trim() ? undefined : 'Enter the person’s full name.',
      email: !trimmed ? 'Enter an e-mail address.' : /^[^\s@]+@[^\s@]+$/.test(trimmed) ? undefined : 'This does not look like an e-mail address.',
      password: password.length >= MIN_PASSWORD ? undefined : `The password needs at least ${MIN_PASSWORD} characters.`,
    };
    setChecks(found);
    if (hasErrors(found)) {
      create.reset();
      // Focus after React has rendered the aria-invalid marks.
      requestAnimationFrame(() => formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus());
      return;
    }
    create.mutate(
      { name: name.trim(), email: trimmed, password, globalRole: admin ? 'admin' : null },
      {
        onSuccess: (user) => {
          setName('');
          setEmail('');
          setPassword('');
          setAdmin(false);
          onCreated(user);
        },
      },
    );
  }

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} data-testid="new-account-form" className="grid grid-cols-1 gap-4 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <FormAlert problems={problems} />
      </div>
      <TextField label="Full name" name="name" autoComplete="off" required value={name} onChange={(e) => setName(e.target.value)} error={errors.name} autoFocus />
      <TextField label="E-mail address" name="email" type="email" autoComplete="off" required value={email} onChange={(e) => setEmail(e.target.value)} error={errors.email} />
      <TextField
        label="Initial password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint={`At least ${MIN_PASSWORD} characters. Pass it on securely; the person can be given a new one later.`}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={errors.password}
      />
      <div className="flex flex-col justify-center gap-1">
        <label className="inline-flex items-center gap-3 font-semibold text-stone-800">
          <input type="checkbox" name="globalRole" checked={admin} onChange={(e) => setAdmin(e.target.checked)} className="size-5 accent-accent-700" aria-describedby="admin-hint" />
          Administrator
        </label>
        <p id="admin-hint" className="text-sm text-stone-600">
          Administrators manage accounts and can see every project.
        </p>
        {errors.globalRole && <p className="text-sm font-semibold text-red-800">{errors.globalRole}</p>}
      </div>
      <div className="sm:col-span-2">
        <Button type="submit" busy={create.isPending} busyLabel="Creating…">
          Create account
        </Button>
      </div>
    </form>
  );
}
