import { Link } from 'react-router';
import { pickSetFileUrl } from '../../../api/picksets';
import type { PickSetSummary } from '../../../api/types';
import { formatDate } from '../../../lib/format';
import { DataTable, Td, Th, Tr } from '../../Table';
import { formatBytes } from './formatBytes';
import { RetirePickSet } from './RetirePickSet';

const count = (n: number) => n.toLocaleString('en-GB');

/** Every pick set stored on the line, newest first, each linking to its checks; retired ones marked, with who and why. */
export function PickSetList({ pickSets, checksHref, lineId, canRetire }: { pickSets: PickSetSummary[]; checksHref: (id: string) => string; lineId: string; canRetire: boolean }) {
  return (
    <DataTable caption="Pick sets of this line" testId="pickset-table" minWidth="52rem">
      <thead>
        <tr>
          <Th>File</Th>
          <Th>Uploaded</Th>
          <Th numeric>Shots</Th>
          <Th numeric>Picks</Th>
          <Th numeric>Revision</Th>
          <Th numeric>Excluded</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {pickSets.map((p) => (
          <Tr key={p.id} testId="pickset-row">
            <Td>
              <Link to={checksHref(p.id)} className="font-semibold break-all">
                {p.fileName}
              </Link>
              <span className="block text-sm text-stone-500">{formatBytes(p.sizeBytes)}</span>
              {p.retired && (
                <span data-testid="pickset-retired" className="mt-1 block text-sm text-amber-900">
                  <span className="rounded-sm bg-amber-100 px-1.5 font-semibold">Retired</span> {formatDate(p.retired.at)}
                  {p.retired.by ? ` by ${p.retired.by}` : ''}: {p.retired.reason}
                </span>
              )}
            </Td>
            <Td className="whitespace-nowrap">
              {p.createdBy?.name ?? "a former member"}
              <span className="block text-sm text-stone-500">{formatDate(p.createdAt)}</span>
            </Td>
            <Td numeric>{count(p.shots)}</Td>
            <Td numeric>{count(p.picks)}</Td>
            <Td numeric>{p.revision === 0 ? <span className="text-stone-500">as uploaded</span> : p.revision}</Td>
            <Td numeric>{p.excluded === 0 ? <span className="text-stone-400">0</span> : count(p.excluded)}</Td>
            <Td className="whitespace-nowrap text-sm">
              <Link to={checksHref(p.id)}>Checks</Link>
              <span className="px-2 text-stone-300" aria-hidden="true">
                |
              </span>
              <a href={pickSetFileUrl(p.id)} download={p.fileName}>
                Original file
              </a>
              {canRetire && (
                <span className="ml-3 inline-block align-middle">
                  <RetirePickSet pickSet={p} lineId={lineId} />
                </span>
              )}
            </Td>
          </Tr>
        ))}
      </tbody>
    </DataTable>
  );
}
