import { useLineInversions } from '../../api/inversions';
import type { LineDetail } from '../../api/types';
import { canRunInversions } from '../../lib/permissions';
import { Loading, LoadError } from '../LoadState';
import { Section } from '../Section';
import { LineInversionsTable } from './LineInversionsTable';
import { StartInversionForm } from './StartInversionForm';

/** The line's inversions: start one (geophysicists), and the list with status and final fit. */
export function LineInversionsPanel({ line }: { line: LineDetail }) {
  const list = useLineInversions(line.id);
  return (
    <>
      {canRunInversions(line.myRole) && (
        <Section title="Start an inversion" description="Find a velocity section from the picks: travel-time tomography, run on a worker.">
          <div className="rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
            <StartInversionForm line={line} />
          </div>
        </Section>
      )}
      <Section title="Inversions">
        {list.isPending && <Loading what="inversions" />}
        {list.isError && <LoadError error={list.error} what="inversions" onRetry={() => void list.refetch()} />}
        {list.data && <LineInversionsTable lineId={line.id} inversions={list.data} />}
      </Section>
    </>
  );
}
