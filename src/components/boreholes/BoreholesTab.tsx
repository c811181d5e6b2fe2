import { useState } from 'react';
import { useBoreholes, useDeleteBorehole } from '../../api/boreholes';
import { errorMessage } from '../../api/errors';
import type { LineDetail } from '../../api/types';
import type { BoreholeView } from '../../../shared/schemas/boreholes';
import { Button } from '../Button';
import { ConfirmButton } from '../ConfirmButton';
import { EmptyState } from '../EmptyState';
import { Loading, LoadError } from '../LoadState';
import { DataTable, Td, Th, Tr } from '../Table';
import { BoreholeForm } from './BoreholeForm';
import { BoreholeUpload } from './BoreholeUpload';

const KIND = { borehole: 'Borehole', trial_pit: 'Trial pit' } as const;

/** The line's boreholes and trial pits: the logged contacts that calibrate every interpretation of the line. */
export function BoreholesTab({ line, canEdit }: { line: LineDetail; canEdit: boolean }) {
  const holes = useBoreholes(line.id);
  const remove = useDeleteBorehole(line.id);
  const [editing, setEditing] = useState<BoreholeView | 'new' | null>(null);
  return (
    <div className="flex flex-col gap-4">
      <p className="max-w-prose text-stone-700">
        Holes and pits logged on this line, with the depth where each material begins. Sections show them, and the interpreted top of rock is compared with the contacts marked as top of rock.
      </p>
      {canEdit && (
        <div className="flex flex-col gap-3">
          {editing === null && (
            <Button className="self-start" onClick={() => setEditing('new')} data-testid="borehole-add">
              Add a hole by hand
            </Button>
          )}
          {editing !== null && <BoreholeForm key={editing === 'new' ? 'new' : editing.id} lineId={line.id} hole={editing === 'new' ? null : editing} onDone={() => setEditing(null)} />}
          <BoreholeUpload lineId={line.id} />
        </div>
      )}
      {remove.error && (
        <p role="alert" className="text-sm font-semibold text-red-800">
          {errorMessage(remove.error)}
        </p>
      )}
      {holes.isPending ? (
        <Loading what="boreholes" />
      ) : holes.isError ? (
        <LoadError error={holes.error} what="boreholes" onRetry={() => void holes.refetch()} />
      ) : holes.data.length === 0 ? (
        <EmptyState title="No boreholes or trial pits yet">Without them an interpretation cannot be calibrated; add the logs you have.</EmptyState>
      ) : (
        <DataTable caption="Boreholes and trial pits on this line" testId="borehole-table" minWidth="48rem">
          <thead>
            <tr>
              <Th>Hole</Th>
              <Th numeric>x (m)</Th>
              <Th numeric>Ground (m)</Th>
              <Th numeric>Water (m)</Th>
              <Th>Contacts (depth below ground, m)</Th>
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {holes.data.map((h) => (
              <Tr key={h.id} testId="borehole-row">
                <Td>
                  <span className="font-semibold">{h.name}</span>
                  <span className="block text-sm text-stone-600">{KIND[h.kind]}</span>
                </Td>
                <Td numeric>{h.x}</Td>
                <Td numeric>
                  {h.groundZResolved === null ? '—' : +h.groundZResolved.toFixed(2)}
                  {h.groundZ === null && h.groundZResolved !== null && <span className="block text-sm text-stone-500">from stations</span>}
                </Td>
                <Td numeric>{h.waterDepth ?? '—'}</Td>
                <Td>
                  <ul className="text-sm">
                    {h.contacts.map((c, i) => (
                      <li key={i}>
                        <span className="tabular-nums">{c.depth}</span> {c.material}
                        {c.rockTop && <span className="ml-1 rounded bg-accent-50 px-1 font-semibold text-accent-800">top of rock</span>}
                      </li>
                    ))}
                  </ul>
                </Td>
                <Td>
                  {canEdit && (
                    <div className="flex flex-wrap gap-2">
                      <Button size="sm" variant="quiet" onClick={() => setEditing(h)} data-testid="borehole-edit">
                        Edit
                      </Button>
                      <ConfirmButton
                        label="Delete"
                        confirmLabel={`Delete ${h.name}`}
                        variant="danger"
                        warning={`${h.name} and its ${h.contacts.length} logged contacts are removed from the line.`}
                        busy={remove.isPending && remove.variables === h.id}
                        onConfirm={(done) => remove.mutate(h.id, { onSettled: done })}
                        testId="borehole-delete"
                      />
                    </div>
                  )}
                </Td>
              </Tr>
            ))}
          </tbody>
        </DataTable>
      )}
    </div>
  );
}
