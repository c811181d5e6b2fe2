import { useMemo } from 'react';
import { errorMessage, isApiError } from '../../../api/errors';
import { usePickSet } from '../../../api/picksets';
import { pickSetsInUse, type LineDetail } from '../../../api/types';
import { Button } from '../../Button';
import { EmptyState } from '../../EmptyState';
import { Loading, LoadError } from '../../LoadState';
import { PickSetChecks } from './PickSetChecks';
import { PickSetPicker } from './PickSetPicker';

/** The quality checks of one pick set at one revision; both choices live in the page address. */
export function ChecksTab({
  line,
  pickSetId,
  revision,
  canExclude,
  onChoose,
}: {
  line: LineDetail;
  pickSetId: string | null;
  revision: number | null;
  canExclude: boolean;
  onChoose: (pickSetId: string, revision: number | null) => void;
}) {
  // The newest pick set unless the address names one.
  // Retired sets are offered no more, but an address that names one still opens it.
  const inUse = pickSetsInUse(line.pickSets);
  const chosen = pickSetId && line.pickSets.some((p) => p.id === pickSetId) ? pickSetId : (inUse[0]?.id ?? null);
  const detail = usePickSet(chosen, revision);
  const stationXs = useMemo(() => line.stations.map((s) => s.x), [line.stations]);

  if (!chosen) {
    return (
      <EmptyState title="No pick set to check yet" testId="checks-empty">
        Upload a pick file under “Pick sets”; its checks appear here as soon as it is stored.
      </EmptyState>
    );
  }
  // keepPreviousData shows the last pick set while another loads; never mix one set's picks with another's id.
  const data = detail.data && detail.data.id === chosen && (revision === null || detail.data.revision.number === revision) ? detail.data : undefined;
  return (
    <>
      <PickSetPicker pickSets={line.pickSets.filter((p) => !p.retired || p.id === chosen)} pickSetId={chosen} detail={detail.data} revision={revision} onChange={onChoose} failed={detail.isError} />
      {isApiError(detail.error, 404) && detail.error.code === 'revision_not_found' ? (
        <div role="alert" className="rounded-lg border border-stone-300 bg-white px-5 py-4">
          <p className="font-semibold text-stone-900">Revision {revision} of this pick set does not exist.</p>
          <p className="mt-1 text-stone-700">{errorMessage(detail.error)}</p>
          <Button variant="secondary" size="sm" className="mt-3" onClick={() => onChoose(chosen, null)}>
            Show the latest revision
          </Button>
        </div>
      ) : detail.isError ? (
        <LoadError error={detail.error} what="pick set" onRetry={() => void detail.refetch()} />
      ) : !data ? (
        <Loading what="picks and checks" />
      ) : (
        <PickSetChecks key={data.id} data={data} stationXs={stationXs} canExclude={canExclude} onRevisionSaved={() => onChoose(chosen, null)} />
      )}
    </>
  );
}
