import { useId, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { useStartRun } from '../../api/runs';
import { pickSetsInUse, type LineDetail, type PickSetSummary, type ProjectRole, type RunStarted, type SolverOrder } from '../../api/types';
import { Button } from '../Button';
import { SelectField } from '../Field';
import { RunStartProblem } from './RunStartProblem';
import { plural } from '../../lib/format';

/** Who may start and cancel runs (the server's policy table decides; this only picks the view). */
const RUN_STARTERS: ProjectRole[] = ['geophysicist', 'lead'];
export const canStartRuns = (role: ProjectRole | null | undefined): boolean => role != null && RUN_STARTERS.includes(role);

/** The part of a listed model version the form needs. */
interface ModelChoice {
  id: string;
  name: string;
  version: number;
  comment?: string;
  nx: number;
  nz: number;
}

const modelLabel = (m: ModelChoice) => `${m.name} · version ${m.version} (${m.nx} × ${m.nz} nodes)${m.comment ? ` – ${m.comment}` : ''}`;
const pickSetLabel = (p: PickSetSummary) =>
  `${p.fileName} · revision ${p.revision} · ${plural(p.shots, 'shot')}, ${plural(p.picks, 'pick')}${p.excluded ? `, ${p.excluded} excluded` : ''}`;

interface StartRunFormProps {
  line: Pick<LineDetail, 'id' | 'myRole' | 'pickSets' | 'models'>;
  /** Called with the queued run; by default the browser goes to the run's page to watch it. */
  onStarted?: (run: RunStarted) => void;
}

/**
 * Choose a model version, a pick set and the solver order, then queue a forward run.
 * Refusals (different lines, a shot outside the model, a grid too large) are shown in plain words.
 */
export function StartRunForm({ line, onStarted }: StartRunFormProps) {
  const navigate = useNavigate();
  const start = useStartRun(line.id);
  const models = line.models as ModelChoice[];
  const [modelId, setModelId] = useState(models[0]?.id ?? '');
  const pickSets = pickSetsInUse(line.pickSets);
  const [pickSetId, setPickSetId] = useState(pickSets[0]?.id ?? '');
  const [order, setOrder] = useState<SolverOrder>(2);
  const orderName = useId();

  if (!canStartRuns(line.myRole)) {
    return <p className="text-stone-600">Geophysicists and project leads start runs; you can open and compare the runs listed here.</p>;
  }
  if (models.length === 0 || pickSets.length === 0) {
    return (
      <p data-testid="start-run-missing" className="text-stone-700">
        A run needs {models.length === 0 ? 'a saved model version' : ''}
        {models.length === 0 && pickSets.length === 0 ? ' and ' : ''}
        {pickSets.length === 0 ? 'a pick set in use' : ''} on this line first.
      </p>
    );
  }

  const submit = (e: FormEvent) => {
    e.preventDefault();
    start.mutate(
      { modelId, pickSetId, order },
      { onSuccess: (run) => (onStarted ? onStarted(run) : navigate(`/runs/${run.id}`)) },
    );
  };

  return (
    <form onSubmit={submit} data-testid="start-run-form" className="flex flex-col gap-4" noValidate>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <SelectField label="Model version" value={modelId} onChange={(e) => (setModelId(e.target.value), start.reset())} name="modelId">
          {models.map((m) => (
            <option key={m.id} value={m.id}>
              {modelLabel(m)}
            </option>
          ))}
        </SelectField>
        <SelectField label="Pick set" value={pickSetId} onChange={(e) => (setPickSetId(e.target.value), start.reset())} name="pickSetId" hint="Its latest revision is used; excluded picks stay out of the statistics.">
          {pickSets.map((p) => (
            <option key={p.id} value={p.id}>
              {pickSetLabel(p)}
            </option>
          ))}
        </SelectField>
      </div>
      <fieldset>
        <legend className="font-semibold text-stone-800">Solver order</legend>
        <div className="mt-1 flex flex-wrap gap-x-6 gap-y-1">
          {([2, 1] as const).map((o) => (
            <label key={o} className="flex items-center gap-2">
              <input type="radio" name={orderName} value={o} checked={order === o} onChange={() => (setOrder(o), start.reset())} className="accent-accent-700" />
              {o === 2 ? 'Second order (more accurate; the usual choice)' : 'First order (rougher; for checking a result)'}
            </label>
          ))}
        </div>
      </fieldset>
      {start.isError && <RunStartProblem error={start.error} />}
      <div>
        <Button type="submit" busy={start.isPending} busyLabel="Starting…" data-testid="start-run">
          Start run
        </Button>
      </div>
    </form>
  );
}
