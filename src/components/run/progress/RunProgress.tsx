import { errorMessage, isApiError } from '../../../api/errors';
import { useCancelRun } from '../../../api/runs';
import type { RunDetail } from '../../../api/types';
import { ConfirmButton } from '../../ConfirmButton';
import { duration, when } from '../format';

/** Shots solved out of the total, live while the run is queued or running, with a cancel button. */
export function RunProgress({ run, canCancel }: { run: RunDetail; canCancel: boolean }) {
  const cancel = useCancelRun(run.id);
  const { done, total } = run.progress;
  const waiting = run.status === 'queued';
  return (
    <section aria-label="Progress" data-testid="run-progress" className="mb-8 rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <p className="font-semibold text-stone-900" aria-live="polite">
        {waiting ? 'Waiting for a solver to pick this run up…' : `Solving: ${done} of ${total} shots done`}
      </p>
      <progress
        className="mt-3 h-3 w-full overflow-hidden rounded-full [&::-webkit-progress-bar]:bg-stone-200 [&::-webkit-progress-value]:bg-accent-700 [&::-moz-progress-bar]:bg-accent-700"
        max={Math.max(1, total)}
        value={waiting ? undefined : done}
        aria-label={`${done} of ${total} shots solved`}
      />
      <p className="mt-2 text-sm text-stone-600">
        Queued {when(run.createdAt)}
        {run.startedAt && <> · started after {duration(run.createdAt, run.startedAt)}</>} · this page updates by itself.
      </p>
      {canCancel && (
        <div className="mt-4 flex flex-wrap items-center gap-4">
          <ConfirmButton
            label="Cancel run"
            confirmLabel="Confirm: cancel run"
            variant="danger"
            warning="Solving stops and the shots solved so far are not kept; the run stays in the list as cancelled."
            busy={cancel.isPending}
            busyLabel="Cancelling…"
            testId="cancel-run"
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
