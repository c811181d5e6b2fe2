import type { ResidualRow } from '../../../api/types';
import { Button } from '../../Button';
import { metres, ms, num, signed } from '../format';

const FLAG_WORDS: Record<string, string> = {
  excluded: 'excluded from the statistics',
  beyond_3_sigma: 'residual beyond 3σ: worth a second look at the trace',
};

/** Everything about one pick, and where to look at it next (its ray only where rays are stored: forward runs). */
export function PickDetails({ row, onShowRay, onShowInTable }: { row: ResidualRow; onShowRay?: () => void; onShowInTable: () => void }) {
  return (
    <div data-testid="pick-details" role="region" aria-label={`Pick of shot ${row.shotId} at ${metres(row.receiverX)}`} className="rounded-lg border border-stone-300 bg-white p-4">
      <h3 className="font-semibold text-stone-900">
        Shot {row.shotId}, receiver at x = {metres(row.receiverX)}
      </h3>
      <dl className="mt-2 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 tabular-nums">
        <dt className="text-stone-600">Observed</dt>
        <dd>
          {ms(row.observedMs)} ± {num(row.sigmaMs)}
        </dd>
        <dt className="text-stone-600">Computed</dt>
        <dd>{ms(row.computedMs)}</dd>
        <dt className="text-stone-600">Residual</dt>
        <dd data-testid="pick-residual" className="font-semibold">
          {signed(row.residualMs)} ms ({signed(row.normalised, 1)} σ)
        </dd>
        <dt className="text-stone-600">Receiver elevation</dt>
        <dd>{metres(row.receiverZ)}</dd>
        <dt className="text-stone-600">Pick number</dt>
        <dd>{row.pickIndex + 1} in the pick set</dd>
      </dl>
      <p className="mt-2 text-sm text-stone-700">
        {residualWords(row.residualMs, row.normalised)}
      </p>
      {row.flags.length > 0 && (
        <ul className="mt-2 list-disc pl-5 text-sm text-amber-900">
          {row.flags.map((f) => (
            <li key={f}>{FLAG_WORDS[f] ?? f}</li>
          ))}
        </ul>
      )}
      <div className="mt-3 flex flex-wrap gap-2">
        {onShowRay && (
          <Button variant="secondary" size="sm" onClick={onShowRay}>
            Show its ray in the section
          </Button>
        )}
        <Button variant="secondary" size="sm" onClick={onShowInTable}>
          Show the shot in the table
        </Button>
      </div>
    </div>
  );
}

/**
 * What a residual says about the model. Inside ±1σ the pick and the model agree within the pick's own
 * uncertainty, and nothing definite can be said; beyond it, the sign says which way the model errs
 * along this ray (common practice, no source).
 */
export function residualWords(residualMs: number, normalised: number): string {
  if (!(Math.abs(normalised) > 1)) return 'Within the pick\'s uncertainty (±1σ): the model and the pick agree here.';
  return residualMs < 0
    ? 'The pick came earlier than computed by more than its uncertainty: the model is likely too slow along this path.'
    : 'The pick came later than computed by more than its uncertainty: the model is likely too fast along this path.';
}
