/**
 * Choosing the preview's shot and what to draw, with the state of the solve and, when the shot
 * has picks, how far the model's times are from them. Says plainly that this is a forward model.
 */
import type { PickSetSummary } from '../../api/types';
import type { PreviewState } from './usePreview';
import { plural } from '../../lib/format';

export interface PreviewPanelProps {
  pickSets: PickSetSummary[];
  pickSetId: string | null;
  onPickSet: (id: string) => void;
  shots: { id: string; x: number }[];
  shotId: string | null;
  onShot: (id: string | null) => void;
  rays: boolean;
  onRays: (on: boolean) => void;
  state: PreviewState;
  placementProblem: string | null;
  /** RMS of observed − computed over the shot's picks (ms), or null. */
  rmsMs: number | null;
  picks: number;
  loadingPicks: boolean;
}

export function PreviewPanel(p: PreviewPanelProps) {
  const status = statusText(p);
  return (
    <section aria-labelledby="preview-title" data-testid="preview-panel" className="mt-4 rounded-lg border border-stone-200 bg-white p-4">
      <div className="flex flex-wrap items-end gap-x-5 gap-y-3">
        <h2 id="preview-title" className="mr-2 text-lg font-semibold text-stone-900">
          Wavefront preview
        </h2>
        {p.pickSets.length > 1 && (
          <label className="flex flex-col text-sm font-semibold text-stone-800">
            Pick set
            <select value={p.pickSetId ?? ''} onChange={(e) => p.onPickSet(e.target.value)} className="rounded-md border border-stone-300 bg-white px-2 py-1 font-normal">
              {p.pickSets.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.fileName}
                </option>
              ))}
            </select>
          </label>
        )}
        <label className="flex flex-col text-sm font-semibold text-stone-800">
          Shot
          <select
            data-testid="preview-shot"
            value={p.shotId ?? ''}
            onChange={(e) => p.onShot(e.target.value || null)}
            disabled={p.shots.length === 0}
            className="rounded-md border border-stone-300 bg-white px-2 py-1 font-normal disabled:bg-stone-100"
          >
            <option value="">no preview</option>
            {p.shots.map((s) => (
              <option key={s.id} value={s.id}>
                {s.id} at x {s.x} m
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 pb-1 text-sm font-semibold text-stone-800">
          <input type="checkbox" data-testid="preview-rays" checked={p.rays} onChange={(e) => p.onRays(e.target.checked)} className="h-4 w-4 accent-accent-700" />
          Rays to the receivers
        </label>
        <p
          data-testid="preview-status"
          data-status={p.state.status}
          data-solve-ms={p.state.field?.solveMs.toFixed(1)}
          data-contour-ms={p.state.field?.contourMs.toFixed(1)}
          role="status"
          className="pb-1 text-sm tabular-nums text-stone-700"
        >
          {status}
        </p>
      </div>
      <p className="mt-3 text-sm text-stone-600">
        Forward model only: these wavefronts are what this model predicts, not a result derived from the data. A good match to the
        picks does not make the model unique; calibrate against boreholes.
      </p>
    </section>
  );
}

function statusText(p: PreviewPanelProps): string {
  if (p.loadingPicks) return 'Loading the pick set…';
  if (p.shots.length === 0) return 'This line has no pick set yet, so there are no shots to preview.';
  if (!p.shotId) return 'Choose a shot here or click one on the section.';
  if (p.placementProblem) return p.placementProblem;
  const s = p.state;
  if (s.status === 'error') return s.message ?? 'The preview failed.';
  if (!s.field) return 'Solving…';
  const parts = [`contours every ${s.field.stepMs} ms`, `solved in ${Math.round(s.field.solveMs)} ms`];
  if (p.rmsMs !== null) parts.push(`RMS misfit to ${plural(p.picks, 'pick')} ${p.rmsMs.toFixed(2)} ms`);
  if (s.status === 'solving') parts.push(s.field && p.rays && !s.rays ? 'tracing rays…' : 'updating…');
  return parts.join(' · ');
}
