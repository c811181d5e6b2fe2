import { Link } from 'react-router';
import type { InversionView } from '../../../shared/schemas/inversions';
import { isInversionActive } from '../../api/inversions';
import { ms, num, when } from '../run/format';
import { inversionTitle } from './InversionHeader';
import { InversionStatusBadge } from './InversionStatusBadge';

const th = 'border-b border-stone-300 px-3 py-2';

/** The line's inversions, newest first, each linking to its page; statuses move on their own while one runs. */
export function LineInversionsTable({ lineId, inversions }: { lineId: string; inversions: InversionView[] }) {
  if (inversions.length === 0) return <p data-testid="line-inversions-empty" className="text-stone-600">No inversions on this line yet.</p>;
  const rows = [...inversions].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <div className="relative overflow-x-auto rounded-lg border border-stone-200 bg-white">
      <table data-testid="line-inversions" className="w-full min-w-[44rem] border-collapse text-left">
        <caption className="sr-only">Inversions of this line, newest first</caption>
        <thead>
          <tr className="bg-stone-100 text-sm text-stone-700">
            <th scope="col" className={th}>Inversion</th>
            <th scope="col" className={th}>Status</th>
            <th scope="col" className={`${th} text-right`}>χ² per datum</th>
            <th scope="col" className={`${th} text-right`}>RMS</th>
            <th scope="col" className={`${th} text-right`}>Iterations</th>
            <th scope="col" className={th}>Started</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((inv) => (
            <tr key={inv.id} data-testid="line-inversion-row" className="border-b border-stone-200 last:border-b-0 even:bg-stone-50">
              <td className="px-3 py-2">
                <Link to={`/lines/${lineId}/inversions/${inv.id}`} className="font-semibold">
                  {inversionTitle(inv)}
                </Link>
                <span className="text-sm text-stone-600"> · {inv.start.kind === 'gradient' ? 'automatic start' : `from model v${inv.start.modelVersion ?? '?'}`}</span>
              </td>
              <td className="px-3 py-2">
                <InversionStatusBadge status={inv.status} />
                {isInversionActive(inv.status) && (
                  <span className="ml-2 text-sm tabular-nums text-stone-600">
                    {inv.progress.iteration}/{inv.progress.maxIterations}
                  </span>
                )}
              </td>
              <td className="px-3 py-2 text-right tabular-nums">{num(inv.stats?.chi2 ?? inv.history.at(-1)?.chi2)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{ms(inv.stats?.rms_ms ?? inv.history.at(-1)?.rmsMs)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{inv.stats?.iterations ?? inv.progress.iteration}</td>
              <td className="px-3 py-2 text-sm">{when(inv.createdAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
