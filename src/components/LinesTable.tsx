import { Link } from 'react-router';
import type { Line } from '../api/types';
import { formatDate } from '../lib/format';
import { DataTable, Td, Th, Tr } from './Table';

export function LinesTable({ lines }: { lines: Line[] }) {
  const sorted = [...lines].sort((a, b) => a.name.localeCompare(b.name, undefined, { numeric: true }));
  return (
    <DataTable caption="Survey lines" testId="lines-table">
      <thead>
        <tr>
          <Th>Line</Th>
          <Th>Notes</Th>
          <Th numeric>Created</Th>
        </tr>
      </thead>
      <tbody>
        {sorted.map((l) => (
          <Tr key={l.id}>
            <Td>
              <Link to={`/lines/${l.id}`} className="font-semibold">
                {l.name}
              </Link>
            </Td>
            <Td className="max-w-md text-stone-700">{l.notes ? <span className="line-clamp-2">{l.notes}</span> : <span className="text-stone-400">—</span>}</Td>
            <Td numeric className="whitespace-nowrap text-stone-600">
              {formatDate(l.createdAt)}
            </Td>
          </Tr>
        ))}
      </tbody>
    </DataTable>
  );
}
