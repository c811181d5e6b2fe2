import type { ReactNode } from 'react';
import type { RunStats } from '../../../api/types';
import { metres, ms, num, signed } from '../format';
import { misfitVerdict, type VerdictTone } from './verdict';
import { worstByRms } from './worst';
import { plural } from '../../../lib/format';

const TONE_CLASSES: Record<VerdictTone, string> = {
  good: 'border-emerald-300 bg-emerald-50 text-emerald-950',
  caution: 'border-amber-300 bg-amber-50 text-amber-950',
  poor: 'border-red-300 bg-red-50 text-red-950',
  note: 'border-sky-300 bg-sky-50 text-sky-950',
};

function Figure({ label, value, note, testId }: { label: string; value: ReactNode; note?: ReactNode; testId?: string }) {
  return (
    <div className="rounded-lg border border-stone-200 bg-white px-4 py-3">
      <dt className="text-sm text-stone-600">{label}</dt>
      <dd data-testid={testId} className="text-2xl font-semibold tabular-nums text-stone-900">
        {value}
      </dd>
      {note && <dd className="text-sm text-stone-600">{note}</dd>}
    </div>
  );
}

const linkClass = 'font-semibold text-accent-700 underline underline-offset-3 hover:text-accent-900';

/** The run's headline misfit, a verdict in plain words, and where the misfit is worst. */
export function RunSummary({ stats, onShowShot }: { stats: RunStats; onShowShot: (shotId: string) => void }) {
  const worstShots = worstByRms(stats.by_shot, 3);
  const worstReceivers = worstByRms(stats.by_receiver, 5);
  const verdict = misfitVerdict({ chi2: stats.chi2, picks: stats.picks, rmsMs: stats.rms_ms, worstShots: worstShots.map((s) => s.shotId) });
  return (
    <section aria-labelledby="run-summary-title" data-testid="run-summary" className="mb-10">
      <h2 id="run-summary-title" className="mb-3 text-xl font-semibold text-stone-900">
        How well the model explains the picks
      </h2>
      <div data-testid="run-verdict" data-tone={verdict.tone} className={`mb-4 rounded-lg border px-5 py-4 ${TONE_CLASSES[verdict.tone]}`}>
        <p className="text-lg font-semibold">{verdict.headline}</p>
        <p className="mt-1 max-w-prose">{verdict.detail}</p>
      </div>
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-6">
        <Figure label="RMS misfit" value={ms(stats.rms_ms)} testId="stat-rms" />
        <Figure label="χ² per datum" value={num(stats.chi2)} note="about 1 is a fit within σ" testId="stat-chi2" />
        <Figure label="Largest |residual|" value={ms(stats.max_abs_residual_ms)} testId="stat-max" />
        <Figure label="Mean residual" value={`${signed(stats.mean_residual_ms)} ms`} note="observed − computed" />
        <Figure label="Picks compared" value={stats.picks} note={`${plural(stats.shots, 'shot')}${stats.excluded ? `, ${stats.excluded} excluded` : ''}`} />
        <Figure label="Solve time, eikonal only" value={`${num(stats.solve_seconds, 1)} s`} note={`${stats.active_nodes.toLocaleString('en-GB')} ground nodes; the whole run took longer (header)`} />
      </dl>
      <div className="mt-4 grid grid-cols-1 gap-4 md:grid-cols-2">
        <div className="rounded-lg border border-stone-200 bg-white px-4 py-3">
          <h3 className="font-semibold text-stone-900">Worst shots</h3>
          <ol data-testid="worst-shots" className="mt-1 space-y-1">
            {worstShots.map((s) => (
              <li key={s.shotId} className="flex flex-wrap gap-x-3 tabular-nums">
                <button type="button" className={linkClass} onClick={() => onShowShot(s.shotId)}>
                  Shot {s.shotId}
                </button>
                <span>RMS {ms(s.rms_ms)}</span>
                <span>χ² {num(s.chi2)}</span>
                <span className="text-stone-600">mean {signed(s.mean_residual_ms)} ms</span>
              </li>
            ))}
          </ol>
        </div>
        <div className="rounded-lg border border-stone-200 bg-white px-4 py-3">
          <h3 className="font-semibold text-stone-900">Worst receiver positions</h3>
          <ol data-testid="worst-receivers" className="mt-1 space-y-1">
            {worstReceivers.map((r) => (
              <li key={r.receiverX} className="flex flex-wrap gap-x-3 tabular-nums">
                <span className="font-semibold">x = {metres(r.receiverX)}</span>
                <span>RMS {ms(r.rms_ms)}</span>
                <span>largest {ms(r.max_abs_residual_ms)}</span>
                <span className="text-stone-600">{plural(r.count, 'pick')}</span>
              </li>
            ))}
          </ol>
        </div>
      </div>
    </section>
  );
}
