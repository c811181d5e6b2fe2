import { useState } from 'react';
import { Link } from 'react-router';
import { useRecords } from '../../api/records';
import type { LineDetail } from '../../api/types';
import type { RecordSummaryView } from '../../../shared/schemas/records';
import { EmptyState } from '../EmptyState';
import { Loading, LoadError } from '../LoadState';
import { RecordList } from './RecordList';
import { RecordShotForm } from './RecordShotForm';
import { RecordUpload } from './RecordUpload';

/** The line's field records: upload, list, set missing shot positions, and the way into picking. */
export function RecordsTab({ line, canEdit }: { line: LineDetail; canEdit: boolean }) {
  const records = useRecords(line.id);
  const [editing, setEditing] = useState<RecordSummaryView | null>(null);
  const missing = records.data?.filter((r) => !r.source).length ?? 0;
  return (
    <div className="flex flex-col gap-5">
      <p className="max-w-prose text-stone-700">
        One file per shot, as the seismograph wrote it. The files are kept whole; picks made on them are saved as a pick set of this line.
      </p>
      {canEdit && <RecordUpload lineId={line.id} />}
      {records.isPending ? (
        <Loading what="records" />
      ) : records.isError ? (
        <LoadError error={records.error} what="records" onRetry={() => void records.refetch()} />
      ) : records.data.length === 0 ? (
        <EmptyState title="No shot records yet">{canEdit ? 'Drop the SEG-2 or SEG-Y files of this line above.' : 'A field technician or geophysicist uploads them.'}</EmptyState>
      ) : (
        <>
          <div className="flex flex-wrap items-center justify-between gap-3">
            <p className="text-stone-700" data-testid="record-count">
              {records.data.length} {records.data.length === 1 ? 'record' : 'records'}
              {missing > 0 && <span className="ml-2 font-semibold text-amber-800">· {missing} without a shot position (set it before saving picks)</span>}
            </p>
            <Link
              to={`/lines/${line.id}/picking`}
              data-testid="open-picking"
              className="rounded-md border border-accent-700 bg-accent-700 px-4 py-2 font-semibold text-white no-underline hover:bg-accent-800"
            >
              {canEdit ? 'Pick first breaks' : 'View the records'}
            </Link>
          </div>
          {editing && <RecordShotForm key={editing.id} lineId={line.id} record={editing} onDone={() => setEditing(null)} />}
          <RecordList lineId={line.id} records={records.data} canEdit={canEdit} onEditShot={setEditing} />
        </>
      )}
    </div>
  );
}
