import { errorMessage } from '../../../api/errors';
import { useRestoreStations, useStationRevisions } from '../../../api/lines';
import type { Station } from '../../../api/types';
import { formatDate } from '../../../lib/format';
import { ConfirmButton } from '../../ConfirmButton';

/** The station tables that saves replaced, newest first, each of which can be brought back. */
export function StationRevisions({ lineId, current, canRestore, onRestored }: { lineId: string; current: number; canRestore: boolean; onRestored: (stations: Station[]) => void }) {
  const revisions = useStationRevisions(lineId);
  const restore = useRestoreStations(lineId);
  if (!revisions.data?.length) return null;
  return (
    <div data-testid="station-revisions" className="rounded-lg border border-stone-200 bg-white p-4 text-sm">
      <p className="font-semibold text-stone-800">Earlier tables</p>
      <p className="text-stone-600">Every save keeps the table it replaced.</p>
      <ul className="mt-2 flex flex-col gap-2">
        {revisions.data.map((r) => (
          <li key={r.number} data-testid={`station-revision-${r.number}`} className="flex flex-wrap items-center justify-between gap-2 border-t border-stone-100 pt-2">
            <span>
              {r.stations} stations, replaced {formatDate(r.replacedAt)}
              {r.replacedBy ? ` by ${r.replacedBy.name}` : ''}
            </span>
            {canRestore && (
              <ConfirmButton
                label="Restore"
                confirmLabel="Confirm: restore"
                warning={`The ${current} stations on record are replaced by these ${r.stations}; the current table is kept here in turn.`}
                busy={restore.isPending && restore.variables === r.number}
                busyLabel="Restoring…"
                testId={`station-revision-${r.number}-restore`}
                onConfirm={(done) => restore.mutate(r.number, { onSuccess: ({ stations }) => onRestored(stations), onSettled: done })}
              />
            )}
          </li>
        ))}
      </ul>
      {restore.isError && (
        <p role="alert" className="mt-2 font-semibold text-red-800">
          {errorMessage(restore.error)}
        </p>
      )}
    </div>
  );
}
