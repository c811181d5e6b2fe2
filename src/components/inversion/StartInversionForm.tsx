import { useMemo, useState, type FormEvent, type ReactNode } from 'react';
import { useNavigate } from 'react-router';
import { ApiError, errorMessage } from '../../api/errors';
import { useStartInversion } from '../../api/inversions';
import { usePickSet } from '../../api/picksets';
import { pickSetsInUse, type LineDetail, type ModelVersionSummary } from '../../api/types';
import { MAX_INVERSION_ITERATIONS } from '../../../shared/schemas/inversions';
import { canRunInversions } from '../../lib/permissions';
import { Button } from '../Button';
import { SelectField, TextField } from '../Field';
import { defaultInversionSpacing, gridSizeWords, inversionGrid } from './defaultGrid';
import { checkForm, initialFormState, serverFieldErrors, type FormField, type FormFieldErrors, type InversionFormState } from './inversionForm';
import { plural } from '../../lib/format';

const ADVANCED: FormField[] = ['settings.maxIterations', 'settings.smoothing', 'settings.verticalWeight', 'settings.damping', 'settings.vMin', 'settings.vMax', 'settings.order', 'settings.checkerSize'];

function Radio({ name, checked, onChange, children, testId }: { name: string; checked: boolean; onChange: () => void; children: ReactNode; testId?: string }) {
  return (
    <label className="flex items-center gap-2">
      <input type="radio" name={name} checked={checked} onChange={onChange} className="accent-accent-700" data-testid={testId} />
      {children}
    </label>
  );
}

/**
 * Start an inversion of one pick set revision: from the automatic 1-D gradient on a grid made for
 * the line, or from a saved model version (its grid and surface). The advanced settings are folded
 * away with their defaults filled in. The body is checked with the server's own schema before it is
 * sent; the server's refusals land on the same inputs.
 */
