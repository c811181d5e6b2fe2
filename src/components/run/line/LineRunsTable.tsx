import { useEffect, useState } from 'react';
import { Link } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { queryKeys } from '../../../api/keys';
import { isRunActive, lineRuns } from '../../../api/runs';
import type { LineDetail } from '../../../api/types';
import { ORDER_LABELS, ms, num, when } from '../format';
import { RunStatusBadge } from '../RunStatusBadge';

/** How often the line is refreshed while one of its runs is still queued or running (ms). */
const LIST_POLL_MS = 1500;

/**
 * The line's runs, newest first, each linking to its results; tick two finished runs to compare them.
 * While any run is active the line is refreshed, so statuses move on their own.
 */
export function LineRunsTable({ line }: { line: Pick<LineDetail, 'id' | 'runs'> }) {
  const runs = lineRuns(line.runs);
  const queryClient = useQueryClient();
  const [chosen, setChosen] = useState<string[]>([]);
  const anyActive = runs.some((r) => isRunActive(r.status));

  useEffect(() => {
    if (!anyActive) return;
    const timer = setInterval(() => void queryClient.invalidateQueries({ queryKey: queryKeys.line(line.id) }), LIST_POLL_MS);
    return () => clearInterval(timer);
  }, [anyActive, line.id, queryClient]);

  if (runs.length === 0) return <p data-testid="line-runs-empty" className="text-stone-600">No runs on this line yet.</p>;

  const toggle = (id: string) => setChosen((c) => (c.includes(id) ? c.filter((x) => x !== id) : [...c, id].slice(-2)));
  const pair = chosen.filter((id) => runs.some((r) => r.id === id && r.status === 'done'));

  return (
    <div>
      <div className="relative overflow-x-auto rounded-lg border border-stone-200 bg-white">
        <table data-testid="line-runs" className="w-full min-w-[48rem] border-collapse text-left">
          <caption className="sr-only">Forward runs of this line, newest first</caption>
          <thead>
            <tr className="bg-stone-100 text-sm text-stone-700">
              <th scope="col" className="border-b border-stone-300 px-3 py-2">
                <span className="sr-only">Compare</span>
              </th>
              <th scope="col" className="border-b border-stone-300 px-3 py-2">Run</th>
              <th scope="col" className="border-b border-stone-300 px-3 py-2">Status</th>
              <th scope="col" className="border-b border-stone-300 px-3 py-2">Pick set</th>
              <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">RMS</th>
              <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">χ² per datum</th>
              <th scope="col" className="border-b border-stone-300 px-3 py-2">Started</th>
            </tr>
          </thead>
          <tbody>
            {runs.map((r) => (
              <tr key={r.id} data-testid="line-run-row" className="border-b border-stone-200 last:border-b-0 even:bg-stone-50">
                <td className="px-3 py-2">
                  <input
                    type="checkbox"
                    aria-label={`Compare run of ${r.model.name} v${r.model.version} started ${when(r.createdAt)}`}
                    disabled={r.status !== 'done'}
                    checked={chosen.includes(r.id)}
                    onChange={() => toggle(r.id)}
                    className="accent-accent-700"
                  />
                </td>
                <td className="px-3 py-2">
                  <Link to={`/runs/${r.id}`} className="font-semibold">
                    {r.model.name} v{r.model.version}
                  </Link>
                  <span className="text-sm text-stone-600"> · {ORDER_LABELS[r.order]}</span>
                </td>
                <td className="px-3 py-2">
                  <RunStatusBadge status={r.status} />
                  {isRunActive(r.status) && r.progress.total > 0 && (
                    <span className="ml-2 text-sm tabular-nums text-stone-600">
                      {r.progress.done}/{r.progress.total} shots
                    </span>
                  )}
                </td>
                <td className="px-3 py-2">
                  {r.pickSet.fileName} <span className="text-sm text-stone-600">rev {r.pickSet.revision}</span>
                </td>
                <td className="px-3 py-2 text-right tabular-nums">{ms(r.rmsMs)}</td>
                <td className="px-3 py-2 text-right tabular-nums">{num(r.chi2)}</td>
                <td className="px-3 py-2 text-sm">
                  {when(r.createdAt)}
                  {r.createdBy && <span className="text-stone-600"> · {r.createdBy}</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-sm text-stone-600" aria-live="polite">
        {pair.length === 2 ? (
          <Link to={`/runs/${pair[0]}/compare/${pair[1]}`} data-testid="compare-selected" className="font-semibold">
            Compare the two ticked runs
          </Link>
        ) : (
          'Tick two finished runs to compare them.'
        )}
      </p>
    </div>
  );
}
