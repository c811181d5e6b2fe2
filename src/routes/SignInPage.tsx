import { useRef, useState, type FormEvent } from 'react';
import { Navigate, useLocation, useNavigate } from 'react-router';
import { useMe, useSignIn } from '../api/auth';
import { isApiError } from '../api/errors';
import { Button } from '../components/Button';
import { SignedOutShell } from '../components/SignedOutShell';
import { TextField } from '../components/Field';
import { FormAlert } from '../components/FormAlert';
import { Loading } from '../components/LoadState';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../lib/formErrors';

const FIELDS = ['email', 'password'] as const;

/** Only same-site paths are followed after sign-in, never another origin. */
function safeReturnPath(state: unknown): string {
  const from = (state as { from?: unknown } | null)?.from;
  if (typeof from !== 'string' || !from.startsWith('/') || from.startsWith('//') || from.startsWith('/signin')) return '/';
  return from;
}

export function SignInPage() {
  const me = useMe();
  const location = useLocation();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [checks, setChecks] = useState<FieldErrors>({});
  const emailRef = useRef<HTMLInputElement>(null);
  const passwordRef = useRef<HTMLInputElement>(null);
  const returnTo = safeReturnPath(location.state);

  if (me.isPending) return <Loading what="Timefield" />;
  if (me.data && !signIn.isPending) return <Navigate to={returnTo} replace />;

  const problems = formProblems(signIn.error, FIELDS);
  if (isApiError(signIn.error, 429)) {
    problems.summary = 'Too many sign-in attempts. Please wait a few minutes before trying again.';
    const detail = signIn.error.message;
    if (detail && !problems.other.includes(detail)) problems.other.unshift(detail);
  }
  const fieldErrors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const found: FieldErrors = {
      email: email.trim() ? undefined : 'Enter your e-mail address.',
      password: password ? undefined : 'Enter your password.',
    };
    setChecks(found);
    if (hasErrors(found)) {
      signIn.reset();
      (found.email ? emailRef : passwordRef).current?.focus();
      return;
    }
    signIn.mutate(
      { email: email.trim(), password },
      {
        onSuccess: () => navigate(returnTo, { replace: true }),
        onError: (err) => {
          if (isApiError(err, 401)) {
            setPassword('');
            passwordRef.current?.focus();
          }
        },
      },
    );
  }

  return (
    <SignedOutShell title="Sign in">
      <p className="mt-1 mb-8 text-stone-600">Seismic refraction modelling for engineering site surveys.</p>
      <form noValidate onSubmit={onSubmit} aria-labelledby="signin-title" className="flex flex-col gap-5 rounded-lg border border-stone-200 bg-white p-6 shadow-xs">
        <h1 id="signin-title" className="text-xl font-semibold text-stone-900">
          Sign in
        </h1>
        <FormAlert problems={problems} testId="signin-error" />
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          autoFocus
          required
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          error={fieldErrors.email}
          inputRef={emailRef}
        />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          error={fieldErrors.password}
          inputRef={passwordRef}
        />
        <Button type="submit" busy={signIn.isPending} busyLabel="Signing in…" data-testid="signin-submit">
          Sign in
        </Button>
      </form>
    </SignedOutShell>
  );
}
