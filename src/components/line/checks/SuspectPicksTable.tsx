import type { PickFlag } from '../../../../shared/qc';
import type { PickRow } from '../../../api/types';
import { DataTable, Td, Th, Tr } from '../../Table';
import { showMetres, showMs } from './numbers';
import { SUSPECT_LABELS } from './qcPicks';

/** Picks that break physical sense (too fast, too slow, time falling away from the source): places to look again, not verdicts. */
export function SuspectPicksTable({ flags, picksByIndex, onSelect, selected }: { flags: readonly PickFlag[]; picksByIndex: ReadonlyMap<number, PickRow>; onSelect?: (index: number) => void; selected: ReadonlySet<number> }) {
  if (flags.length === 0) {
    return (
      <p data-testid="suspect-none" className="rounded-lg border border-stone-200 bg-white px-5 py-4 text-stone-700">
        No suspect picks: within the picks’ uncertainty, every step between neighbouring receivers lies between 100 and 8000 m/s and times grow away from each source.
      </p>
    );
  }
  return (
    <div className="max-h-96 overflow-y-auto">
      <DataTable caption="Suspect picks" testId="suspect-table" minWidth="48rem">
        <thead>
          <tr>
            <Th numeric>File line</Th>
            <Th>Shot</Th>
            <Th numeric>Receiver x (m)</Th>
            <Th numeric>Time (ms)</Th>
            <Th>Kind</Th>
            <Th>Why</Th>
            {onSelect && (
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            )}
          </tr>
        </thead>
        <tbody>
          {flags.map((f) => {
            const p = picksByIndex.get(f.index);
            return (
              <Tr key={f.index} testId="suspect-row">
                <Td numeric className="text-stone-600">
                  {p?.line ?? '—'}
                </Td>
                <Td>{f.shotId}</Td>
                <Td numeric>{showMetres(p?.receiverX)}</Td>
                <Td numeric>{p ? showMs(p.timeMs) : '—'}</Td>
                <Td className="whitespace-nowrap font-semibold text-red-900">{SUSPECT_LABELS[f.kind]}</Td>
                <Td className="text-sm text-stone-700">{f.message}</Td>
                {onSelect && (
                  <Td>
                    <button type="button" onClick={() => onSelect(f.index)} aria-pressed={selected.has(f.index)} className="whitespace-nowrap text-sm font-semibold text-accent-700 hover:underline">
                      {selected.has(f.index) ? 'Selected' : 'Select'}
                    </button>
                  </Td>
                )}
              </Tr>
            );
          })}
        </tbody>
      </DataTable>
    </div>
  );
}
