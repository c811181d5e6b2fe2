import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { ApiError, errorMessage, issueField } from '../../api/errors';
import { useStartEnsemble } from '../../api/ensembles';
import { MAX_ENSEMBLE_MEMBERS } from '../../../shared/schemas/ensembles';
import { SPREAD } from '../../../shared/uncertainty/plan';
import { Button } from '../Button';
import { SelectField, TextField } from '../Field';
import { checkEnsembleForm, initialEnsembleForm, type EnsembleFormErrors, type EnsembleFormState } from './ensembleForm';

/**
 * Start an ensemble of this finished inversion: the same picks, grid, start and settings, repeated N
 * times with what is uncertain drawn anew for each member. The body is checked with the server's own
 * schema first; the server's refusals land on the same inputs.
 */
export function StartEnsembleForm({ inversionId, lineId }: { inversionId: string; lineId: string }) {
  const navigate = useNavigate();
  const start = useStartEnsemble(inversionId);
  const [form, setForm] = useState<EnsembleFormState>(initialEnsembleForm);
  const [errors, setErrors] = useState<EnsembleFormErrors>({});
  const set = <K extends keyof EnsembleFormState>(key: K, value: EnsembleFormState[K]) => {
    setForm((f) => ({ ...f, [key]: value }));
    setErrors({});
    start.reset();
  };
  const serverErrors: EnsembleFormErrors = {};
  if (start.error instanceof ApiError) for (const i of start.error.issues) serverErrors[issueField(i) as keyof EnsembleFormErrors] ??= i.message;
  const shown = { ...serverErrors, ...errors };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const check = checkEnsembleForm(form);
    if (!check.ok) return setErrors(check.errors);
    start.mutate(check.body, { onSuccess: (r) => navigate(`/lines/${lineId}/ensembles/${r.id}`) });
  };

  return (
    <form onSubmit={submit} noValidate className="grid max-w-3xl gap-4" data-testid="start-ensemble-form">
      <p className="text-stone-700">
        Each member repeats this inversion with its own draw of what is uncertain, on any worker that is free. The 5–95 % band of the rock depth then shows how much
        the answer moves with those choices — and only with those.
      </p>
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Members" inputMode="numeric" value={form.members} onChange={(e) => set('members', e.target.value)} error={shown.members} hint={`2 to ${MAX_ENSEMBLE_MEMBERS}; 24 is a fair start.`} data-testid="ensemble-members" />
        <TextField label="Rock velocity v* (m/s)" inputMode="decimal" value={form.rockVelocity} onChange={(e) => set('rockVelocity', e.target.value)} error={shown.rockVelocity} hint="Its depth is banded per station." data-testid="ensemble-rock" />
        <TextField
          label="… up to (m/s, optional)"
          inputMode="decimal"
          value={form.rockVelocityMax}
          onChange={(e) => set('rockVelocityMax', e.target.value)}
          error={shown.rockVelocityMax}
          hint="A range: each member draws its own v*, so the band also covers that choice."
          data-testid="ensemble-rock-max"
        />
      </div>
      <fieldset className="grid gap-2">
        <legend className="font-semibold text-stone-800">What varies between members</legend>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={form.varyStart} onChange={(e) => set('varyStart', e.target.checked)} className="accent-accent-700" data-testid="ensemble-vary-start" />
          Starting gradient: v0 within ×/÷ {SPREAD.v0}, its increase with depth within ×/÷ {SPREAD.k} of the fitted one
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={form.varySmoothing} onChange={(e) => set('varySmoothing', e.target.checked)} className="accent-accent-700" data-testid="ensemble-vary-smoothing" />
          Smoothing: the automatic weight schedule started within ×/÷ {SPREAD.smoothing} of its usual first weight
        </label>
        <div className="max-w-md">
          <SelectField label="Picks" value={form.picks} onChange={(e) => set('picks', e.target.value as EnsembleFormState['picks'])} error={shown.vary} data-testid="ensemble-vary-picks">
            <option value="sigma">Each pick moved at random within its own uncertainty</option>
            <option value="bootstrap">Shots resampled with replacement (bootstrap)</option>
            <option value="none">Kept as picked</option>
          </SelectField>
        </div>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Label (optional)" value={form.label} onChange={(e) => set('label', e.target.value)} error={shown.label} maxLength={200} />
        <TextField label="Seed (optional)" inputMode="numeric" value={form.seed} onChange={(e) => set('seed', e.target.value)} error={shown.seed} hint="The same seed repeats the same draws." />
      </div>
      {start.isError && !(start.error instanceof ApiError && start.error.issues.length) && (
        <p role="alert" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
          {errorMessage(start.error)}
        </p>
      )}
      <div>
        <Button type="submit" busy={start.isPending} busyLabel="Starting…" data-testid="start-ensemble">
          Start ensemble
        </Button>
      </div>
    </form>
  );
}
