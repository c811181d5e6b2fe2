import { Link } from 'react-router';
import { errorMessage } from '../../api/errors';
import { useSaveInversionModel } from '../../api/inversions';
import type { InversionView } from '../../../shared/schemas/inversions';
import { Button } from '../Button';

/**
 * Keep the final section as a new model version of the line (raw velocities, marked as coming from
 * this inversion), so it can be edited, forward-run, compared and reported like any other model.
 */
export function SaveModelPanel({ inversion, canSave }: { inversion: InversionView; canSave: boolean }) {
  const save = useSaveInversionModel(inversion.id, inversion.lineId);
  const savedId = inversion.savedModelId ?? save.data?.id ?? null;
  if (savedId) {
    return (
      <p data-testid="inversion-saved-model" className="rounded-lg border border-emerald-300 bg-emerald-50 px-5 py-3 text-emerald-950">
        Saved as a model version of this line{save.data ? ` (version ${save.data.version})` : ''}.{' '}
        <Link to={`/models/${savedId}`} data-testid="inversion-model-link" className="font-semibold">
          Open the model
        </Link>{' '}
        to edit it or start a forward run from it.
      </p>
    );
  }
  if (!canSave) return <p className="text-stone-600">A geophysicist can save this section as a model version of the line.</p>;
  return (
    <div className="flex flex-wrap items-center gap-4">
      <Button onClick={() => save.mutate()} busy={save.isPending} busyLabel="Saving…" data-testid="save-inversion-model">
        Save as model version
      </Button>
      <span className="text-sm text-stone-600">A new version of the line's models with the final velocities; this inversion stays as it is.</span>
      {save.isError && (
        <p role="alert" className="w-full text-sm font-semibold text-red-800">
          The model could not be saved: {errorMessage(save.error)}
        </p>
      )}
    </div>
  );
}
