import type { InversionView } from '../../../shared/schemas/inversions';
import { settingsRows, startWords } from './wording';

/** Exactly what this inversion was given, as stored with it. */
export function SettingsList({ inversion }: { inversion: InversionView }) {
  const g = inversion.grid;
  const rows = [
    { label: 'Picks', value: `revision ${inversion.pickSetRevision} of the pick set` },
    { label: 'Starting model', value: startWords(inversion.start) },
    { label: 'Grid', value: `${g.nx} × ${g.nz} nodes, ${g.dx} m apart, x from ${g.x0} m, top at ${g.z0} m` },
    ...settingsRows(inversion.settings),
  ];
  return (
    <dl data-testid="inversion-settings" className="grid max-w-3xl grid-cols-1 gap-x-6 gap-y-1 rounded-lg border border-stone-200 bg-white px-5 py-4 sm:grid-cols-[max-content_1fr]">
      {rows.map((r) => (
        <div key={r.label} className="contents">
          <dt className="text-stone-600">{r.label}</dt>
          <dd className="mb-1 text-stone-900 sm:mb-0">{r.value}</dd>
        </div>
      ))}
    </dl>
  );
}
