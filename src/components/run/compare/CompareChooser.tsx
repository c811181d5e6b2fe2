import { useState } from 'react';
import { Link } from 'react-router';
import type { LineRunSummary } from '../../../api/types';
import { SelectField } from '../../Field';
import { ORDER_LABELS, ms, num, when } from '../format';

export const runLabel = (r: LineRunSummary) =>
  `${r.model.name} v${r.model.version} · ${r.pickSet.fileName} rev ${r.pickSet.revision} · ${ORDER_LABELS[r.order]} · RMS ${ms(r.rmsMs)}, χ² ${num(r.chi2)} · ${when(r.createdAt)}`;

/** Pick another finished run of the same line and open the side-by-side comparison. */
export function CompareChooser({ runId, runs }: { runId: string; runs: LineRunSummary[] }) {
  const others = runs.filter((r) => r.id !== runId && r.status === 'done');
  const [other, setOther] = useState(others[0]?.id ?? '');
  if (others.length === 0) {
    return <p className="text-stone-600">No other finished run on this line to compare with yet.</p>;
  }
  const chosen = others.some((r) => r.id === other) ? other : others[0]!.id;
  return (
    <div className="flex flex-wrap items-end gap-3" data-testid="compare-chooser">
      <div className="min-w-72 flex-1">
        <SelectField label="Compare with another run of this line" value={chosen} onChange={(e) => setOther(e.target.value)} data-testid="compare-with">
          {others.map((r) => (
            <option key={r.id} value={r.id}>
              {runLabel(r)}
            </option>
          ))}
        </SelectField>
      </div>
      <Link
        to={`/runs/${runId}/compare/${chosen}`}
        data-testid="compare-link"
        className="mb-0.5 rounded-md border border-accent-700 bg-accent-700 px-4 py-2 font-semibold text-white no-underline hover:bg-accent-800 hover:text-white"
      >
        Compare
      </Link>
    </div>
  );
}
