import { Link } from 'react-router';
import type { LineDetail, ModelVersionSummary } from '../../../api/types';
import { formatDate } from '../../../lib/format';
import { EmptyState } from '../../EmptyState';
import { Section } from '../../Section';

/** The line's saved velocity models: every version opens in the editor (read-only); a geophysicist starts new ones. */
export function ModelVersionsPanel({ line }: { line: LineDetail }) {
  const models = line.models as ModelVersionSummary[];
  const canEdit = line.myRole === 'geophysicist';
  return (
    <Section title="Velocity models" description="Each save is a new version that never changes; runs record exactly which version they used.">
      {canEdit && (
        <p className="mb-4">
          <Link to={`/lines/${line.id}/models/new`} data-testid="new-model" className="inline-block rounded-md bg-accent-700 px-4 py-2 font-semibold text-white no-underline hover:bg-accent-800">
            New model
          </Link>
        </p>
      )}
      {models.length === 0 ? (
        <EmptyState testId="models-empty" title="No velocity models saved yet">
          {canEdit ? 'Start one from the station elevations with “New model”.' : 'A geophysicist builds and saves the models of this line.'}
        </EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table data-testid="models-table" className="w-full border-collapse text-left">
            <thead className="border-b border-stone-300 bg-stone-50 text-sm text-stone-700">
              <tr>
                <th className="px-4 py-2 font-semibold">Model</th>
                <th className="px-4 py-2 text-right font-semibold">Version</th>
                <th className="px-4 py-2 font-semibold">Comment</th>
                <th className="px-4 py-2 text-right font-semibold">Grid (nodes)</th>
                <th className="px-4 py-2 font-semibold">Saved</th>
              </tr>
            </thead>
            <tbody>
              {models.map((m) => (
                <tr key={m.id} className="border-b border-stone-200 last:border-b-0 even:bg-stone-50">
                  <td className="px-4 py-2">
                    <Link to={`/models/${m.id}`}>{m.name}</Link>
                  </td>
                  <td className="px-4 py-2 text-right tabular-nums">{m.version}</td>
                  <td className="px-4 py-2 text-stone-700">{m.comment || <span className="text-stone-400">—</span>}</td>
                  <td className="px-4 py-2 text-right tabular-nums">
                    {m.nx} × {m.nz}
                  </td>
                  <td className="px-4 py-2 text-stone-700">
                    {formatDate(m.createdAt)}
                    {m.createdBy && <> · {m.createdBy.name}</>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Section>
  );
}
