import { useReducer } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { useLine } from '../api/lines';
import { useRecords } from '../api/records';
import { pickSetsInUse, type ProjectRole } from '../api/types';
import { LeavePrompt } from '../components/LeavePrompt';
import { EmptyState } from '../components/EmptyState';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { useLeaveGuard } from '../components/model/useLeaveGuard';
import { PickingWorkspace } from '../components/records/PickingWorkspace';
import { emptyPicking, pickingReducer } from '../components/records/pickingState';

const PICKERS: ProjectRole[] = ['geophysicist', 'field_tech'];

/**
 * First-break picking on a line's shot records (?record=<id> chooses the record in view). Picks
 * live on this page until saved as a pick set; leaving with unsaved picks asks first.
 */
export function PickingPage() {
  const { lineId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const line = useLine(lineId);
  const records = useRecords(lineId);
  const [picking, dispatch] = useReducer(pickingReducer, emptyPicking);
  const { blocker } = useLeaveGuard(picking.unsaved > 0, { searchIsView: true });

  if (line.isPending || records.isPending) return <Loading what="records" />;
  if (line.isError) return <LoadError error={line.error} what="survey line" onRetry={() => void line.refetch()} />;
  if (records.isError) return <LoadError error={records.error} what="records" onRetry={() => void records.refetch()} />;

  // Oldest shot first, as the crew recorded them.
  const list = [...records.data].sort((a, b) => (a.acquired ?? a.uploadedAt).localeCompare(b.acquired ?? b.uploadedAt) || a.shotId.localeCompare(b.shotId, undefined, { numeric: true }));
  const requested = params.get('record');
  const record = list.find((r) => r.id === requested) ?? list[0];
  const canPick = line.data.myRole !== null && PICKERS.includes(line.data.myRole);

  return (
    <>
      <title>{`Picking · ${line.data.name} · Timefield`}</title>
      <PageHeader
        title={`First breaks on ${line.data.name}`}
        crumbs={[
          { label: 'Projects', to: '/' },
          { label: line.data.name, to: `/lines/${lineId}?tab=records` },
        ]}
      >
        <p className="max-w-prose text-sm text-stone-600">
          {canPick
            ? 'Auto-pick, then check every trace and correct by hand. Picks stay on this page until you save them as a pick set.'
            : 'The records of this line; picking is for field technicians and geophysicists.'}
        </p>
      </PageHeader>
      <LeavePrompt blocker={blocker} what={`You have ${picking.unsaved} unsaved pick changes. Leave without saving them?`} />
      {record ? (
        <PickingWorkspace
          lineId={lineId}
          records={list}
          record={record}
          onRecord={(id) => setParams({ record: id }, { replace: true })}
          canPick={canPick}
          pickSets={pickSetsInUse(line.data.pickSets)}
          picking={picking}
          dispatch={dispatch}
        />
      ) : (
        <EmptyState title="No shot records on this line">
          Upload them on the line&apos;s <Link to={`/lines/${lineId}?tab=records`}>Records</Link> tab.
        </EmptyState>
      )}
    </>
  );
}
