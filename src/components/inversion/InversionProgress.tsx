import { errorMessage, isApiError } from '../../api/errors';
import { useCancelInversion } from '../../api/inversions';
import type { InversionView } from '../../../shared/schemas/inversions';
import { ConfirmButton } from '../ConfirmButton';
import { duration, when } from '../run/format';
import { ConvergenceChart } from './ConvergenceChart';

/** Iterations done out of the cap, live while the inversion is queued or running, with the convergence so far and a cancel button. */
export function InversionProgress({ inversion, canCancel }: { inversion: InversionView; canCancel: boolean }) {
  const cancel = useCancelInversion(inversion.id);
  const { iteration, maxIterations } = inversion.progress;
  const waiting = inversion.status === 'queued';
  return (
    <section aria-label="Progress" data-testid="inversion-progress" className="mb-8 rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <p className="font-semibold text-stone-900" aria-live="polite">
        {waiting ? 'Waiting for a worker to pick this inversion up…' : iteration === 0 ? 'Solving the starting model…' : `Iteration ${iteration} of at most ${maxIterations} done`}
      </p>
      <progress
        className="mt-3 h-3 w-full overflow-hidden rounded-full [&::-webkit-progress-bar]:bg-stone-200 [&::-webkit-progress-value]:bg-accent-700 [&::-moz-progress-bar]:bg-accent-700"
        max={Math.max(1, maxIterations)}
        value={waiting ? undefined : iteration}
        aria-label={`${iteration} of at most ${maxIterations} iterations`}
      />
      <p className="mt-2 text-sm text-stone-600">
        Queued {when(inversion.createdAt)}
        {inversion.startedAt && <> · started after {duration(inversion.createdAt, inversion.startedAt)}</>} · it may stop before the cap once the fit is good
        enough · this page updates by itself.
      </p>
      {inversion.history.length > 0 && (
        <div className="mt-4">
          <ConvergenceChart history={inversion.history} maxIterations={maxIterations} />
        </div>
      )}
      {canCancel && (
        <div className="mt-4 flex flex-wrap items-center gap-4">
          <ConfirmButton
            label="Cancel inversion"
            confirmLabel="Confirm: cancel inversion"
            variant="danger"
            warning="The inversion stops and cannot be resumed; it stays in the list as cancelled."
            busy={cancel.isPending}
            busyLabel="Cancelling…"
            testId="cancel-inversion"
            onConfirm={(done) => cancel.mutate(undefined, { onSettled: done })}
          />
          {cancel.isError && (
            <p role="alert" className="text-sm font-semibold text-red-800">
              {isApiError(cancel.error, 409) ? `Too late to cancel: ${errorMessage(cancel.error)}` : errorMessage(cancel.error)}
            </p>
          )}
        </div>
      )}
    </section>
  );
}
