import { useMemo, useState } from 'react';
import type { ResidualRow } from '../../../api/types';
import { metres, ms, signed } from '../format';
import { ColourLegend } from '../misfit/ColourLegend';
import { symmetricLimit } from '../misfit/divergingColor';
import { buildMatrix } from '../misfit/matrix';
import { MisfitGrid } from '../misfit/MisfitGrid';
import { compareResiduals, type MatchedPick } from './residualDifference';
import { plural } from '../../../lib/format';

const describe = (m: MatchedPick) =>
  `Shot ${m.shotId}, receiver ${metres(m.receiverX)}: ${m.fitChangeMs < 0 ? 'B closer to the pick' : m.fitChangeMs > 0 ? 'A closer to the pick' : 'both as close'} by ${Math.abs(m.fitChangeMs).toFixed(3)} ms (residual A ${signed(m.a.residualMs)}, B ${signed(m.b.residualMs)})`;

/**
 * Which run is closer to each pick in both runs, shots × receivers: the change in the size of the
 * residual, |B| − |A| (a change of sign alone, −0.5 → +0.2 ms, is B fitting better, not worse).
 */
export function DifferenceView({ a, b }: { a: ResidualRow[]; b: ResidualRow[] }) {
  const comparison = useMemo(() => compareResiduals(a, b), [a, b]);
  const matrix = useMemo(() => buildMatrix(comparison.matched, (m) => m.shotId, (m) => m.receiverX), [comparison]);
  const limit = useMemo(() => symmetricLimit(comparison.matched.map((m) => m.fitChangeMs), 0.01), [comparison]);
  const [selected, setSelected] = useState<MatchedPick | null>(null);

  if (comparison.matched.length === 0) {
    return <p className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-amber-900">The two runs share no pick (same shot at the same receiver position), so there is nothing to difference.</p>;
  }
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[1fr_20rem]">
      <div>
        {(comparison.onlyA > 0 || comparison.onlyB > 0) && (
          <p className="mb-2 text-sm text-stone-700">
            {plural(comparison.matched.length, 'pick')} in both runs; {comparison.onlyA} only in A and {comparison.onlyB} only in B are left out.
          </p>
        )}
        <MisfitGrid
          matrix={matrix}
          valueOf={(m) => m.fitChangeMs}
          excludedOf={(m) => m.a.excluded || m.b.excluded}
          describe={describe}
          limit={limit}
          selected={selected}
          onSelect={setSelected}
          label="Which run is closer to each pick, |residual B| − |residual A|: shots in rows, receiver positions in columns"
          testId="difference-grid"
        />
        <ColourLegend limit={limit} negative="blue: run B fits the pick better (smaller |residual|)" positive="red: run A fits the pick better" testId="difference-legend" />
      </div>
      <div>
        {selected ? (
          <div data-testid="difference-details" className="rounded-lg border border-stone-300 bg-white p-4">
            <h3 className="font-semibold text-stone-900">
              Shot {selected.shotId}, receiver at x = {metres(selected.receiverX)}
            </h3>
            <dl className="mt-2 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 tabular-nums">
              <dt className="text-stone-600">Observed</dt>
              <dd>{ms(selected.b.observedMs)}</dd>
              <dt className="text-stone-600">Computed, A</dt>
              <dd>{ms(selected.a.computedMs, 3)}</dd>
              <dt className="text-stone-600">Computed, B</dt>
              <dd>{ms(selected.b.computedMs, 3)}</dd>
              <dt className="text-stone-600">Residual A → B</dt>
              <dd>
                {signed(selected.a.residualMs)} → {signed(selected.b.residualMs)} ms
              </dd>
              <dt className="text-stone-600">|B| − |A|</dt>
              <dd className="font-semibold">{signed(selected.fitChangeMs, 3)} ms</dd>
            </dl>
            <p className="mt-2 text-sm text-stone-700">
              {Math.abs(selected.b.residualMs) < Math.abs(selected.a.residualMs) ? 'Run B explains this pick better.' : Math.abs(selected.b.residualMs) > Math.abs(selected.a.residualMs) ? 'Run A explains this pick better.' : 'Both runs explain this pick equally.'}
            </p>
          </div>
        ) : (
          <p className="rounded-lg border border-dashed border-stone-300 bg-white/60 p-4 text-stone-600">Choose a cell to see that pick in both runs.</p>
        )}
      </div>
    </div>
  );
}
