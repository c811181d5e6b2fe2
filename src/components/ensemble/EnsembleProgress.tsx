import { errorMessage } from '../../api/errors';
import { useCancelEnsemble } from '../../api/ensembles';
import type { EnsembleView } from '../../../shared/schemas/ensembles';
import { ConfirmButton } from '../ConfirmButton';
import { DataTable, Td, Th, Tr } from '../Table';

/** Members done, failed, running and waiting, live; per worker process what it did; cancel for whoever may. */
export function EnsembleProgress({ ensemble, canCancel }: { ensemble: EnsembleView; canCancel: boolean }) {
  const cancel = useCancelEnsemble(ensemble.id);
  const p = ensemble.progress;
  const finished = p.done + p.failed;
  return (
    <section aria-label="Progress" data-testid="ensemble-progress" className="mb-8 rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <p className="font-semibold text-stone-900" aria-live="polite">
        {ensemble.status === 'queued' ? 'Waiting for workers to pick the members up…' : `${finished} of ${ensemble.members} members finished`}
      </p>
      <progress
        className="mt-3 h-3 w-full overflow-hidden rounded-full [&::-webkit-progress-bar]:bg-stone-200 [&::-webkit-progress-value]:bg-accent-700 [&::-moz-progress-bar]:bg-accent-700"
        max={ensemble.members}
        value={finished}
        aria-label={`${finished} of ${ensemble.members} members finished`}
      />
      <p className="mt-2 text-sm text-stone-600" data-testid="ensemble-counts">
        {p.done} done · {p.failed} failed · {p.running} running · {p.queued} waiting — every worker connected to this queue takes members; this page updates by itself.
      </p>
      {ensemble.workers.length > 0 && (
        <div className="mt-4">
          <DataTable caption="Members per worker process" testId="ensemble-workers" minWidth="24rem">
            <thead>
              <tr>
                <Th>Worker process</Th>
                <Th numeric>Done</Th>
                <Th numeric>Running</Th>
                <Th numeric>Failed</Th>
                <Th numeric>Busy (s)</Th>
              </tr>
            </thead>
            <tbody>
              {ensemble.workers.map((w) => (
                <Tr key={w.worker}>
                  <Td className="font-mono text-sm">{w.worker}</Td>
                  <Td numeric>{w.done}</Td>
                  <Td numeric>{w.running}</Td>
                  <Td numeric>{w.failed}</Td>
                  <Td numeric>{w.seconds.toFixed(1)}</Td>
                </Tr>
              ))}
            </tbody>
          </DataTable>
        </div>
      )}
      {canCancel && (
        <div className="mt-4 flex flex-wrap items-center gap-4">
          <ConfirmButton
            label="Cancel ensemble"
            confirmLabel="Confirm: cancel ensemble"
            variant="danger"
            warning="Every member that has not finished stops; the ensemble is not combined and stays in the list as cancelled."
            busy={cancel.isPending}
            busyLabel="Cancelling…"
            onConfirm={(done) => cancel.mutate(undefined, { onSettled: done })}
            testId="cancel-ensemble"
          />
          {cancel.isError && (
            <p role="alert" className="text-red-800">
              {errorMessage(cancel.error)}
            </p>
          )}
        </div>
      )}
    </section>
  );
}
