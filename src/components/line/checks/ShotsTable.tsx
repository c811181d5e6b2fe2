import type { PickSetShot } from '../../../api/types';
import { shotColour } from '../plot/chartTheme';
import { DataTable, Td, Th, Tr } from '../../Table';
import { showMetres } from './numbers';

/**
 * Shots derived from the pick file, each with a checkbox that shows or hides its curve on the
 * chart (the chart legend does the same).
 */
export function ShotsTable({ shots, order, hidden, onToggle }: { shots: PickSetShot[]; order: ReadonlyMap<string, number>; hidden: ReadonlySet<string>; onToggle: (shotId: string) => void }) {
  return (
    <DataTable caption="Shots" testId="shots-table" minWidth="30rem">
      <thead>
        <tr>
          <Th>On chart</Th>
          <Th>Shot</Th>
          <Th numeric>Source x (m)</Th>
          <Th numeric>Source z (m)</Th>
          <Th numeric>Picks</Th>
        </tr>
      </thead>
      <tbody>
        {shots.map((s) => (
          <Tr key={s.shotId} testId="shot-row">
            <Td className="py-1.5">
              <input
                type="checkbox"
                checked={!hidden.has(s.shotId)}
                onChange={() => onToggle(s.shotId)}
                aria-label={`Show shot ${s.shotId} on the chart`}
                className="size-4 accent-accent-700"
              />
            </Td>
            <Td className="font-semibold">
              <span aria-hidden="true" className="mr-2 inline-block size-3 rounded-full align-middle" style={{ backgroundColor: shotColour(order.get(s.shotId) ?? 0) }} />
              {s.shotId}
            </Td>
            <Td numeric>{showMetres(s.sourceX)}</Td>
            <Td numeric>{s.sourceZ === null ? <span className="text-stone-500">on surface</span> : showMetres(s.sourceZ)}</Td>
            <Td numeric>{s.picks.toLocaleString('en-GB')}</Td>
          </Tr>
        ))}
      </tbody>
    </DataTable>
  );
}
