import type { ReactNode } from 'react';
import type { InversionView } from '../../../shared/schemas/inversions';
import { ms, num } from '../run/format';
import { STOP_REASON_WORDS } from './wording';
import { plural } from '../../lib/format';

type Stats = NonNullable<InversionView['stats']>;

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

/** The final fit in figures, why the inversion stopped, and where its time went. */
export function InversionSummary({ stats }: { stats: Stats }) {
  const t = stats.timings;
  return (
    <section aria-labelledby="inversion-summary-title" data-testid="inversion-summary" className="mb-8">
      <h2 id="inversion-summary-title" className="mb-3 text-xl font-semibold text-stone-900">
        How well the final model explains the picks
      </h2>
      <p className="mb-3 max-w-prose text-stone-800" data-testid="inversion-stop-reason" data-reason={stats.stopReason}>
        The inversion {STOP_REASON_WORDS[stats.stopReason]} after {stats.iterations} {stats.iterations === 1 ? 'iteration' : 'iterations'}.
        {stats.chi2 < 0.9 && ' χ² below 1 means the model follows the picks more closely than their uncertainties justify; some of its detail may be fitted noise.'}
      </p>
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-5">
        <Figure label="χ² per datum" value={num(stats.chi2)} note="about 1 is a fit within σ" testId="inversion-chi2" />
        <Figure label="RMS misfit" value={ms(stats.rms_ms)} testId="inversion-rms" />
        <Figure label="Iterations" value={stats.iterations} />
        <Figure label="Picks used" value={stats.picks} note={plural(stats.shots, 'shot')} />
        <Figure
          label="Time taken"
          value={`${num(t.total, 1)} s`}
          note={`solves and rays ${num(t.forward, 1)} s · matrix ${num(t.matrix, 1)} s · LSQR ${num(t.lsqr, 1)} s`}
        />
      </dl>
    </section>
  );
}
