import { useState } from 'react';
import { Link } from 'react-router';
import { lineRuns } from '../../api/runs';
import type { LineDetail } from '../../api/types';
import type { InversionView } from '../../../shared/schemas/inversions';
import { SelectField } from '../Field';
import { runLabel } from '../run/compare/CompareChooser';
import { ms, num } from '../run/format';
import { inversionTitle } from './InversionHeader';

/** "inv:<id>" or "run:<id>": what the comparison page puts beside an inversion. */
export type CompareTarget = { kind: 'inversion' | 'run'; id: string };

export const compareParam = (t: CompareTarget) => `${t.kind === 'inversion' ? 'inv' : 'run'}:${t.id}`;

export function parseCompareParam(text: string | null): CompareTarget | null {
  const m = /^(inv|run):([0-9A-Za-z-]{1,64})$/.exec(text ?? '');
  return m ? { kind: m[1] === 'inv' ? 'inversion' : 'run', id: m[2]! } : null;
}

export const inversionLabel = (i: InversionView) =>
  `${inversionTitle(i)} · χ² ${num(i.stats?.chi2)}, RMS ${ms(i.stats?.rms_ms)}${i.stats ? ` · ${i.stats.iterations} iterations` : ''}`;

/** Pick another finished inversion, or a finished forward run, of the same line and open them side by side. */
export function CompareWithChooser({ inversion, inversions, line }: { inversion: InversionView; inversions: InversionView[]; line: LineDetail }) {
  const others = inversions.filter((i) => i.id !== inversion.id && i.status === 'done');
  const runs = lineRuns(line.runs).filter((r) => r.status === 'done');
  const options: { value: string; label: string; group: 'inv' | 'run' }[] = [
    ...others.map((i) => ({ value: compareParam({ kind: 'inversion', id: i.id }), label: inversionLabel(i), group: 'inv' as const })),
    ...runs.map((r) => ({ value: compareParam({ kind: 'run', id: r.id }), label: runLabel(r), group: 'run' as const })),
  ];
  const [chosen, setChosen] = useState(options[0]?.value ?? '');
  if (options.length === 0) return <p className="text-stone-600">No other finished inversion or forward run on this line to compare with yet.</p>;
  const value = options.some((o) => o.value === chosen) ? chosen : options[0]!.value;
  return (
    <div className="flex flex-wrap items-end gap-3" data-testid="inversion-compare-chooser">
      <div className="min-w-72 flex-1">
        <SelectField label="Compare with another inversion or a forward run of this line" value={value} onChange={(e) => setChosen(e.target.value)} data-testid="inversion-compare-with">
          {others.length > 0 && (
            <optgroup label="Inversions">
              {options.filter((o) => o.group === 'inv').map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </optgroup>
          )}
          {runs.length > 0 && (
            <optgroup label="Forward runs">
              {options.filter((o) => o.group === 'run').map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </optgroup>
          )}
        </SelectField>
      </div>
      <Link
        to={`/lines/${inversion.lineId}/inversions/${inversion.id}/compare?with=${encodeURIComponent(value)}`}
        data-testid="inversion-compare-link"
        className="mb-0.5 rounded-md border border-accent-700 bg-accent-700 px-4 py-2 font-semibold text-white no-underline hover:bg-accent-800 hover:text-white"
      >
        Compare side by side
      </Link>
    </div>
  );
}
