import { useState } from 'react';
import { useLineInversions } from '../../api/inversions';
import { lineModelVersions } from '../../api/models';
import { lineRuns } from '../../api/runs';
import type { LineDetail } from '../../api/types';
import { SelectField } from '../Field';
import { SectionExports } from './SectionExports';
import { useEnsembleBandColumn } from '../ensemble/useEnsembleBandColumn';

/**
 * The line's depth-to-rock table and files (issue 19 item 3) from any of its sections: a model
 * version, a finished forward run or a finished inversion, newest inversion first when there is one.
 */
export function DepthToRockTab({ line }: { line: LineDetail }) {
  const inversions = useLineInversions(line.id);
  const choices = [
    ...(inversions.data ?? []).filter((i) => i.status === 'done').map((i) => ({ key: `/api/inversions/${i.id}/export`, label: `Inversion: ${i.label || 'unnamed'}` })),
    ...lineModelVersions(line.models).map((m) => ({ key: `/api/models/${m.id}/export`, label: `Model “${m.name}” version ${m.version}` })),
    ...lineRuns(line.runs).filter((r) => r.status === 'done').map((r) => ({ key: `/api/runs/${r.id}/export`, label: `Forward run on “${r.model.name}” v${r.model.version}, ${r.createdAt.slice(0, 10)}` })),
  ];
  const [chosen, setChosen] = useState<string | null>(null);
  const base = chosen ?? choices[0]?.key ?? null;
  const band = useEnsembleBandColumn(/^\/api\/inversions\/([^/]+)\/export$/.exec(base ?? '')?.[1] ?? '');
  if (!base) return <p className="text-stone-700">No section yet: save a model version, finish a forward run or an inversion, and its depth to rock appears here.</p>;
  return (
    <div data-testid="depth-to-rock-tab">
      <div className="max-w-xl">
        <SelectField label="Section" value={base} onChange={(e) => setChosen(e.target.value)} data-testid="depth-to-rock-source">
          {choices.map((c) => (
            <option key={c.key} value={c.key}>
              {c.label}
            </option>
          ))}
        </SelectField>
      </div>
      <SectionExports key={base} base={base} band={band ?? undefined} />
    </div>
  );
}
