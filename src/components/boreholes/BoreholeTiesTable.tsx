import type { ReactNode } from 'react';
import { boreholeTies } from '../../../shared/boreholes';
import type { BoreholeView } from '../../../shared/schemas/boreholes';
import { DataTable, Td, Th, Tr } from '../Table';

/**
 * How the interpretation sits against the logs: for each contact marked top of rock (or every
 * contact of a hole with none marked), the interpreted depth at the hole and the difference
 * interpreted − logged in metres.
 */
export function BoreholeTiesTable({ holes, depthAt, surfaceName, children }: { holes: readonly BoreholeView[]; depthAt: (x: number) => number | null; surfaceName: string; children?: ReactNode }) {
  if (!holes.length) return null;
  const ties = boreholeTies(holes, depthAt);
  return (
    <section aria-label="Ties to boreholes" data-testid="borehole-ties" className="mt-3">
      <div className="mb-2 flex flex-wrap items-end justify-between gap-3">
        <p className="text-sm text-stone-700">
          Logged contacts against {surfaceName} (depth below ground; difference = interpreted − logged, m). The interpretation is non-unique between holes.
        </p>
        {children}
      </div>
      <DataTable caption="Ties of the interpretation to the boreholes" minWidth="30rem">
        <thead>
          <tr>
            <Th>Hole</Th>
            <Th numeric>x (m)</Th>
            <Th>Contact</Th>
            <Th numeric>Logged (m)</Th>
            <Th numeric>Interpreted (m)</Th>
            <Th numeric>Difference (m)</Th>
          </tr>
        </thead>
        <tbody>
          {ties.map((t, i) => (
            <Tr key={i} testId="borehole-tie">
              <Td className="font-semibold">{t.name}</Td>
              <Td numeric>{t.x}</Td>
              <Td>{t.material}</Td>
              <Td numeric>{t.contactDepth}</Td>
              <Td numeric>{t.interpretedDepth === null ? 'not reached' : t.interpretedDepth.toFixed(1)}</Td>
              <Td numeric>{t.differenceM === null ? '—' : `${t.differenceM > 0 ? '+' : ''}${t.differenceM.toFixed(1)}`}</Td>
            </Tr>
          ))}
        </tbody>
      </DataTable>
    </section>
  );
}
