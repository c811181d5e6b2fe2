import { Link } from 'react-router';
import { useDeleteRecord } from '../../api/records';
import { errorMessage } from '../../api/errors';
import type { RecordSummaryView } from '../../../shared/schemas/records';
import { ConfirmButton } from '../ConfirmButton';
import { Button } from '../Button';
import { DataTable, Td, Th, Tr } from '../Table';

const RECEIVERS_FROM = { header: 'from the file', stations: 'stations by channel', none: 'not placed' } as const;

/** The line's records, newest first: the shot each one is, what it holds, and whether a pick set was saved from it. */
export function RecordList({ lineId, records, canEdit, onEditShot }: { lineId: string; records: RecordSummaryView[]; canEdit: boolean; onEditShot: (r: RecordSummaryView) => void }) {
  const remove = useDeleteRecord(lineId);
  return (
    <>
      {remove.error && (
        <p role="alert" className="mb-2 text-sm font-semibold text-red-800">
          {errorMessage(remove.error)}
        </p>
      )}
      <DataTable caption="Shot records on this line" testId="record-table" minWidth="56rem">
        <thead>
          <tr>
            <Th>Shot</Th>
            <Th numeric>Shot x (m)</Th>
            <Th numeric>Channels</Th>
            <Th numeric>Interval (ms)</Th>
            <Th numeric>Length (ms)</Th>
            <Th>Recorded</Th>
            <Th>Receivers</Th>
            <Th>File</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {records.map((r) => (
            <Tr key={r.id} testId="record-row">
              <Td className="font-semibold">{r.shotId}</Td>
              <Td numeric>{r.source ? r.source.x : <span className="font-semibold text-amber-800">not set</span>}</Td>
              <Td numeric>{r.channels}</Td>
              <Td numeric>{+r.sampleIntervalMs.toFixed(4)}</Td>
              <Td numeric>{Math.round(r.recordLengthMs)}</Td>
              <Td>{r.acquired ? r.acquired.replace('T', ' ').slice(0, 16) : '—'}</Td>
              <Td>{RECEIVERS_FROM[r.receiversFrom]}</Td>
              <Td className="break-all text-sm">
                {r.fileName}
                <span className="block text-stone-500">
                  {r.format === 'seg2' ? 'SEG-2' : 'SEG-Y'} rev {r.revision}
                </span>
              </Td>
              <Td>
                <div className="flex flex-wrap gap-2">
                  <Link className="font-semibold" to={`/lines/${lineId}/picking?record=${r.id}`} data-testid="record-open">
                    View
                  </Link>
                  {canEdit && (
                    <Button size="sm" variant="quiet" onClick={() => onEditShot(r)} data-testid="record-edit-shot">
                      Shot…
                    </Button>
                  )}
                  {canEdit && (
                    <ConfirmButton
                      label="Delete"
                      confirmLabel="Delete the record"
                      variant="danger"
                      disabled={r.pickSetIds.length > 0}
                      ariaLabel={`Delete ${r.fileName}`}
                      warning={r.pickSetIds.length > 0 ? 'A pick set was saved from this record; it stays.' : `${r.fileName} is removed from the line for good; upload it again to get it back.`}
                      busy={remove.isPending && remove.variables === r.id}
                      onConfirm={(done) => remove.mutate(r.id, { onSettled: done })}
                      testId="record-delete"
                    />
                  )}
                </div>
                {r.pickSetIds.length > 0 && <p className="mt-1 text-sm text-stone-600">kept: a pick set was saved from it</p>}
              </Td>
            </Tr>
          ))}
        </tbody>
      </DataTable>
    </>
  );
}
