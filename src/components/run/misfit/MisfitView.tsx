import { useMemo } from 'react';
import type { ResidualRow } from '../../../api/types';
import { metres, signed } from '../format';
import { ColourLegend } from './ColourLegend';
import { symmetricLimit } from './divergingColor';
import { buildMatrix } from './matrix';
import { MisfitGrid } from './MisfitGrid';
import { PickDetails } from './PickDetails';

interface MisfitViewProps {
  rows: ResidualRow[];
  selected: ResidualRow | null;
  onSelect: (row: ResidualRow) => void;
  /** Absent where no rays are stored (inversions): the pick's details then offer no ray. */
  onShowRay?: (row: ResidualRow) => void;
  onShowInTable: (row: ResidualRow) => void;
}

const describe = (r: ResidualRow) =>
  `Shot ${r.shotId}, receiver ${metres(r.receiverX)}: residual ${signed(r.residualMs)} ms (${signed(r.normalised, 1)} σ)${r.excluded ? ', excluded' : ''}`;

/** Every pick's residual as a coloured cell, shots down, receivers across; a chosen cell opens its pick. */
export function MisfitView({ rows, selected, onSelect, onShowRay, onShowInTable }: MisfitViewProps) {
  const matrix = useMemo(() => buildMatrix(rows, (r) => r.shotId, (r) => r.receiverX), [rows]);
  const limit = useMemo(() => symmetricLimit(rows.filter((r) => !r.excluded).map((r) => r.residualMs)), [rows]);
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[1fr_20rem]">
      <div>
        <MisfitGrid
          matrix={matrix}
          valueOf={(r) => r.residualMs}
          excludedOf={(r) => r.excluded}
          describe={describe}
          limit={limit}
          selected={selected}
          onSelect={onSelect}
          label="Residual of every pick: shots in rows, receiver positions in columns"
          testId="misfit-grid"
        />
        <ColourLegend limit={limit} negative="pick earlier than computed (model too slow)" positive="pick later than computed (model too fast)" testId="misfit-legend" />
      </div>
      <div>
        {selected ? (
          <PickDetails row={selected} onShowRay={onShowRay && (() => onShowRay(selected))} onShowInTable={() => onShowInTable(selected)} />
        ) : (
          <p className="rounded-lg border border-dashed border-stone-300 bg-white/60 p-4 text-stone-600">
            Choose a cell (click it, or Tab to the grid and use the arrow keys and Enter) to see that pick.
          </p>
        )}
      </div>
    </div>
  );
}