export function StartInversionForm({ line }: { line: Pick<LineDetail, 'id' | 'myRole' | 'pickSets' | 'models' | 'stations'> }) {
  const navigate = useNavigate();
  const start = useStartInversion(line.id);
  const models = line.models as ModelVersionSummary[];
  const [form, setForm] = useState<InversionFormState>(() => initialFormState(pickSetsInUse(line.pickSets)[0]?.id ?? '', models[0]?.id ?? ''));
  const [attempted, setAttempted] = useState(false);
  const [advancedOpen, setAdvancedOpen] = useState(false);
  const pickSet = usePickSet(form.pickSetId || null, null);

  const detail = pickSet.data && pickSet.data.id === form.pickSetId ? pickSet.data : undefined;
  const geometry = useMemo(() => ({ stations: line.stations, shotXs: detail?.shots.map((s) => s.sourceX) ?? [] }), [line.stations, detail]);
  const defaultSpacing = useMemo(() => defaultInversionSpacing(geometry), [geometry]);

  if (!canRunInversions(line.myRole)) {
    return <p className="text-stone-600">Geophysicists start inversions; you can open and compare the inversions listed here.</p>;
  }
  if (pickSetsInUse(line.pickSets).length === 0) {
    return (
      <p data-testid="start-inversion-missing" className="text-stone-700">
        An inversion needs an uploaded pick set on this line first.
      </p>
    );
  }

  const check = checkForm(form);
  const clientErrors: FormFieldErrors = attempted && !check.ok ? check.errors : {};
  const server = start.error instanceof ApiError ? serverFieldErrors(start.error.issues) : { fields: {}, other: [] };
  const errors: FormFieldErrors = { ...server.fields, ...clientErrors };
  const advancedError = ADVANCED.some((f) => errors[f]);

  const set = <K extends keyof InversionFormState>(key: K, value: InversionFormState[K]) => {
    setForm((f) => ({ ...f, [key]: value }));
    start.reset();
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setAttempted(true);
    const result = checkForm(form);
    if (!result.ok) {
      if (ADVANCED.some((f) => result.errors[f])) setAdvancedOpen(true);
      return;
    }
    start.mutate(result.body, {
      onSuccess: (inv) => navigate(`/lines/${line.id}/inversions/${inv.id}`),
      onError: (err) => {
        if (err instanceof ApiError && ADVANCED.some((f) => serverFieldErrors(err.issues).fields[f])) setAdvancedOpen(true);
      },
    });
  };

  // What grid the inversion will get, so the node count is seen before starting.
  const typedSpacing = Number(form.spacing.replace(',', '.'));
  const spacing = form.spacing.trim() !== '' && typedSpacing > 0 ? typedSpacing : defaultSpacing;
  const gridWords = gridSizeWords(inversionGrid(geometry, spacing));
  const chosenModel = models.find((m) => m.id === form.modelId);
  const revisions = detail ? [...detail.revisions].reverse() : [];
  const anyError = Object.values(errors).some(Boolean) || server.other.length > 0;

  return (
    <form onSubmit={submit} data-testid="start-inversion-form" className="flex flex-col gap-5" noValidate>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <SelectField label="Pick set" name="pickSetId" value={form.pickSetId} error={errors.pickSetId} onChange={(e) => (set('pickSetId', e.target.value), set('revision', ''))} data-testid="inversion-pickset">
          {pickSetsInUse(line.pickSets).map((p) => (
            <option key={p.id} value={p.id}>
              {p.fileName} · {plural(p.shots, 'shot')}, {plural(p.picks, 'pick')}
            </option>
          ))}
        </SelectField>
        <SelectField label="Revision" name="pickSetRevision" value={form.revision} error={errors.pickSetRevision} onChange={(e) => set('revision', e.target.value)} data-testid="inversion-revision" hint="Excluded picks stay out of the inversion.">
          <option value="">Latest{detail ? ` (revision ${detail.revision.number})` : ''}</option>
          {revisions.map((r) => (
            <option key={r.number} value={String(r.number)}>
              {r.number === 0 ? 'Revision 0, as uploaded' : `Revision ${r.number}`} · {r.excluded} excluded
            </option>
          ))}
        </SelectField>
      </div>

      <fieldset className="flex flex-col gap-2">
        <legend className="font-semibold text-stone-800">Starting model</legend>
        <Radio name={`start-${line.id}`} checked={form.startKind === 'gradient'} onChange={() => set('startKind', 'gradient')} testId="start-gradient">
          Automatic: a velocity increasing with depth, fitted to the travel-time curves
        </Radio>
        {form.startKind === 'gradient' && (
          <div className="ml-6 max-w-md">
            <TextField
              label="Cell size (m)"
              name="spacing"
              inputMode="decimal"
              value={form.spacing}
              placeholder={String(defaultSpacing)}
              error={errors['start.spacing']}
              onChange={(e) => set('spacing', e.target.value)}
              data-testid="inversion-spacing"
              hint={
                <span data-testid="inversion-grid-size">
                  {form.spacing.trim() === '' ? `Default ${defaultSpacing} m, from half the median station spacing. ` : ''}
                  {/* The grid reaches the shots, so it is known once the pick set's shots are. */}
                  {detail ? `Grid ${gridWords.text}${gridWords.tooLarge ? ' — past the limit; choose a larger cell.' : '.'}` : 'Working out the grid from the shots…'}
                </span>
              }
            />
          </div>
        )}
        <Radio name={`start-${line.id}`} checked={form.startKind === 'model'} onChange={() => set('startKind', 'model')} testId="start-model">
          A saved model version of this line (its grid and ground surface are used)
        </Radio>
        {form.startKind === 'model' && (
          <div className="ml-6 max-w-xl">
            {models.length === 0 ? (
              <p className="text-stone-700">This line has no saved model version yet.</p>
            ) : (
              <SelectField label="Model version" name="modelId" value={form.modelId} error={errors['start.modelId']} onChange={(e) => set('modelId', e.target.value)} data-testid="inversion-model" hint={chosenModel ? `Grid ${chosenModel.nx} × ${chosenModel.nz} nodes.` : undefined}>
                {models.map((m) => (
                  <option key={m.id} value={m.id}>
                    {m.name} · version {m.version}
                    {m.comment ? ` – ${m.comment}` : ''}
                  </option>
                ))}
              </SelectField>
            )}
          </div>
        )}
      </fieldset>

      <div className="max-w-md">
        <TextField label="Label (optional)" name="label" value={form.label} error={errors.label} maxLength={200} onChange={(e) => set('label', e.target.value)} data-testid="inversion-label" hint="A few words to tell this inversion from the others, e.g. “finer grid, stronger smoothing”." />
      </div>

      <details open={advancedOpen || advancedError} onToggle={(e) => setAdvancedOpen(e.currentTarget.open)} className="rounded-lg border border-stone-200 bg-stone-50 px-4 py-3" data-testid="inversion-advanced">
        <summary className="cursor-pointer font-semibold text-stone-800">Advanced settings</summary>
        <div className="mt-3 grid grid-cols-1 gap-4 md:grid-cols-3">
          <TextField label="Iteration cap" name="maxIterations" inputMode="numeric" value={form.maxIterations} error={errors['settings.maxIterations']} onChange={(e) => set('maxIterations', e.target.value)} hint={`1 to ${MAX_INVERSION_ITERATIONS}; it stops earlier once χ² is near 1 or stops falling.`} data-testid="inversion-iterations" />
          <fieldset className="flex flex-col gap-1">
            <legend className="font-semibold text-stone-800">Smoothing weight</legend>
            <Radio name={`smoothing-${line.id}`} checked={form.smoothingMode === 'auto'} onChange={() => set('smoothingMode', 'auto')}>
              Automatic, lowered towards χ² = 1
            </Radio>
            <Radio name={`smoothing-${line.id}`} checked={form.smoothingMode === 'fixed'} onChange={() => set('smoothingMode', 'fixed')} testId="smoothing-fixed">
              Fixed
            </Radio>
            {form.smoothingMode === 'fixed' && (
              <TextField label="Weight" name="smoothing" inputMode="decimal" value={form.smoothing} error={errors['settings.smoothing']} onChange={(e) => set('smoothing', e.target.value)} data-testid="inversion-smoothing" />
            )}
          </fieldset>
          <TextField label="Vertical smoothing, share of horizontal" name="verticalWeight" inputMode="decimal" value={form.verticalWeight} error={errors['settings.verticalWeight']} onChange={(e) => set('verticalWeight', e.target.value)} hint="Below 1 lets velocity change faster with depth than along the line." data-testid="inversion-vertical-weight" />
          <TextField label="Damping towards the starting model" name="damping" inputMode="decimal" value={form.damping} error={errors['settings.damping']} onChange={(e) => set('damping', e.target.value)} data-testid="inversion-damping" />
          <TextField label="Lowest velocity (m/s)" name="vMin" inputMode="decimal" value={form.vMin} error={errors['settings.vMin']} onChange={(e) => set('vMin', e.target.value)} data-testid="inversion-vmin" />
          <TextField label="Highest velocity (m/s)" name="vMax" inputMode="decimal" value={form.vMax} error={errors['settings.vMax']} onChange={(e) => set('vMax', e.target.value)} data-testid="inversion-vmax" />
          <SelectField label="Eikonal scheme" name="order" value={form.order} error={errors['settings.order']} onChange={(e) => set('order', e.target.value as '1' | '2')} data-testid="inversion-order">
            <option value="2">Second order (usual)</option>
            <option value="1">First order (rougher)</option>
          </SelectField>
          <fieldset className="flex flex-col gap-1 md:col-span-2">
            <legend className="font-semibold text-stone-800">Resolution check</legend>
            <label className="flex items-center gap-2">
              <input type="checkbox" checked={form.checkerboard} onChange={(e) => set('checkerboard', e.target.checked)} className="accent-accent-700" data-testid="inversion-checkerboard" />
              Run a checkerboard test afterwards (about doubles the time)
            </label>
            {form.checkerboard && (
              <div className="ml-6 flex flex-wrap items-end gap-4">
                <Radio name={`checker-${line.id}`} checked={form.checkerSizeMode === 'auto'} onChange={() => set('checkerSizeMode', 'auto')}>
                  Squares sized automatically
                </Radio>
                <Radio name={`checker-${line.id}`} checked={form.checkerSizeMode === 'fixed'} onChange={() => set('checkerSizeMode', 'fixed')} testId="checker-fixed">
                  Squares of
                </Radio>
                {form.checkerSizeMode === 'fixed' && (
                  <div className="w-32">
                    <TextField label="Square size (m)" name="checkerSize" inputMode="decimal" value={form.checkerSize} error={errors['settings.checkerSize']} onChange={(e) => set('checkerSize', e.target.value)} data-testid="inversion-checker-size" />
                  </div>
                )}
              </div>
            )}
          </fieldset>
        </div>
      </details>

      {anyError && (
        <div role="alert" data-testid="start-inversion-problem" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
          <p className="font-semibold">{start.isError ? `The inversion was refused: ${errorMessage(start.error)}` : 'Please correct the marked fields.'}</p>
          {server.other.length > 0 && (
            <ul className="mt-1 list-disc pl-5 text-sm">
              {server.other.slice(0, 8).map((m, i) => (
                <li key={i}>{m}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      {start.isError && !anyError && (
        <p role="alert" data-testid="start-inversion-problem" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
          The inversion could not be started: {errorMessage(start.error)}
        </p>
      )}
      <div>
        <Button type="submit" busy={start.isPending} busyLabel="Starting…" data-testid="start-inversion">
          Start inversion
        </Button>
      </div>
    </form>
  );
}
