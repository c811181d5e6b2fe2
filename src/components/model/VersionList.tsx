/** Every saved version of the line's models, newest first per name, with who, when, and what it grew from. */
import { Link } from 'react-router';
import type { ModelVersionSummary } from '../../api/types';
import { formatDate } from '../../lib/format';
import { DataTable, Td, Th, Tr } from '../Table';

const timeFormat = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });
const when = (iso: string): string => {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : `${formatDate(iso)}, ${timeFormat.format(d)}`;
};

export function VersionList({ versions, lineId, currentId, canEdit }: { versions: ModelVersionSummary[]; lineId: string; currentId: string | null; canEdit: boolean }) {
  if (versions.length === 0) return <p className="text-stone-600">No saved versions yet. The first save makes version 1.</p>;
  const byId = new Map(versions.map((v) => [v.id, v]));
  return (
    <DataTable caption="Saved model versions" testId="version-list" minWidth="48rem">
      <thead>
        <tr>
          <Th>Model</Th>
          <Th numeric>Version</Th>
          <Th>Comment</Th>
          <Th>Saved by</Th>
          <Th>Saved</Th>
          <Th>Based on</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {versions.map((v) => {
          const base = v.basedOn ? byId.get(v.basedOn) : null;
          return (
            <Tr key={v.id} testId={`version-${v.name}-${v.version}`}>
              <Td>{v.name}</Td>
              <Td numeric>
                {v.version}
                {v.id === currentId && <span className="ml-2 rounded-full bg-accent-50 px-2 text-sm text-accent-800">shown</span>}
              </Td>
              <Td className="max-w-64 whitespace-pre-line text-stone-700">{v.comment || <span className="text-stone-500">—</span>}</Td>
              <Td>{v.createdBy?.name ?? 'a removed account'}</Td>
              <Td className="whitespace-nowrap">{when(v.createdAt)}</Td>
              <Td>{base ? `${base.name} v${base.version}` : v.basedOn ? 'another version' : '—'}</Td>
              <Td className="whitespace-nowrap">
                <Link to={`/models/${v.id}`}>Open</Link>
                {canEdit && (
                  <>
                    {' · '}
                    <Link to={`/lines/${lineId}/models/new?from=${v.id}`}>Start from</Link>
                  </>
                )}
              </Td>
            </Tr>
          );
        })}
      </tbody>
    </DataTable>
  );
}
