import type { ReciprocalPair } from '../../../../shared/qc';
import { TextField } from '../../Field';
import { DataTable, Td, Th } from '../../Table';
import { showSecondsAsMs } from './numbers';

/**
 * Reciprocal times: for shots A and B, the time from A to a receiver at B's source should equal
 * the time from B to a receiver at A's source. Pairs differing by more than the tolerance are marked.
 */
export function ReciprocalTable({ pairs, tolerance, toleranceError, onTolerance }: { pairs: readonly ReciprocalPair[]; tolerance: string; toleranceError?: string; onTolerance: (v: string) => void }) {
  const flagged = pairs.filter((p) => p.flagged).length;
  return (
    <div data-testid="reciprocal-panel">
      <div className="flex flex-wrap items-end gap-4">
        <div className="w-40">
          <TextField label="Tolerance (ms)" inputMode="decimal" value={tolerance} onChange={(e) => onTolerance(e.target.value)} error={toleranceError} data-testid="reciprocal-tolerance" />
        </div>
        <p role="status" data-testid="reciprocal-summary" className="pb-2 text-stone-700">
          {pairs.length === 0
            ? 'No reciprocal pairs: no two shots have a receiver at each other’s source position.'
            : flagged === 0
              ? `All ${pairs.length} pairs agree within the tolerance.`
              : `${flagged} of ${pairs.length} pairs differ by more than the tolerance.`}
        </p>
      </div>
      {pairs.length > 0 && (
        <div className="mt-3 max-h-96 overflow-y-auto">
          <DataTable caption="Reciprocal time pairs" testId="reciprocal-table" minWidth="34rem">
            <thead>
              <tr>
                <Th>Shots</Th>
                <Th numeric>t A→B (ms)</Th>
                <Th numeric>t B→A (ms)</Th>
                <Th numeric>|Difference| (ms)</Th>
                <Th>Status</Th>
              </tr>
            </thead>
            <tbody>
              {pairs.map((p) => (
                <tr
                  key={`${p.shotA}-${p.shotB}`}
                  data-testid="reciprocal-row"
                  data-flagged={p.flagged || undefined}
                  className={`border-b border-stone-200 last:border-b-0 ${p.flagged ? 'bg-amber-50 font-semibold text-amber-950' : 'even:bg-stone-50'}`}
                >
                  <Td className="whitespace-nowrap">
                    {p.shotA} ↔ {p.shotB}
                  </Td>
                  <Td numeric>{showSecondsAsMs(p.tAB)}</Td>
                  <Td numeric>{showSecondsAsMs(p.tBA)}</Td>
                  <Td numeric>{showSecondsAsMs(p.difference)}</Td>
                  <Td className="whitespace-nowrap">{p.flagged ? <span className="text-amber-900">Over tolerance</span> : <span className="font-normal text-stone-600">Within</span>}</Td>
                </tr>
              ))}
            </tbody>
          </DataTable>
        </div>
      )}
    </div>
  );
}
