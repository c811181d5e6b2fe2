import type { ReactNode } from 'react';
import type { LineRunSummary, RunDetail, RunStats } from '../../../api/types';
import { ORDER_LABELS, num, signed } from '../format';
import { compareShotIds } from '../table/residualFilters';

interface Side {
  run: RunDetail;
  stats: RunStats;
  summary: LineRunSummary | undefined;
}

const modelName = (s: Side) => (s.summary ? `${s.summary.model.name} v${s.summary.model.version}` : s.run.modelId.slice(0, 8));
const pickName = (s: Side) => `${s.summary?.pickSet.fileName ?? 'pick set'} rev ${s.run.pickSetRevision}`;

function Row({ label, a, b, diff }: { label: string; a: ReactNode; b: ReactNode; diff?: ReactNode }) {
  return (
    <tr className="border-b border-stone-200 last:border-b-0 even:bg-stone-50">
      <th scope="row" className="whitespace-nowrap px-3 py-2 text-left font-semibold text-stone-700">
        {label}
      </th>
      <td className="whitespace-nowrap px-3 py-2 text-right tabular-nums">{a}</td>
      <td className="whitespace-nowrap px-3 py-2 text-right tabular-nums">{b}</td>
      <td className="whitespace-nowrap px-3 py-2 text-right tabular-nums text-stone-700">{diff ?? ''}</td>
    </tr>
  );
}

const delta = (a: number, b: number, digits = 2) => signed(b - a, digits);

/** Headline statistics of two runs side by side, with B − A. */
export function CompareStats({ a, b }: { a: Side; b: Side }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
      <table data-testid="compare-stats" className="w-full min-w-[36rem] border-collapse">
        <caption className="sr-only">Statistics of run A and run B, and their difference B − A</caption>
        <thead>
          <tr className="bg-stone-100 text-sm text-stone-700">
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-left">
              &nbsp;
            </th>
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">
              Run A
            </th>
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">
              Run B
            </th>
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">
              B − A
            </th>
          </tr>
        </thead>
        <tbody>
          <Row label="Model version" a={modelName(a)} b={modelName(b)} />
          <Row label="Pick set" a={pickName(a)} b={pickName(b)} />
          <Row label="Solver" a={ORDER_LABELS[a.run.order]} b={ORDER_LABELS[b.run.order]} />
          <Row label="RMS misfit (ms)" a={num(a.stats.rms_ms)} b={num(b.stats.rms_ms)} diff={delta(a.stats.rms_ms, b.stats.rms_ms)} />
          <Row label="χ² per datum" a={num(a.stats.chi2)} b={num(b.stats.chi2)} diff={delta(a.stats.chi2, b.stats.chi2)} />
          <Row label="Largest |residual| (ms)" a={num(a.stats.max_abs_residual_ms)} b={num(b.stats.max_abs_residual_ms)} diff={delta(a.stats.max_abs_residual_ms, b.stats.max_abs_residual_ms)} />
          <Row label="Mean residual (ms)" a={signed(a.stats.mean_residual_ms)} b={signed(b.stats.mean_residual_ms)} diff={delta(a.stats.mean_residual_ms, b.stats.mean_residual_ms)} />
          <Row label="Picks compared" a={a.stats.picks} b={b.stats.picks} diff={signed(b.stats.picks - a.stats.picks, 0)} />
          <Row label="Excluded picks" a={a.stats.excluded} b={b.stats.excluded} />
          <Row label="Solve time (s)" a={num(a.stats.solve_seconds, 1)} b={num(b.stats.solve_seconds, 1)} />
        </tbody>
      </table>
    </div>
  );
}

/** RMS of each shot in both runs, so a change can be traced to the shots it comes from. */
export function CompareShots({ a, b }: { a: RunStats; b: RunStats }) {
  const byB = new Map(b.by_shot.map((s) => [s.shotId, s]));
  const shots = [...new Set([...a.by_shot.map((s) => s.shotId), ...b.by_shot.map((s) => s.shotId)])].sort(compareShotIds);
  const byA = new Map(a.by_shot.map((s) => [s.shotId, s]));
  return (
    <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
      <table data-testid="compare-shots" className="w-full min-w-[20rem] border-collapse">
        <caption className="sr-only">RMS misfit of each shot in run A and run B</caption>
        <thead>
          <tr className="bg-stone-100 text-sm text-stone-700">
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-left">
              Shot
            </th>
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">
              RMS A (ms)
            </th>
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">
              RMS B (ms)
            </th>
            <th scope="col" className="border-b border-stone-300 px-3 py-2 text-right">
              B − A
            </th>
          </tr>
        </thead>
        <tbody>
          {shots.map((id) => {
            const sa = byA.get(id);
            const sb = byB.get(id);
            return (
              <Row
                key={id}
                label={id}
                a={sa ? num(sa.rms_ms) : '–'}
                b={sb ? num(sb.rms_ms) : '–'}
                diff={sa && sb ? delta(sa.rms_ms, sb.rms_ms) : ''}
              />
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
