import { useState, type FormEvent } from 'react';
import { VELOCITY_CSS_STOPS, velocityRangeProblem } from '../../../shared/colour/velocity-scale';
import { useUpdateProject } from '../../api/projects';
import type { ProjectSummary } from '../../api/types';
import { formProblems, mergeFieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const GRADIENT = `linear-gradient(to right, ${VELOCITY_CSS_STOPS.map(([t, c]) => `${c} ${t * 100}%`).join(', ')})`;

/** The project's velocity colour range: every section of the project, on the pages and in reports made from now on, is coloured on it. */
export function ProjectColoursForm({ project, canEdit }: { project: ProjectSummary; canEdit: boolean }) {
  const update = useUpdateProject(project.id);
  const [min, setMin] = useState(String(project.velocityColours.min));
  const [max, setMax] = useState(String(project.velocityColours.max));
  const [check, setCheck] = useState<string | undefined>();
  const [saved, setSaved] = useState(false);
  const problems = formProblems(update.error, ['velocityColours']);
  const errors = mergeFieldErrors(problems.fields, { velocityColours: check });

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    setSaved(false);
    const range = { min: min.trim() === '' ? Number.NaN : Number(min), max: max.trim() === '' ? Number.NaN : Number(max) };
    const problem = velocityRangeProblem(range) ?? undefined;
    setCheck(problem);
    if (problem) return update.reset();
    update.mutate({ velocityColours: range }, { onSuccess: () => setSaved(true) });
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="project-colours-form" className="flex flex-col gap-3">
      <FormAlert problems={problems} />
      <div aria-hidden="true">
        <div className="h-4 w-full max-w-md rounded-sm border border-stone-300" style={{ background: GRADIENT }} />
        <div className="flex w-full max-w-md justify-between text-sm tabular-nums text-stone-700">
          <span>{project.velocityColours.min} m/s</span>
          <span>{project.velocityColours.max} m/s</span>
        </div>
      </div>
      {canEdit ? (
        <>
          <div className="flex flex-wrap items-start gap-4">
            <div className="w-40">
              <TextField label="Slow end (m/s)" name="velocityColoursMin" type="number" step={50} value={min} onChange={(e) => setMin(e.target.value)} data-testid="colours-min" />
            </div>
            <div className="w-40">
              <TextField label="Fast end (m/s)" name="velocityColoursMax" type="number" step={50} value={max} onChange={(e) => setMax(e.target.value)} data-testid="colours-max" />
            </div>
          </div>
          {errors.velocityColours && (
            <p role="alert" className="text-sm font-semibold text-red-800" data-testid="colours-error">
              {errors.velocityColours}
            </p>
          )}
          <div className="flex items-center gap-3">
            <Button type="submit" busy={update.isPending} busyLabel="Saving…" data-testid="colours-save">
              Save colour range
            </Button>
            {saved && !update.isPending && (
              <span role="status" className="text-sm text-stone-700" data-testid="colours-saved">
                Saved. Sections and new reports use it; reports already made keep theirs.
              </span>
            )}
          </div>
        </>
      ) : (
        <p className="text-sm text-stone-600">The project lead sets this range.</p>
      )}
    </form>
  );
}
